// Attempt rules, independent of Next:
// - starting: a trainee member of the assignment's cohort, once it has opened, before it is due
//   (or after, unless the late rule refuses), within the attempt limit. The server issues the id
//   and the seed and counts the attempt in the same transaction (the assignment row is locked, so
//   two tabs cannot both take the last attempt); an abandoned attempt still counts.
// - submitting: only the attempt's trainee, once. The submission key makes it idempotent: a retry
//   with the same key gets the same answer and never a second submission or job; another key for
//   a submitted attempt is refused. The inputs are validated with the engine's schemas; the
//   claimed results are kept only to compare with the replay (verify.ts, in the worker).
// - reading: the trainee (their own attempts, even after removal from the roster), the cohort's
//   instructors and the organisation's admins.
// - written feedback: the cohort's instructors and admins; shown in the app and e-mailed.
import { randomInt } from "node:crypto";
import { and, asc, count, desc, eq, isNull, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { assignments, attemptFeedback, attempts, cohortMemberships, cohorts, drillVersions, users, type AssignmentRow, type AttemptRow } from "@/db/schema";
import { drillSchema, type Drill } from "@/sim/drill/schema";
import { ActionRefused } from "../action";
import { cohortAccess } from "../guard";
import type { SignedInUser } from "../auth";
import { attemptSubmissionSchema, type AttemptDetail, type AttemptStatus, type WindowFeedback, type AttemptSummary } from "./contracts";
import { enqueueVerification } from "./queue";
import { sendFeedbackMail } from "./notices";
import { firstIssue } from "../drills";

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const NO_SUCH_ATTEMPT = "That attempt does not exist.";
const NO_SUCH_ASSIGNMENT = "That assignment does not exist.";

type Actor = Pick<SignedInUser, "id" | "organizationId" | "role">;

/** The seed of a new attempt: the drill's fixed seed, or a fresh 32-bit one. */
export function seedFor(drill: Drill): number {
  return drill.noise.seedPolicy === "fixed" ? drill.noise.seed : randomInt(0, 2 ** 32 - 1);
}

export function assignmentPhase(a: Pick<AssignmentRow, "opensAt" | "dueAt" | "lateRule">, now = new Date()): "not-open" | "open" | "late" | "closed" {
  if (now < a.opensAt) return "not-open";
  if (now <= a.dueAt) return "open";
  return a.lateRule === "refuse" ? "closed" : "late";
}

export async function startAttempt(user: Actor, assignmentId: string): Promise<{ attemptId: string; number: number; seed: number }> {
  if (!uuidPattern.test(assignmentId)) throw new ActionRefused(NO_SUCH_ASSIGNMENT);
  return getDb().transaction(async (tx) => {
    // the lock serialises starts of this assignment: the count and the insert see the same rows
    const [a] = await tx.select().from(assignments).where(and(eq(assignments.id, assignmentId), eq(assignments.organizationId, user.organizationId))).for("update");
    if (!a || a.archivedAt) throw new ActionRefused(NO_SUCH_ASSIGNMENT);
    const [member] = await tx
      .select({ role: cohortMemberships.role })
      .from(cohortMemberships)
      .where(and(eq(cohortMemberships.cohortId, a.cohortId), eq(cohortMemberships.userId, user.id), eq(cohortMemberships.role, "trainee"), isNull(cohortMemberships.removedAt)));
    if (!member) throw new ActionRefused("Only trainees of this cohort attempt its drills.");
    const phase = assignmentPhase(a);
    if (phase === "not-open") throw new ActionRefused("This assignment has not opened yet.");
    if (phase === "closed") throw new ActionRefused("This assignment is past its due date and does not accept late attempts.");
    const [{ used }] = await tx.select({ used: count() }).from(attempts).where(and(eq(attempts.assignmentId, a.id), eq(attempts.traineeId, user.id)));
    if (used >= a.attemptLimit) throw new ActionRefused(`You have used all ${a.attemptLimit} attempts of this assignment.`);
    const [version] = await tx.select({ document: drillVersions.document }).from(drillVersions).where(eq(drillVersions.id, a.drillVersionId));
    const drill = drillSchema.parse(version.document);
    const seed = seedFor(drill);
    const [row] = await tx
      .insert(attempts)
      .values({ assignmentId: a.id, traineeId: user.id, drillVersionId: a.drillVersionId, number: used + 1, seed })
      .returning({ id: attempts.id, number: attempts.number });
    return { attemptId: row.id, number: row.number, seed };
  });
}

export type SubmitResult = { attemptId: string; status: AttemptStatus; repeated: boolean };

export async function submitAttempt(user: Actor, submission: unknown): Promise<SubmitResult> {
  const p = attemptSubmissionSchema.safeParse(submission);
  if (!p.success) throw new ActionRefused(`The submission is not valid — ${firstIssue(p.error)}`);
  const s = p.data;
  const outcome = await getDb().transaction(async (tx) => {
    const [row] = await tx
      .select({ attempt: attempts, assignment: assignments, document: drillVersions.document })
      .from(attempts)
      .innerJoin(assignments, eq(assignments.id, attempts.assignmentId))
      .innerJoin(drillVersions, eq(drillVersions.id, attempts.drillVersionId))
      .where(eq(attempts.id, s.attemptId))
      .for("update", { of: attempts });
    if (!row || row.attempt.traineeId !== user.id) throw new ActionRefused(NO_SUCH_ATTEMPT);
    const a = row.attempt;
    if (a.status !== "started") {
      if (a.submissionKey === s.submissionKey) return { attemptId: a.id, status: publicStatus(a.status), repeated: true, drill: null };
      throw new ActionRefused("This attempt was already submitted.");
    }
    const now = new Date();
    const late = now > row.assignment.dueAt;
    if (late && row.assignment.lateRule === "refuse") throw new ActionRefused("The due date has passed and this assignment does not accept late submissions.");
    const drill = drillSchema.parse(row.document);
    await tx
      .update(attempts)
      .set({
        status: "submitted",
        submittedAt: now,
        submissionKey: s.submissionKey,
        late,
        controller: s.controller as unknown as Record<string, unknown>,
        actionLog: s.actionLog as unknown[],
        claimedScore: s.claimed.score,
        claimedFingerprint: s.claimed.fingerprint ?? null,
        claimedResults: s.claimed.results,
      })
      .where(and(eq(attempts.id, a.id), eq(attempts.status, "started")));
    return { attemptId: a.id, status: "verifying" as const, repeated: false, drill };
  });
  // queued after the commit (the job must find the row); a lost send is picked up by the worker's sweep
  if (outcome.drill) await enqueueVerification(outcome.attemptId, outcome.drill);
  return { attemptId: outcome.attemptId, status: outcome.status, repeated: outcome.repeated };
}

export function publicStatus(s: AttemptRow["status"]): AttemptStatus {
  return s === "submitted" ? "verifying" : s;
}

interface AttemptContext {
  attempt: AttemptRow;
  assignment: AssignmentRow;
  timeZone: string;
  traineeName: string;
  document: Record<string, unknown>;
  drillVersion: number;
  owner: boolean;
  staff: boolean;
}

/** The attempt with what the user may do with it; refuses (as "does not exist") anyone else. */
export async function attemptFor(user: Actor, attemptId: string): Promise<AttemptContext> {
  if (!uuidPattern.test(attemptId)) throw new ActionRefused(NO_SUCH_ATTEMPT);
  const [row] = await getDb()
    .select({ attempt: attempts, assignment: assignments, timeZone: cohorts.timeZone, traineeName: users.displayName, document: drillVersions.document, drillVersion: drillVersions.version })
    .from(attempts)
    .innerJoin(assignments, eq(assignments.id, attempts.assignmentId))
    .innerJoin(cohorts, eq(cohorts.id, assignments.cohortId))
    .innerJoin(users, eq(users.id, attempts.traineeId))
    .innerJoin(drillVersions, eq(drillVersions.id, attempts.drillVersionId))
    .where(and(eq(attempts.id, attemptId), eq(assignments.organizationId, user.organizationId)));
  if (!row) throw new ActionRefused(NO_SUCH_ATTEMPT);
  const owner = row.attempt.traineeId === user.id;
  const staff = (user.role === "instructor" || user.role === "admin") && (await cohortAccess(user as SignedInUser, row.assignment.cohortId, "instructor"));
  if (!owner && !staff) throw new ActionRefused(NO_SUCH_ATTEMPT);
  return { ...row, owner, staff };
}

export async function attemptDetail(user: Actor, attemptId: string): Promise<AttemptDetail> {
  const c = await attemptFor(user, attemptId);
  const a = c.attempt;
  const notes = await getDb()
    .select({ id: attemptFeedback.id, body: attemptFeedback.body, createdAt: attemptFeedback.createdAt, authorName: users.displayName })
    .from(attemptFeedback)
    .innerJoin(users, eq(users.id, attemptFeedback.authorId))
    .where(eq(attemptFeedback.attemptId, a.id))
    .orderBy(asc(attemptFeedback.createdAt));
  const detail = a.officialScoreDetail as { windows?: WindowFeedback[] } | null;
  return {
    id: a.id,
    number: a.number,
    status: publicStatus(a.status),
    startedAt: a.startedAt.toISOString(),
    submittedAt: a.submittedAt?.toISOString() ?? null,
    verifiedAt: a.verifiedAt?.toISOString() ?? null,
    late: a.late,
    assignment: { id: c.assignment.id, title: c.assignment.title, cohortId: c.assignment.cohortId, dueAt: c.assignment.dueAt.toISOString(), timeZone: c.timeZone, attemptLimit: c.assignment.attemptLimit },
    trainee: { id: a.traineeId, name: c.traineeName },
    drill: c.document,
    drillVersion: c.drillVersion,
    seed: a.seed,
    controller: a.controller ?? null,
    actionLog: a.actionLog ?? null,
    official:
      a.status === "verified" && a.officialFingerprint && a.score !== null
        ? {
            engineVersion: a.engineVersion ?? "",
            fingerprint: a.officialFingerprint,
            summary: summaryOf(a),
            windows: detail?.windows ?? [],
            violations: a.violations ?? [],
          }
        : null,
    // a flag is for the instructor; the trainee sees their verified result either way
    flagged: c.staff ? a.flagged : false,
    flagReason: c.staff ? a.flagReason : null,
    canReview: c.staff,
    feedback: notes.map((n) => ({ id: n.id, authorName: n.authorName, body: n.body, createdAt: n.createdAt.toISOString() })),
  };
}

export function summaryOf(a: Pick<AttemptRow, "score" | "rawScore" | "settlingTimeS" | "overshootC" | "iae" | "recoveryTimeS" | "energyKWh" | "safetyTrips">): AttemptSummary {
  return {
    score: a.score ?? 0,
    rawScore: a.rawScore ?? a.score ?? 0,
    settlingTimeS: a.settlingTimeS,
    overshootC: a.overshootC,
    iae: a.iae ?? 0,
    recoveryTimeS: a.recoveryTimeS,
    energyKWh: a.energyKWh ?? 0,
    safetyTrips: a.safetyTrips ?? 0,
  };
}

export const FEEDBACK_MAX = 4000;

export async function leaveFeedback(user: Actor, attemptId: string, body: string): Promise<void> {
  const text = body.trim();
  if (!text) throw new ActionRefused("Write some feedback first.");
  if (text.length > FEEDBACK_MAX) throw new ActionRefused(`Keep the feedback under ${FEEDBACK_MAX} characters.`);
  const c = await attemptFor(user, attemptId);
  if (!c.staff) throw new ActionRefused(NO_SUCH_ATTEMPT);
  if (c.attempt.status === "started") throw new ActionRefused("This attempt has not been submitted yet.");
  await getDb().insert(attemptFeedback).values({ attemptId: c.attempt.id, authorId: user.id, body: text });
  const [trainee] = await getDb().select({ email: users.email, name: users.displayName, status: users.status }).from(users).where(eq(users.id, c.attempt.traineeId));
  const [author] = await getDb().select({ name: users.displayName }).from(users).where(eq(users.id, user.id));
  if (trainee && trainee.status === "active") {
    await sendFeedbackMail({ to: trainee.email, traineeName: trainee.name, authorName: author?.name ?? "Your instructor", assignmentTitle: c.assignment.title, attemptNumber: c.attempt.number, attemptId: c.attempt.id, body: text });
  }
}

// ---- lists ----

export interface AssignmentListItem {
  id: string;
  title: string;
  cohortId: string;
  cohortName: string;
  timeZone: string;
  opensAt: string;
  dueAt: string;
  attemptLimit: number;
  lateRule: AssignmentRow["lateRule"];
  phase: ReturnType<typeof assignmentPhase>;
  drillTitle: string;
  drillVersion: number;
  /** trainee view */
  attemptsUsed: number;
  bestScore: number | null;
  verifying: number;
  /** the trainee's unfinished (started, not submitted) latest attempt, to resume */
  openAttemptId: string | null;
}

/** A trainee's assignments (cohorts they are an active member of), or a cohort's for staff. */
export async function assignmentsFor(user: Actor, opts: { cohortId?: string } = {}): Promise<AssignmentListItem[]> {
  const db = getDb();
  const base = db
    .select({ a: assignments, cohortName: cohorts.name, timeZone: cohorts.timeZone, document: drillVersions.document, drillVersion: drillVersions.version })
    .from(assignments)
    .innerJoin(cohorts, eq(cohorts.id, assignments.cohortId))
    .innerJoin(drillVersions, eq(drillVersions.id, assignments.drillVersionId));
  const rows = opts.cohortId
    ? await base.where(and(eq(assignments.cohortId, opts.cohortId), eq(assignments.organizationId, user.organizationId), isNull(assignments.archivedAt))).orderBy(desc(assignments.dueAt))
    : await base
        .innerJoin(cohortMemberships, and(eq(cohortMemberships.cohortId, assignments.cohortId), eq(cohortMemberships.userId, user.id), eq(cohortMemberships.role, "trainee"), isNull(cohortMemberships.removedAt)))
        .where(and(isNull(assignments.archivedAt), sql`${assignments.opensAt} <= now()`))
        .orderBy(asc(assignments.dueAt));
  const mine = rows.length
    ? await db
        .select({
          assignmentId: attempts.assignmentId,
          used: count(),
          best: sql<number | null>`max(${attempts.score}) filter (where ${attempts.status} = 'verified')`,
          verifying: sql<number>`count(*) filter (where ${attempts.status} = 'submitted')`.mapWith(Number),
          open: sql<string | null>`(array_agg(${attempts.id} order by ${attempts.number} desc) filter (where ${attempts.status} = 'started'))[1]`,
        })
        .from(attempts)
        .where(eq(attempts.traineeId, user.id))
        .groupBy(attempts.assignmentId)
    : [];
  const byAssignment = new Map(mine.map((m) => [m.assignmentId, m]));
  return rows.map((r) => {
    const m = byAssignment.get(r.a.id);
    return {
      id: r.a.id,
      title: r.a.title,
      cohortId: r.a.cohortId,
      cohortName: r.cohortName,
      timeZone: r.timeZone,
      opensAt: r.a.opensAt.toISOString(),
      dueAt: r.a.dueAt.toISOString(),
      attemptLimit: r.a.attemptLimit,
      lateRule: r.a.lateRule,
      phase: assignmentPhase(r.a),
      drillTitle: String((r.document as { title?: string }).title ?? ""),
      drillVersion: r.drillVersion,
      attemptsUsed: m?.used ?? 0,
      bestScore: m?.best === null || m?.best === undefined ? null : Number(m.best),
      verifying: m?.verifying ?? 0,
      openAttemptId: m?.open ?? null,
    };
  });
}

/** One assignment with its drill document, for its page (the caller has authorized the cohort). */
export async function assignmentById(user: Actor, assignmentId: string) {
  if (!uuidPattern.test(assignmentId)) return null;
  const [row] = await getDb()
    .select({ a: assignments, cohortName: cohorts.name, timeZone: cohorts.timeZone, document: drillVersions.document, drillVersion: drillVersions.version, drillId: drillVersions.drillId })
    .from(assignments)
    .innerJoin(cohorts, eq(cohorts.id, assignments.cohortId))
    .innerJoin(drillVersions, eq(drillVersions.id, assignments.drillVersionId))
    .where(and(eq(assignments.id, assignmentId), eq(assignments.organizationId, user.organizationId)));
  return row ? { ...row, drill: drillSchema.parse(row.document), phase: assignmentPhase(row.a) } : null;
}

/** The trainee's own attempts of an assignment, newest first. */
export async function ownAttempts(user: Actor, assignmentId: string) {
  const rows = await getDb()
    .select()
    .from(attempts)
    .where(and(eq(attempts.assignmentId, assignmentId), eq(attempts.traineeId, user.id)))
    .orderBy(desc(attempts.number));
  return rows.map((a) => ({ id: a.id, number: a.number, status: publicStatus(a.status), startedAt: a.startedAt.toISOString(), submittedAt: a.submittedAt?.toISOString() ?? null, late: a.late, score: a.status === "verified" ? a.score : null }));
}

/** Other verified attempts of the same assignment, for the review's overlay (staff only; the caller checked). */
export async function compareOptions(assignmentId: string, exceptId: string) {
  const rows = await getDb()
    .select({ id: attempts.id, number: attempts.number, name: users.displayName, score: attempts.score })
    .from(attempts)
    .innerJoin(users, eq(users.id, attempts.traineeId))
    .where(and(eq(attempts.assignmentId, assignmentId), eq(attempts.status, "verified")))
    .orderBy(desc(attempts.score))
    .limit(200);
  return rows.filter((r) => r.id !== exceptId).map((r) => ({ id: r.id, label: `${r.name} — attempt ${r.number} · ${r.score?.toFixed(1) ?? "—"}` }));
}
