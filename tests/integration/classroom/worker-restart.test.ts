// A verification job interrupted by killing its worker completes after a worker starts again
// (issue 6, "Tests"). This file runs its own worker processes (worker.ts, as `npm start` runs it)
// on queues of their own (LOOPWRIGHT_QUEUE_PREFIX), so the test runner's worker never takes the
// job. The attempt's drill is a 3 h run of the nonlinear-loss cabinet, whose replay takes seconds,
// so the job is still running when the worker is killed (SIGKILL: no chance to hand it back).
// pg-boss then expires the job after its expiry (fixed here at 20 s through LOOPWRIGHT_JOB_EXPIRY_S,
// the operator's override) and retries it; the result write is idempotent. At-least-once delivery
// with expiry and retry is pg-boss's documented model (pg-boss 10 README, from memory).
import { spawn, type ChildProcess } from "node:child_process";
import { eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, expect, it } from "vitest";
import { startAttempt, submitAttempt } from "@/app/_lib/classroom/attempts";
import { getDb } from "@/db/client";
import { attempts } from "@/db/schema";
import { assign, classroom, publishedDrill } from "./world";

process.env.LOOPWRIGHT_QUEUE_PREFIX = `restart-test-${Date.now().toString(36)}-`;
process.env.LOOPWRIGHT_JOB_EXPIRY_S = "20";

const workers: ChildProcess[] = [];
function startWorker(): ChildProcess {
  const child = spawn("npx", ["tsx", "worker.ts"], {
    env: { ...process.env, LOOPWRIGHT_QUEUE_MAINTENANCE_S: "1" },
    stdio: ["ignore", "inherit", "inherit"],
    detached: true,
  });
  workers.push(child);
  return child;
}
const kill = (c: ChildProcess, signal: NodeJS.Signals) => {
  try {
    process.kill(-c.pid!, signal);
  } catch {
    /* gone */
  }
};

afterAll(() => workers.forEach((w) => kill(w, "SIGKILL")));

async function jobState(attemptId: string): Promise<{ state: string; retry_count: number } | null> {
  const rows = await getDb().execute<{ state: string; retry_count: number }>(sql`select state, retry_count from pgboss.job where singleton_key = ${attemptId} order by created_on desc limit 1`);
  return rows[0] ?? null;
}

async function until<T>(what: string, timeoutMs: number, probe: () => Promise<T | null | undefined | false>): Promise<T> {
  const t0 = Date.now();
  while (Date.now() - t0 < timeoutMs) {
    const v = await probe();
    if (v) return v;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`timed out waiting for ${what}`);
}

let attemptId = "";

beforeAll(async () => {
  const w = await classroom(["Petra Quill"]);
  const { drill, drillId } = await publishedDrill(w.instructor, {
    ...w.drill,
    title: "Three hours on the nonlinear cabinet",
    plant: { kind: "preset", presetId: "benchtop-curing-cabinet", lossModel: "nonlinear" },
    durationS: 3 * 3600,
    referenceTuning: { ...w.drill.referenceTuning, sampleTimeS: 0.1 },
  });
  const { id } = await assign(w.instructor, w.cohort.id, drillId);
  const a = await startAttempt(w.trainees[0], id);
  attemptId = a.attemptId;
  // the claim does not matter here (the test is about the job); the replay alone takes seconds
  await submitAttempt(w.trainees[0], { attemptId: a.attemptId, submissionKey: crypto.randomUUID(), controller: drill.referenceTuning, actionLog: [], claimed: { score: 50, results: {} } });
}, 120_000);

it("completes a job whose worker was killed mid-replay, after a worker starts again", async () => {
  const first = startWorker();
  await until("the job to start", 60_000, async () => (await jobState(attemptId))?.state === "active");
  await new Promise((r) => setTimeout(r, 500));
  kill(first, "SIGKILL");
  const [mid] = await getDb().select().from(attempts).where(eq(attempts.id, attemptId));
  expect(mid.status).toBe("submitted");

  startWorker();
  const done = await until("the attempt to be verified", 120_000, async () => {
    const [row] = await getDb().select().from(attempts).where(eq(attempts.id, attemptId));
    return row.status === "verified" ? row : null;
  });
  expect(done.score).not.toBeNull();
  expect(done.verifyRuns).toBe(1);
  // the job ran again: pg-boss counted a retry after the expiry
  const job = await jobState(attemptId);
  expect(job?.retry_count ?? 0).toBeGreaterThanOrEqual(1);
}, 200_000);
