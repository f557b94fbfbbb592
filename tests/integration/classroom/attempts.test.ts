// Assignments and attempts against the real test database and the real queue worker (started by
// tests/run-all.ts beside the app): assignment validation writing nothing, attempts counted when
// they start (also under concurrent starts), idempotent submission, a tampered claim re-scored by
// replay and flagged, an honest claim verified unflagged, the same attempt verified twice with
// identical results, a drill version in use that cannot change, and the late rule.
// The behaviours are the (issue 6, "Attempts"); "never trust the client" and idempotent
// retries are common practice for web APIs (OWASP, and e.g. the IETF Idempotency-Key draft, from
// memory). The replay is the engine's own runDrill, so "the same inputs give the same trace" is
// the engine's determinism contract (sim/drill/run-drill.ts).
import { count, eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { ActionRefused } from "@/app/_lib/action";
import { startAttempt, submitAttempt } from "@/app/_lib/classroom/attempts";
import { replayAttempt, verifyAttempt } from "@/app/_lib/classroom/verify";
import { getDb } from "@/db/client";
import { assignments, attempts, drillVersions } from "@/db/schema";
import { CLAIM_TOLERANCE } from "@/sim/drill/claim-check";
import { dbRefusal } from "../helpers";
import { assign, classroom, honestSubmission, waitForVerification } from "./world";

const db = () => getDb();
type World = Awaited<ReturnType<typeof classroom>>;
let w: World;

beforeAll(async () => {
  w = await classroom();
});

const tableCounts = async () => {
  const [a] = await db().select({ n: count() }).from(assignments);
  const [t] = await db().select({ n: count() }).from(attempts);
  return { assignments: a.n, attempts: t.n };
};

describe("assigning a drill version", () => {
  it("refuses bad input with a clear message and writes nothing", async () => {
    const before = await tableCounts();
    const bad = async (patch: Record<string, unknown>, message: RegExp) => {
      await expect(
        (async () => {
          const { createAssignment } = await import("@/app/_lib/classroom/assignments");
          await createAssignment(w.instructor, { cohortId: w.cohort.id, drillId: w.drillId, version: 1, opensAt: "2027-01-04T09:00", dueAt: "2027-01-11T17:00", attemptLimit: 3, lateRule: "accept-marked", latePenaltyPercent: 0, visibility: "initials", ...patch });
        })(),
      ).rejects.toThrow(message);
    };
    await bad({ dueAt: "2027-01-04T08:00" }, /due date must be after/);
    await bad({ attemptLimit: 0 }, /at least one attempt/);
    await bad({ attemptLimit: 51 }, /At most 50/);
    await bad({ opensAt: "2027-02-30T09:00" }, /does not exist/);
    await bad({ opensAt: "next tuesday" }, /Enter a date and time/);
    await bad({ version: 2 }, /drill version does not exist/);
    await bad({ lateRule: "accept-penalty", latePenaltyPercent: 0 }, /late penalty/);
    expect(await tableCounts()).toEqual(before);
  });

  it("refuses a draft version (the domain rule, and the trigger of migration 0003 below it)", async () => {
    const { newDraftFromPublished } = await import("@/app/_lib/drills");
    await newDraftFromPublished(w.instructor, w.drillId);
    const { createAssignment } = await import("@/app/_lib/classroom/assignments");
    await expect(createAssignment(w.instructor, { cohortId: w.cohort.id, drillId: w.drillId, version: 2, opensAt: "2027-01-04T09:00", dueAt: "2027-01-11T17:00", attemptLimit: 3, lateRule: "refuse", visibility: "names" })).rejects.toThrow(/is a draft/);
    const [draft] = await db().select().from(drillVersions).where(sql`${drillVersions.drillId} = ${w.drillId} and ${drillVersions.version} = 2`);
    expect(
      await dbRefusal(db().insert(assignments).values({ organizationId: w.org.id, cohortId: w.cohort.id, drillVersionId: draft.id, title: "x", opensAt: new Date(), dueAt: new Date(Date.now() + 1000), attemptLimit: 1, createdBy: w.instructor.id })),
    ).toMatch(/only a published drill version can be assigned/);
  });

  it("interprets the dates in the cohort's time zone", async () => {
    const { createAssignment } = await import("@/app/_lib/classroom/assignments");
    // Europe/Dublin is on IST (UTC+1) in July and GMT (UTC+0) in January (IANA tz database)
    const { id } = await createAssignment(w.instructor, { cohortId: w.cohort.id, drillId: w.drillId, version: 1, opensAt: "2027-07-05T09:00", dueAt: "2028-01-10T09:00", attemptLimit: 2, lateRule: "refuse", visibility: "names" });
    const [a] = await db().select().from(assignments).where(eq(assignments.id, id));
    expect(a.opensAt.toISOString()).toBe("2027-07-05T08:00:00.000Z");
    expect(a.dueAt.toISOString()).toBe("2028-01-10T09:00:00.000Z");
  });
});

describe("starting attempts", () => {
  it("counts an attempt when it starts, even under concurrent starts, and refuses past the limit", async () => {
    const { id } = await assign(w.instructor, w.cohort.id, w.drillId, { limit: 3 });
    const trainee = w.trainees[0];
    const results = await Promise.allSettled(Array.from({ length: 6 }, () => startAttempt(trainee, id)));
    const ok = results.filter((r) => r.status === "fulfilled");
    const refused = results.filter((r) => r.status === "rejected") as PromiseRejectedResult[];
    expect(ok).toHaveLength(3);
    expect(refused.every((r) => r.reason instanceof ActionRefused && /used all 3 attempts/.test(r.reason.message))).toBe(true);
    const rows = await db().select().from(attempts).where(eq(attempts.assignmentId, id));
    expect(rows.map((r) => r.number).sort()).toEqual([1, 2, 3]);
    // the drill's noise policy is "fixed": every attempt gets the drill's seed
    expect(new Set(rows.map((r) => r.seed))).toEqual(new Set([w.drill.noise.seed]));
  });

  it("refuses non-members, staff, an assignment not open yet, and a closed one", async () => {
    const { id } = await assign(w.instructor, w.cohort.id, w.drillId);
    await expect(startAttempt(w.instructor, id)).rejects.toThrow(/Only trainees of this cohort/);
    const later = await assign(w.instructor, w.cohort.id, w.drillId, { opensInMs: 86_400_000, dueInMs: 2 * 86_400_000 });
    await expect(startAttempt(w.trainees[0], later.id)).rejects.toThrow(/has not opened yet/);
    const closed = await assign(w.instructor, w.cohort.id, w.drillId, { opensInMs: -2 * 86_400_000, dueInMs: -86_400_000, lateRule: "refuse" });
    await expect(startAttempt(w.trainees[0], closed.id)).rejects.toThrow(/past its due date/);
  });
});

describe("submitting and verifying", () => {
  it("is idempotent: the same key is answered again, concurrent duplicates make one submission, another key is refused", async () => {
    const { id } = await assign(w.instructor, w.cohort.id, w.drillId);
    const t = w.trainees[1];
    const a = await startAttempt(t, id);
    const sub = honestSubmission(w.drill, a.attemptId, a.seed, w.drill.referenceTuning);
    const answers = await Promise.all(Array.from({ length: 8 }, () => submitAttempt(t, sub)));
    expect(answers.filter((r) => !r.repeated)).toHaveLength(1);
    expect(answers.every((r) => r.attemptId === a.attemptId)).toBe(true);
    await expect(submitAttempt(t, { ...sub, submissionKey: crypto.randomUUID() })).rejects.toThrow(/already submitted/);
    const [{ n }] = await db().select({ n: count() }).from(attempts).where(eq(attempts.assignmentId, id));
    expect(n).toBe(1);
    // one job for the attempt in the queue (pg-boss keeps it in its job or archive table)
    const jobs = await db().execute<{ n: number }>(sql`select count(*)::int as n from (select id from pgboss.job where singleton_key = ${a.attemptId} union all select id from pgboss.archive where singleton_key = ${a.attemptId}) j`);
    expect(jobs[0].n).toBe(1);
    const verified = await waitForVerification(a.attemptId);
    expect(verified.status).toBe("verified");
    expect(verified.flagged).toBe(false);
  });

  it("refuses another trainee's attempt and invalid submissions, writing nothing", async () => {
    const { id } = await assign(w.instructor, w.cohort.id, w.drillId);
    const a = await startAttempt(w.trainees[0], id);
    const sub = honestSubmission(w.drill, a.attemptId, a.seed, w.drill.referenceTuning);
    await expect(submitAttempt(w.trainees[1], sub)).rejects.toThrow(/does not exist/);
    await expect(submitAttempt(w.trainees[0], { ...sub, controller: { ...sub.controller, kc: -Infinity } })).rejects.toThrow(/not valid/);
    await expect(submitAttempt(w.trainees[0], { ...sub, actionLog: [{ sample: -1, type: "setpoint", setpointC: 50 }] })).rejects.toThrow(/not valid/);
    const [row] = await db().select().from(attempts).where(eq(attempts.id, a.attemptId));
    expect(row.status).toBe("started");
    expect(row.submittedAt).toBeNull();
  });

  it("re-scores a tampered submission by replay and flags it; an honest one is not flagged", async () => {
    const { id } = await assign(w.instructor, w.cohort.id, w.drillId);
    const t = w.trainees[2];
    const aggressive = { ...w.drill.referenceTuning, kc: w.drill.referenceTuning.kc * 3 };
    const honest = await startAttempt(t, id);
    const tampered = await startAttempt(t, id);
    const honestSub = honestSubmission(w.drill, honest.attemptId, honest.seed, aggressive);
    const tamperedSub = honestSubmission(w.drill, tampered.attemptId, tampered.seed, aggressive);
    // edited results: a better score and a better settling time than the run gave
    tamperedSub.claimed = { ...tamperedSub.claimed, score: Math.min(100, tamperedSub.claimed.score + 30) };
    await submitAttempt(t, honestSub);
    await submitAttempt(t, tamperedSub);
    const h = await waitForVerification(honest.attemptId);
    const x = await waitForVerification(tampered.attemptId);
    expect(h.flagged).toBe(false);
    expect(h.score).toBeCloseTo(honestSub.claimed.score, 6);
    expect(x.flagged).toBe(true);
    expect(x.flagReason).toMatch(/[Cc]laimed score/);
    // the official score is the replay's, not the claim
    expect(x.score).toBeCloseTo(honestSub.claimed.score, 6);
    expect(Math.abs((x.score ?? 0) - tamperedSub.claimed.score)).toBeGreaterThan(CLAIM_TOLERANCE.score);
  });

  it("gives identical official results when the same attempt is verified twice", async () => {
    const { id } = await assign(w.instructor, w.cohort.id, w.drillId);
    const t = w.trainees[0];
    const a = await startAttempt(t, id);
    const log = [
      { sample: 1200, type: "tuning" as const, controller: { ...w.drill.referenceTuning, kc: w.drill.referenceTuning.kc * 0.7 } },
    ];
    await submitAttempt(t, honestSubmission(w.drill, a.attemptId, a.seed, w.drill.referenceTuning, log));
    const first = await waitForVerification(a.attemptId);
    const again = await verifyAttempt(a.attemptId);
    const [second] = await db().select().from(attempts).where(eq(attempts.id, a.attemptId));
    expect(again.state).toBe("verified");
    const strip = ({ verifyRuns: _v, ...rest }: typeof first) => rest;
    expect(strip(second)).toEqual(strip(first));
    expect(second.verifyRuns).toBe(first.verifyRuns + 1);
    // and the pure replay twice in this process: bit-identical documents
    const inputs = { drill: w.drill, controller: first.controller, actionLog: first.actionLog, seed: first.seed, latePenaltyFactor: 1 };
    expect(JSON.stringify(replayAttempt(inputs))).toBe(JSON.stringify(replayAttempt(inputs)));
  });

  it("keeps a drill version that attempts ran unchangeable", async () => {
    // the version of every assignment above; the trigger of migration 0002 refuses any change
    expect(await dbRefusal(db().update(drillVersions).set({ document: { ...w.drill, title: "edited afterwards" } }).where(eq(drillVersions.id, w.drillVersionId)))).toMatch(/published and cannot be changed/);
    expect(await dbRefusal(db().delete(drillVersions).where(eq(drillVersions.id, w.drillVersionId)))).toMatch(/published and cannot be changed/);
  });

  it("applies the late rule: marked late, or a score penalty", async () => {
    const late = await assign(w.instructor, w.cohort.id, w.drillId, { opensInMs: -2 * 86_400_000, dueInMs: -60_000, lateRule: "accept-penalty", penalty: 20 });
    const t = w.trainees[1];
    const a = await startAttempt(t, late.id);
    const sub = honestSubmission(w.drill, a.attemptId, a.seed, w.drill.referenceTuning);
    await submitAttempt(t, sub);
    const row = await waitForVerification(a.attemptId);
    expect(row.late).toBe(true);
    expect(row.rawScore).toBeCloseTo(sub.claimed.score, 6);
    expect(row.score).toBeCloseTo(Math.round(sub.claimed.score * 0.8 * 10) / 10, 6);
    // the claim is the engine's score before the penalty, so it is not a mismatch
    expect(row.flagged).toBe(false);
  });
});
