// The production server: `npm start` runs it after `next build`. A small custom server around
// Next's request handler, because sign-in rate limiting needs the real peer address: it is written
// into a private header here (any inbound copy is dropped), so a client cannot choose its own.
// With --mail-catcher it also runs the local SMTP catcher; with --mailbox it enables the admins'
// mailbox page. Both are for local and demo installations. With --worker it also runs the queue
// worker (worker.ts) as a child process of its own, restarted if it exits.
import nextEnv from "@next/env";
import { spawn } from "node:child_process";
import { setPriority } from "node:os";
import { createServer } from "node:http";
import next from "next";
import { ensureLocalDatabase } from "./db/local-postgres";
import { startMailCatcher } from "./app/_lib/mail-catcher";

const PEER_HEADER = "x-loopwright-peer"; // read by app/_lib/client-address.ts
const WORKER_NICENESS = 10;

async function main() {
  const root = process.cwd();
  nextEnv.loadEnvConfig(root, false);
  const args = new Set(process.argv.slice(2));
  const port = Number(process.env.PORT ?? 3000);
  const hostname = process.env.HOST ?? "127.0.0.1";

  const { url } = await ensureLocalDatabase();
  process.env.DATABASE_URL = url;
  process.env.APP_URL ??= `http://${hostname}:${port}`;

  if (args.has("--mail-catcher")) {
    const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
    process.env.SMTP_HOST = "127.0.0.1";
    process.env.SMTP_PORT = String(smtpPort);
    await startMailCatcher({ port: smtpPort, databaseUrl: url });
    console.log(`[mail] catching mail on smtp://127.0.0.1:${smtpPort}`);
  }
  if (args.has("--mailbox")) process.env.MAILBOX_ENABLED = "true";

  if (args.has("--worker")) superviseWorker(root);

  const app = next({ dev: false, dir: root, hostname, port });
  await app.prepare();
  const handle = app.getRequestHandler();
  createServer((req, res) => {
    delete req.headers[PEER_HEADER];
    req.headers[PEER_HEADER] = req.socket.remoteAddress ?? "unknown-peer";
    void handle(req, res);
  }).listen(port, hostname, () => {
    console.log(`[app] Loopwright on ${process.env.APP_URL}${process.env.MAILBOX_ENABLED === "true" ? ` (mailbox: ${process.env.APP_URL}/admin/mailbox)` : ""}`);
  });
}

/** Runs worker.ts in its own process (same Node and loader flags), restarting it after a crash. */
function superviseWorker(root: string) {
  let stopping = false;
  let restarts = 0;
  const start = () => {
    const child = spawn(process.execPath, [...process.execArgv, "worker.ts"], { cwd: root, env: process.env, stdio: "inherit" });
    // replays are background work: the web server keeps the CPU first when both want it
    if (child.pid) {
      try {
        setPriority(child.pid, WORKER_NICENESS);
      } catch {
        /* not permitted here: the worker runs at normal priority */
      }
    }
    child.on("exit", (code, signal) => {
      if (stopping) return;
      restarts++;
      const delay = Math.min(30_000, 1000 * restarts);
      console.error(`[worker] exited (${signal ?? code}); restarting in ${delay / 1000} s`);
      setTimeout(start, delay);
    });
    const stop = () => {
      stopping = true;
      child.kill("SIGTERM");
    };
    process.once("SIGTERM", () => (stop(), process.exit(0)));
    process.once("SIGINT", () => (stop(), process.exit(0)));
  };
  start();
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
