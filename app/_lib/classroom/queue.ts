// The job queue on PostgreSQL (pg-boss 10): the web server only sends jobs; the worker process
// (worker.ts) serves them, so a replay never blocks a request. Two queues:
//   attempt-verify   — replay a submitted attempt and write its official results (verify.ts)
//   assignment-opens — e-mail the cohort when an assignment opens (notices.ts)
// Both jobs are idempotent (the write checks the row's state), so pg-boss's at-least-once
// delivery, retries and expiry are safe: a job cut off by a worker restart expires and runs again.
import PgBoss from "pg-boss";
import type { Drill } from "@/sim/drill/schema";

/** LOOPWRIGHT_QUEUE_PREFIX separates installations sharing a database (and lets a test run its own worker). */
const prefix = () => process.env.LOOPWRIGHT_QUEUE_PREFIX ?? "";
export const verifyQueue = () => `${prefix()}attempt-verify`;
export const openNoticeQueue = () => `${prefix()}assignment-opens`;

export interface VerifyJob {
  attemptId: string;
}
export interface OpenNoticeJob {
  assignmentId: string;
}

/**
 * Conservative simulated seconds per wall second of one replay on a loaded 2-core machine, per
 * integrator: `npm run perf` measured about 400 000 (exact), 108 000 (RK4) and 6 700 (nonlinear,
 * odex) here; these divide those by about eight for headroom.
 */
const REPLAY_SPEED = { exact: 50_000, rk4: 15_000, nonlinear: 800 } as const;
/** The expiry is this multiple of the estimated replay (attempt and reference run), at least the floor. */
export const EXPIRY_MULTIPLE = 3;
export const EXPIRY_FLOOR_S = 15;

/** Estimated wall time of a verification: the attempt and the reference run of the drill. */
export function estimatedReplayS(drill: Drill): number {
  const nonlinear = drill.plant.kind === "preset" ? drill.plant.lossModel === "nonlinear" : drill.plant.kind === "enclosure" && (drill.plant as { lossModel?: string }).lossModel === "nonlinear";
  const speed = nonlinear ? REPLAY_SPEED.nonlinear : REPLAY_SPEED.exact;
  return (2 * drill.durationS) / speed;
}

/** pg-boss expiry of a verification job: a small multiple of the longest replay it can be. */
export function verifyExpirySeconds(drill: Drill): number {
  // an operator (or a test) may fix it instead
  const fixed = Number(process.env.LOOPWRIGHT_JOB_EXPIRY_S);
  if (Number.isFinite(fixed) && fixed > 0) return fixed;
  return Math.max(EXPIRY_FLOOR_S, Math.ceil(EXPIRY_MULTIPLE * estimatedReplayS(drill)));
}

const globalForBoss = globalThis as unknown as { loopwrightBoss?: Promise<PgBoss> };

/** Options for a sender (web server) or the worker; maintenance expires stuck jobs promptly. */
export function bossOptions(url: string, role: "sender" | "worker"): PgBoss.ConstructorOptions {
  return {
    connectionString: url,
    max: role === "sender" ? 2 : 4,
    // the worker supervises (expires jobs whose worker died, archives old ones); senders need not
    supervise: role === "worker",
    maintenanceIntervalSeconds: Number(process.env.LOOPWRIGHT_QUEUE_MAINTENANCE_S ?? 5),
    // jobs and queues are created by whichever process starts first
    migrate: true,
  };
}

export async function createQueues(boss: PgBoss): Promise<void> {
  // "short": at most one waiting job per key (the attempt or assignment id), so a repeated send is a no-op.
  // Retries: a replay that fails for a transient reason (database restart) runs again;
  // one that fails deterministically is recorded as failed by the job itself
  await boss.createQueue(verifyQueue(), { name: verifyQueue(), policy: "short", retryLimit: 5, retryDelay: 2, expireInSeconds: EXPIRY_FLOOR_S });
  await boss.createQueue(openNoticeQueue(), { name: openNoticeQueue(), policy: "short", retryLimit: 10, retryDelay: 30, retryBackoff: true, expireInSeconds: 300 });
}

/** The sending side's pg-boss, started once per process. */
export function sender(): Promise<PgBoss> {
  globalForBoss.loopwrightBoss ??= (async () => {
    const url = process.env.DATABASE_URL;
    if (!url) throw new Error("DATABASE_URL is not set");
    const boss = new PgBoss(bossOptions(url, "sender"));
    boss.on("error", (err) => console.error("[queue]", err instanceof Error ? err.message : err));
    await boss.start();
    await createQueues(boss);
    return boss;
  })().catch((err) => {
    globalForBoss.loopwrightBoss = undefined;
    throw err;
  });
  return globalForBoss.loopwrightBoss;
}

/** Queues the replay of a submitted attempt; a second send for the same attempt is a no-op while one waits. */
export async function enqueueVerification(attemptId: string, drill: Drill): Promise<void> {
  const boss = await sender();
  await boss.send(verifyQueue(), { attemptId } satisfies VerifyJob, { singletonKey: attemptId, expireInSeconds: verifyExpirySeconds(drill) });
}

export async function enqueueOpenNotice(assignmentId: string, opensAt: Date): Promise<void> {
  const boss = await sender();
  await boss.send(openNoticeQueue(), { assignmentId } satisfies OpenNoticeJob, { singletonKey: assignmentId, startAfter: opensAt });
}
