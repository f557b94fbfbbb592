// A small classroom for the integration tests, in the test database beside the seeded demo: a
// cohort of the demo organisation with an instructor and trainees, a published drill (the
// "setpoint-step" starter: a +15 °C step on the benchtop curing cabinet, 1 h) and helpers to
// assign it, run an attempt headless with the engine and wait for the worker's verification.
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { hashPassword } from "@/app/_lib/password";
import { newUserId } from "@/app/_lib/tokens";
import { createDrill, publishDraft, saveDraft, type DrillActor } from "@/app/_lib/drills";
import { createAssignment } from "@/app/_lib/classroom/assignments";
import { instantToZonedLocal } from "@/app/_lib/classroom/zoned-time";
import { getDb } from "@/db/client";
import { attempts, cohortMemberships, cohorts, drillVersions, organizations, users, type UserRole } from "@/db/schema";
import { DEMO_ORGANIZATION } from "@/db/seed";
import { runDrill } from "@/sim/drill/run-drill";
import { drillSchema, type Drill } from "@/sim/drill/schema";
import { scoreAttempt } from "@/sim/drill/score";
import { traceFingerprint } from "@/sim/drill/trace-hash";
import type { ControllerConfigInput } from "@/sim/control/config";
import type { StampedAction } from "@/sim/drill/actions";
import { uniqueEmail } from "../helpers";

export const TZ = "Europe/Dublin";

export interface Person extends DrillActor {
  email: string;
  name: string;
}

let hash = "";
export async function person(organizationId: string, name: string, role: UserRole): Promise<Person> {
  hash ||= await hashPassword("classroom-tests-password");
  const id = newUserId();
  const email = uniqueEmail(name.toLowerCase().replace(/\s+/g, "."));
  await getDb().insert(users).values({ id, organizationId, email, displayName: name, passwordHash: hash, role });
  return { id, organizationId, role, email, name };
}

export async function classroom(traineeNames = ["Ines Arbuthnot", "Oskar Brennan", "Yara Coyle"]) {
  const db = getDb();
  const [demo] = await db.select().from(organizations).where(eq(organizations.name, DEMO_ORGANIZATION));
  const [cohort] = await db.insert(cohorts).values({ organizationId: demo.id, name: `Classroom test ${randomUUID()}`, timeZone: TZ }).returning();
  const instructor = await person(demo.id, "Rhona Valdes", "instructor");
  await db.insert(cohortMemberships).values({ cohortId: cohort.id, userId: instructor.id, role: "instructor" });
  const trainees: Person[] = [];
  for (const n of traineeNames) {
    const t = await person(demo.id, n, "trainee");
    await db.insert(cohortMemberships).values({ cohortId: cohort.id, userId: t.id, role: "trainee" });
    trainees.push(t);
  }
  const drill = await createDrill(instructor, { title: "Step on the curing cabinet", starter: "setpoint-step" });
  await publishDraft(instructor, drill.id);
  const [v1] = await db.select().from(drillVersions).where(eq(drillVersions.drillId, drill.id));
  return { org: demo, cohort, instructor, trainees, drillId: drill.id, drill: drillSchema.parse(v1.document), drillVersionId: v1.id };
}

/** A published drill from a document (for drills other than the starter). */
export async function publishedDrill(owner: Person, document: Record<string, unknown>): Promise<{ drillId: string; drill: Drill }> {
  const d = await createDrill(owner, { title: String(document.title ?? "Test drill"), starter: "blank" });
  await saveDraft(owner, d.id, document);
  await publishDraft(owner, d.id);
  const [v] = await getDb().select().from(drillVersions).where(eq(drillVersions.drillId, d.id));
  return { drillId: d.id, drill: drillSchema.parse(v.document) };
}

const local = (ms: number) => instantToZonedLocal(new Date(Date.now() + ms), TZ);

export async function assign(instructor: Person, cohortId: string, drillId: string, opts: { limit?: number; lateRule?: string; penalty?: number; visibility?: string; opensInMs?: number; dueInMs?: number } = {}) {
  return createAssignment(instructor, {
    cohortId,
    drillId,
    version: 1,
    title: "",
    opensAt: local(opts.opensInMs ?? -120_000),
    dueAt: local(opts.dueInMs ?? 7 * 86_400_000),
    attemptLimit: opts.limit ?? 3,
    lateRule: opts.lateRule ?? "accept-marked",
    latePenaltyPercent: opts.penalty ?? 0,
    visibility: opts.visibility ?? "initials",
  });
}

/** What an honest Bench submits: the engine's own run of the inputs, and its score and fingerprint. */
export function honestSubmission(drill: Drill, attemptId: string, seed: number, controller: ControllerConfigInput, actionLog: StampedAction[] = []) {
  const run = runDrill(drill, controller, actionLog, seed);
  const reference = runDrill(drill, drill.referenceTuning, [], seed);
  const score = scoreAttempt(drill, run.results, reference.results);
  return {
    attemptId,
    submissionKey: randomUUID(),
    controller,
    actionLog,
    claimed: { score: score.score, fingerprint: traceFingerprint(run.trace), results: run.results as unknown as Record<string, unknown> },
  };
}

/** Waits for the worker (started by the test runner) to verify the attempt. */
export async function waitForVerification(attemptId: string, timeoutMs = 60_000) {
  const started = Date.now();
  while (Date.now() - started < timeoutMs) {
    const [row] = await getDb().select().from(attempts).where(eq(attempts.id, attemptId));
    if (row && (row.status === "verified" || row.status === "failed")) return row;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`attempt ${attemptId} was not verified within ${timeoutMs} ms (is the worker running?)`);
}
