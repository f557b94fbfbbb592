// `npm test`: the whole suite on a fresh machine. Starts (or reuses) the project's PostgreSQL,
// creates a throwaway database for this run, builds the production app, serves it with its mail
// catcher on free loopback ports, runs every Vitest project against them, then drops the
// database. Debian's chromium is installed with apt-get when missing (never a browser download).
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { existsSync } from "node:fs";
import { createServer } from "node:net";
import { applyMigrations } from "../db/migrate";
import { createDatabaseIfMissing, dropDatabase, ensureLocalDatabase } from "../db/local-postgres";
import { seedDemo } from "../db/seed";

const CHROMIUM = "/usr/bin/chromium";

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => resolve(port));
    });
  });
}

function ensureChromium() {
  if (existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) throw new Error(`${CHROMIUM} is missing: install Debian's chromium package (sudo apt-get install -y chromium).`);
  console.log("[tests] installing Debian's chromium with apt-get");
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  execFileSync("apt-get", ["update", "-q"], { stdio: "inherit", env });
  execFileSync("apt-get", ["install", "-y", "-q", "chromium"], { stdio: "inherit", env });
}

async function waitForHttp(url: string, child: ChildProcess, timeoutMs = 60_000) {
  const started = Date.now();
  while (Date.now() - started < timeoutMs) {
    if (child.exitCode !== null) throw new Error(`the app exited with code ${child.exitCode} before it answered`);
    try {
      const res = await fetch(url, { redirect: "manual" });
      if (res.status < 500) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`the app did not answer on ${url} within ${timeoutMs / 1000} s`);
}

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { stdio: "inherit", env });
    child.on("exit", (code) => resolve(code ?? 1));
  });
}

async function main() {
  const { url: mainUrl } = await ensureLocalDatabase();
  const testDb = `loopwright_test_${randomBytes(4).toString("hex")}`;
  const adminUrl = mainUrl.replace(/\/[^/?]+(\?|$)/, "/postgres$1");
  const testUrl = mainUrl.replace(/\/[^/?]+(\?|$)/, `/${testDb}$1`);
  await createDatabaseIfMissing(adminUrl, testDb);
  console.log(`[tests] throwaway database ${testDb}`);
  let app: ChildProcess | null = null;
  let exitCode = 1;
  try {
    await applyMigrations(testUrl);
    await seedDemo(testUrl);
    ensureChromium();

    const env: NodeJS.ProcessEnv = { ...process.env, DATABASE_URL: testUrl, NEXT_TELEMETRY_DISABLED: "1" };
    if (process.env.LOOPWRIGHT_SKIP_TYPECHECK !== "1") {
      console.log("[tests] type-checking the project (tsc --noEmit)");
      if ((await run("npx", ["tsc", "--noEmit"], env)) !== 0) throw new Error("type errors: see above");
    }
    env.LOOPWRIGHT_TYPECHECKED = "1";
    if ((await run("npx", ["next", "build"], env)) !== 0) throw new Error("next build failed");

    const [port, smtpPort] = [await freePort(), await freePort()];
    const baseUrl = `http://127.0.0.1:${port}`;
    Object.assign(env, { PORT: String(port), SMTP_PORT: String(smtpPort), SMTP_HOST: "127.0.0.1", APP_URL: baseUrl, MAILBOX_ENABLED: "true" });
    // --worker: the queue worker (attempt replays, notices) runs beside the app, as under npm start
    app = spawn("npx", ["tsx", "server.ts", "--mail-catcher", "--mailbox", "--worker"], { stdio: ["ignore", "inherit", "inherit"], env, detached: true });
    await waitForHttp(`${baseUrl}/sign-in`, app);

    exitCode = await run("npx", ["vitest", "run", ...process.argv.slice(2)], { ...env, E2E_BASE_URL: baseUrl, CHROMIUM_PATH: CHROMIUM });
  } finally {
    if (app?.pid) {
      try {
        process.kill(-app.pid, "SIGTERM");
      } catch {
        /* already gone */
      }
      await new Promise((r) => setTimeout(r, 500));
    }
    await dropDatabase(adminUrl, testDb).catch((err) => console.error(`[tests] could not drop ${testDb}: ${err}`));
  }
  process.exit(exitCode);
}

main().catch((err) => {
  console.error(err instanceof Error ? err.stack : err);
  process.exit(1);
});
