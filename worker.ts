// The classroom's queue worker: a process of its own, so replays never block the web server.
// `npm start` runs it beside the app (server.ts --worker supervises it and restarts it if it
// dies); the tests start it themselves. It serves two pg-boss queues (app/_lib/classroom/queue.ts):
// attempt verification (replay + official results) and the assignment-open e-mail. Every few
// seconds pg-boss's maintenance expires jobs whose worker died, and they run again here; a sweep
// re-queues submitted attempts whose job was never sent (a web server that stopped between its
// commit and the send).
import nextEnv from "@next/env";
import PgBoss from "pg-boss";
import { ensureLocalDatabase } from "./db/local-postgres";
import { openNoticeQueue, verifyQueue, bossOptions, createQueues, verifyExpirySeconds, type OpenNoticeJob, type VerifyJob } from "./app/_lib/classroom/queue";
import { unverifiedAttemptIds, verifyAttempt } from "./app/_lib/classroom/verify";
import { sendOpenNotice } from "./app/_lib/classroom/notices";
import { drillSchema } from "./sim/drill/schema";

const SWEEP_EVERY_MS = 30_000;
const VERIFY_BATCH = 10;
const SWEEP_OLDER_THAN_S = 60;

async function main() {
  nextEnv.loadEnvConfig(process.cwd(), false);
  if (!process.env.DATABASE_URL) process.env.DATABASE_URL = (await ensureLocalDatabase()).url;
  const url = process.env.DATABASE_URL;
  const boss = new PgBoss(bossOptions(url, "worker"));
  boss.on("error", (err) => console.error("[worker]", err instanceof Error ? err.message : err));
  await boss.start();
  await createQueues(boss);

  // pg-boss waits its polling interval between fetches, so a worker takes up to VERIFY_BATCH jobs
  // a fetch and replays them one after another (one CPU per worker process). A job that throws is
  // failed on its own (and retried); the others of the batch complete.
  const queue = verifyQueue();
  await boss.work<VerifyJob>(queue, { batchSize: VERIFY_BATCH, pollingIntervalSeconds: 0.5 }, async (jobs) => {
    for (const job of jobs) {
      const t0 = performance.now();
      try {
        const outcome = await verifyAttempt(job.data.attemptId);
        const ms = (performance.now() - t0).toFixed(0);
        console.log(`[worker] attempt ${job.data.attemptId}: ${outcome.state}${outcome.state === "verified" && outcome.flagged ? " (flagged)" : ""} in ${ms} ms`);
      } catch (err) {
        console.error(`[worker] attempt ${job.data.attemptId}:`, err instanceof Error ? err.message : err);
        await boss.fail(queue, job.id, { message: err instanceof Error ? err.message : String(err) });
      }
    }
  });
  await boss.work<OpenNoticeJob>(openNoticeQueue(), { batchSize: 1, pollingIntervalSeconds: 2 }, async ([job]) => {
    const r = await sendOpenNotice(job.data.assignmentId);
    console.log(`[worker] assignment ${job.data.assignmentId} open notice: ${r.sent} sent${r.skipped ? ` (${r.skipped})` : ""}`);
  });

  const sweep = async () => {
    try {
      for (const a of await unverifiedAttemptIds(SWEEP_OLDER_THAN_S)) {
        await boss.send(verifyQueue(), { attemptId: a.id } satisfies VerifyJob, { singletonKey: a.id, expireInSeconds: verifyExpirySeconds(drillSchema.parse(a.document)) });
      }
    } catch (err) {
      console.error("[worker] sweep:", err instanceof Error ? err.message : err);
    }
  };
  const timer = setInterval(sweep, SWEEP_EVERY_MS);
  console.log(`[worker] serving ${verifyQueue()} and ${openNoticeQueue()} (pid ${process.pid})`);

  const stop = async () => {
    clearInterval(timer);
    await boss.stop({ graceful: true, timeout: 10_000 });
    process.exit(0);
  };
  process.on("SIGTERM", stop);
  process.on("SIGINT", stop);
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
