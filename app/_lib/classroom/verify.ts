// Verification of a submitted attempt: the server never trusts the browser's numbers. The attempt
// is replayed with the same sim/ code, the drill version it ran, the seed the server issued and
// the logged actions; the replay's results become the official ones, with the engine version and
// the trace fingerprint. The browser's claim is only compared (sim/drill/claim-check.ts) and a
// disagreement beyond the stated tolerance flags the attempt for the instructor.
//
// Idempotent: the write only moves a row from "submitted" to "verified"/"failed" (or rewrites the
// same values when a job is delivered again), so pg-boss's at-least-once delivery is safe. Runs in
// the worker process (worker.ts), never in the web server.
import { and, eq, inArray, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { assignments, attempts, drillVersions } from "@/db/schema";
import { checkClaim } from "@/sim/drill/claim-check";
import { ENGINE_VERSION } from "@/sim/version";
import { replayAttempt, type OfficialVerification } from "@/sim/drill/verify-attempt";

export { replayAttempt, type OfficialVerification };

/** The columns of an attempt row that only the replay writes (standings read the summary ones). */
export function officialColumns(official: OfficialVerification) {
  const s = official.summary;
  return {
    status: "verified" as const,
    engineVersion: official.engineVersion,
    officialFingerprint: official.fingerprint,
    officialResults: official.results as unknown as Record<string, unknown>,
    officialScoreDetail: { score: official.score, windows: official.windows } as unknown as Record<string, unknown>,
    score: s.score,
    rawScore: s.rawScore,
    settlingTimeS: s.settlingTimeS,
    overshootC: s.overshootC,
    iae: s.iae,
    recoveryTimeS: s.recoveryTimeS,
    energyKWh: s.energyKWh,
    safetyTrips: s.safetyTrips,
    violations: official.violations,
  };
}

export function latePenaltyFactor(a: { late: boolean }, assignment: { lateRule: string; latePenaltyPercent: number }): number {
  return a.late && assignment.lateRule === "accept-penalty" ? 1 - assignment.latePenaltyPercent / 100 : 1;
}

export type VerifyOutcome = { state: "verified"; official: OfficialVerification; flagged: boolean } | { state: "failed"; reason: string } | { state: "skipped"; reason: string };

/** Replays one attempt and writes its official results (the queue job's body). */
export async function verifyAttempt(attemptId: string): Promise<VerifyOutcome> {
  const db = getDb();
  const [row] = await db
    .select({ attempt: attempts, document: drillVersions.document, lateRule: assignments.lateRule, latePenaltyPercent: assignments.latePenaltyPercent })
    .from(attempts)
    .innerJoin(drillVersions, eq(drillVersions.id, attempts.drillVersionId))
    .innerJoin(assignments, eq(assignments.id, attempts.assignmentId))
    .where(eq(attempts.id, attemptId));
  if (!row) return { state: "skipped", reason: "no such attempt" };
  const a = row.attempt;
  if (a.status === "started") return { state: "skipped", reason: "not submitted" };

  let official: OfficialVerification;
  try {
    official = replayAttempt({ drill: row.document, controller: a.controller, actionLog: a.actionLog, seed: a.seed, latePenaltyFactor: latePenaltyFactor(a, row) });
  } catch (err) {
    // a submission the engine cannot replay (it passed validation, so this is an engine refusal)
    const reason = `The replay failed: ${err instanceof Error ? err.message : String(err)}`;
    await db
      .update(attempts)
      .set({ status: "failed", failureReason: reason, verifiedAt: new Date(), engineVersion: ENGINE_VERSION, verifyRuns: a.verifyRuns + 1 })
      .where(and(eq(attempts.id, a.id), inArray(attempts.status, ["submitted", "failed"])));
    return { state: "failed", reason };
  }

  const claim = checkClaim(
    { score: a.claimedScore ?? Number.NaN, fingerprint: a.claimedFingerprint ?? undefined, results: a.claimedResults ?? undefined },
    { score: official.score.score, fingerprint: official.fingerprint, windows: official.score.windows.map((w) => ({ id: w.id, score: w.score })) },
  );
  const flagged = !claim.ok;
  await db
    .update(attempts)
    .set({ ...officialColumns(official), verifiedAt: a.verifiedAt ?? new Date(), flagged, flagReason: claim.ok ? null : claim.reason, failureReason: null, verifyRuns: a.verifyRuns + 1 })
    // idempotent: a second delivery rewrites the same values; a started attempt is never touched
    .where(and(eq(attempts.id, a.id), inArray(attempts.status, ["submitted", "verified"])));
  return { state: "verified", official, flagged };
}

/**
 * Submitted attempts older than `olderThanS` that have no queue job at all (none waiting, running,
 * failed or archived, in any installation's queue): their web server stopped between the commit and
 * the send. The worker's sweep queues them.
 */
export async function unverifiedAttemptIds(olderThanS: number, limit = 500): Promise<{ id: string; document: unknown }[]> {
  const rows = await getDb().execute<{ id: string; document: unknown }>(sql`
    select t.id, v.document from attempts t join drill_versions v on v.id = t.drill_version_id
    where t.status = 'submitted' and t.submitted_at < now() - make_interval(secs => ${olderThanS})
      and not exists (select 1 from pgboss.job j where j.singleton_key = t.id::text)
      and not exists (select 1 from pgboss.archive j where j.singleton_key = t.id::text)
    limit ${limit}`);
  return [...rows];
}
