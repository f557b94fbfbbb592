// The people and things the authorization matrix runs against, made in the test database next to
// the seeded demo organisation ("Kestrel Fen Technical College — Mechatronics Lab", db/seed.ts):
// in the demo organisation an admin, cohorts A and B each with its own instructor and trainee, and
// a deactivated admin; a second organisation with its own admin, instructor, trainee and cohort;
// the owner's (cohort A trainee's) private and shared plants, tuning set and saved run. Everything
// made here carries the text "access-matrix" (names, e-mail addresses) or one of the fixture ids,
// which is how the database digest (db-digest.ts) finds the rows that belong to the matrix while
// other test files work in the same database.
import { randomBytes, randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import type { Actor, FreshIds, FreshKind, MatrixFixtures } from "@/app/_lib/access-registry";
import { createPlant, createRun, createTuningSet, setPlantShared, type BenchUser } from "@/app/_lib/bench-store";
import { archiveDrill, createDrill, newDraftFromPublished, publishDraft, setDrillShared, type DrillActor } from "@/app/_lib/drills";
import { hashPassword } from "@/app/_lib/password";
import { hashToken, newLinkToken, newUserId } from "@/app/_lib/tokens";
import { getDb } from "@/db/client";
import { assignments, attempts, cohortMemberships, cohorts, drillVersions, invitations, organizations, passwordResetTokens, sessions, users, type UserRole } from "@/db/schema";
import { startAttempt } from "@/app/_lib/classroom/attempts";
import { createTuningRecord } from "@/app/_lib/records/create-record";
import { DEMO_ORGANIZATION } from "@/db/seed";
import ladder from "@/sim/examples/setpoint-ladder.json";
import { SAMPLE_CABINET, SAMPLE_LOG } from "@/app/_lib/access-registry";
import { acceptTwin } from "@/app/_lib/twins/accept-twin";

export const FIXTURE_PASSWORD = "access-matrix-password";
export const MARKER = "access-matrix";

const db = () => getDb();
let serial = 0;
/** unique per call within this run, and across runs */
export const uniqueText = () => `${MARKER}-${Date.now().toString(36)}-${(serial++).toString(36)}-${randomBytes(3).toString("hex")}`;

export interface MatrixWorld {
  fixtures: Omit<MatrixFixtures, "unique" | "fresh">;
  /** user id of each signed-in kind (anonymous has none) */
  userIds: Partial<Record<Actor, string>>;
  demoOrgId: string;
  foreignOrgId: string;
  /** ids (besides the marker) whose appearance in a row makes the row the matrix's (db-digest.ts) */
  ownIds: string[];
  owner: BenchUser;
  drillOwner: DrillActor;
  passwordHash: string;
}

const controller = { kind: "pid" as const, form: "standard" as const, kc: 4, ti: 300, td: 30 };
const PRESET = "benchtop-curing-cabinet";

async function makeUser(world: { passwordHash: string }, organizationId: string, role: UserRole, name: string, status: "active" | "deactivated" = "active") {
  // the id carries the marker too, so rows that only reference the user (sessions, memberships,
  // reset tokens) are found by the digest
  const id = `${MARKER}-${newUserId()}`;
  await db()
    .insert(users)
    .values({ id, organizationId, email: `${uniqueText()}@access-matrix.test`, displayName: name, passwordHash: world.passwordHash, role, status, deactivatedAt: status === "active" ? null : new Date() });
  return id;
}

export async function buildWorld(): Promise<MatrixWorld> {
  const passwordHash = await hashPassword(FIXTURE_PASSWORD);
  const ownIds: string[] = [];
  const base = { passwordHash };
  const [demo] = await db().select().from(organizations).where(eq(organizations.name, DEMO_ORGANIZATION));
  if (!demo) throw new Error(`the seeded demo organisation "${DEMO_ORGANIZATION}" is missing`);
  const [foreign] = await db().insert(organizations).values({ name: `Saltmarsh Packaging Works (${uniqueText()})` }).returning();
  ownIds.push(foreign.id);

  const cohort = async (organizationId: string, label: string) => {
    const [c] = await db().insert(cohorts).values({ organizationId, name: `Access matrix ${label} ${uniqueText()}`, timeZone: "Europe/Dublin" }).returning();
    ownIds.push(c.id);
    return c.id;
  };
  const cohortA = await cohort(demo.id, "A");
  const cohortB = await cohort(demo.id, "B");
  const foreignCohort = await cohort(foreign.id, "foreign");

  const userIds: Partial<Record<Actor, string>> = {
    admin: await makeUser(base, demo.id, "admin", "Matrix Admin"),
    instructor: await makeUser(base, demo.id, "instructor", "Matrix Instructor A"),
    otherInstructor: await makeUser(base, demo.id, "instructor", "Matrix Instructor B"),
    trainee: await makeUser(base, demo.id, "trainee", "Matrix Trainee A"),
    otherTrainee: await makeUser(base, demo.id, "trainee", "Matrix Trainee B"),
    deactivated: await makeUser(base, demo.id, "admin", "Matrix Deactivated Admin", "deactivated"),
    foreignAdmin: await makeUser(base, foreign.id, "admin", "Foreign Admin"),
    foreignInstructor: await makeUser(base, foreign.id, "instructor", "Foreign Instructor"),
    foreignTrainee: await makeUser(base, foreign.id, "trainee", "Foreign Trainee"),
  };
  const member = (cohortId: string, userId: string, role: "trainee" | "instructor") => db().insert(cohortMemberships).values({ cohortId, userId, role });
  await member(cohortA, userIds.instructor!, "instructor");
  await member(cohortA, userIds.trainee!, "trainee");
  await member(cohortB, userIds.otherInstructor!, "instructor");
  await member(cohortB, userIds.otherTrainee!, "trainee");
  await member(foreignCohort, userIds.foreignInstructor!, "instructor");
  await member(foreignCohort, userIds.foreignTrainee!, "trainee");

  const owner: BenchUser = { id: userIds.trainee!, organizationId: demo.id };
  const privatePlant = await createPlant(owner, { name: `Private cabinet ${uniqueText()}`, description: "", definition: SAMPLE_CABINET });
  const sharedPlant = await createPlant(owner, { name: `Shared cabinet ${uniqueText()}`, description: "", definition: SAMPLE_CABINET });
  await setPlantShared(owner, sharedPlant.id, true);
  const tuningSet = await createTuningSet(owner, { plantRef: sharedPlant.ref, name: `PI ${uniqueText()}`, controller });
  const run = await createRun(owner, runInput(sharedPlant.ref));
  ownIds.push(privatePlant.id, sharedPlant.id, tuningSet.id, run.id);

  const drillOwner: DrillActor = { id: userIds.instructor!, organizationId: demo.id, role: "instructor" };
  const privateDrill = await createDrill(drillOwner, { title: `Private drill ${uniqueText()}`, starter: "setpoint-step" });
  const sharedDrill = await sharedDrillWith(drillOwner, "published v1 and draft v2");
  const archivedDrill = await sharedDrillWith(drillOwner, "published v1");
  await archiveDrill(drillOwner, archivedDrill, true);
  ownIds.push(privateDrill.id, sharedDrill, archivedDrill);

  // cohort A's assignment of the shared drill's published v1, and a verified attempt of the owner
  const [v1] = await db().select({ id: drillVersions.id }).from(drillVersions).where(and(eq(drillVersions.drillId, sharedDrill), eq(drillVersions.version, 1)));
  const [assignment] = await db()
    .insert(assignments)
    .values({
      organizationId: demo.id,
      cohortId: cohortA,
      drillVersionId: v1.id,
      title: `Assignment ${uniqueText()}`,
      opensAt: new Date(Date.now() - 3_600_000),
      dueAt: new Date(Date.now() + 7 * 86_400_000),
      attemptLimit: 50,
      createdBy: userIds.instructor!,
      openNoticeSentAt: new Date(),
    })
    .returning();
  const [verified] = await db()
    .insert(attempts)
    .values({
      assignmentId: assignment.id,
      traineeId: userIds.trainee!,
      drillVersionId: v1.id,
      number: 1,
      seed: 1,
      status: "verified",
      submittedAt: new Date(),
      verifiedAt: new Date(),
      submissionKey: randomUUID(),
      controller,
      actionLog: [],
      engineVersion: "1.0.0",
      officialFingerprint: "0123456789abcdef",
      score: 50,
      rawScore: 50,
      iae: 100,
      energyKWh: 0.5,
      safetyTrips: 0,
    })
    .returning();
  ownIds.push(assignment.id, verified.id);
  const recordId = await fixtureRecord(owner, sharedPlant.id, tuningSet.id);
  ownIds.push(recordId);
  const twinOf = (shared: boolean) =>
    acceptTwin(owner, { fileName: `${uniqueText()}.csv`, bytes: SAMPLE_LOG.bytes(), mapping: SAMPLE_LOG.mapping, choice: "fopdt", name: `Twin ${uniqueText()}`, shared });
  const privateTwin = await twinOf(false);
  const sharedTwin = await twinOf(true);
  ownIds.push(privateTwin.plantId, privateTwin.uploadId, sharedTwin.plantId, sharedTwin.uploadId);

  return {
    fixtures: {
      cohortId: cohortA,
      otherCohortId: cohortB,
      foreignCohortId: foreignCohort,
      privatePlantId: privatePlant.id,
      sharedPlantId: sharedPlant.id,
      runId: run.id,
      tuningSetId: tuningSet.id,
      privateDrillId: privateDrill.id,
      sharedDrillId: sharedDrill,
      archivedDrillId: archivedDrill,
      foreignInstructorId: userIds.foreignInstructor!,
      assignmentId: assignment.id,
      verifiedAttemptId: verified.id,
      recordId,
      privateUploadId: privateTwin.uploadId,
      sharedUploadId: sharedTwin.uploadId,
      presetId: PRESET,
      password: FIXTURE_PASSWORD,
    },
    userIds,
    demoOrgId: demo.id,
    foreignOrgId: foreign.id,
    ownIds,
    owner,
    drillOwner,
    passwordHash,
  };
}

/** An unsigned tuning record of the owner from the fixture tuning set (no proof tests: quick). */
async function fixtureRecord(owner: BenchUser, plantId: string, tuningSetId: string): Promise<string> {
  return (await createTuningRecord(owner, { plantRef: `plant:${plantId}`, tuningSetId, title: `Fixture record ${uniqueText()}`, proofTests: [] })).id;
}

/** A drill of the owner shared within the organisation: "draft v1", "published v1", or "published v1 and draft v2". */
async function sharedDrillWith(owner: DrillActor, state: "draft v1" | "published v1" | "published v1 and draft v2"): Promise<string> {
  const { id } = await createDrill(owner, { title: `Shared drill ${uniqueText()}`, starter: "setpoint-step" });
  await setDrillShared(owner, id, true);
  if (state !== "draft v1") await publishDraft(owner, id);
  if (state === "published v1 and draft v2") await newDraftFromPublished(owner, id);
  return id;
}

function runInput(plantRef: string) {
  return { plantRef, title: `Run ${uniqueText()}`, drill: ladder, controller, seed: 7, actionLog: [], results: {}, engineVersion: "1.0.0", durationS: 600 };
}

/** A session row for the user (what a sign-in makes): Lucia's cookie carries its id. Twelve hours,
 * Lucia's session length, so validating it never extends (writes) it during a cell. */
export async function sessionFor(userId: string): Promise<string> {
  const id = randomBytes(20).toString("hex");
  await db().insert(sessions).values({ id, userId, expiresAt: new Date(Date.now() + 12 * 3_600_000) });
  return id;
}

const FRESH_KINDS: readonly FreshKind[] = [
  "plantId",
  "tuningSetId",
  "runId",
  "userId",
  "instructorId",
  "rosterTraineeId",
  "invitationToken",
  "resetToken",
  "signInEmail",
  "drillId",
  "publishedDrillId",
  "startedAttemptId",
  "recordId",
];

/** Makes the fresh things a case asks for; reading one it did not ask for throws. */
export async function makeFresh(world: MatrixWorld, kinds: readonly FreshKind[]): Promise<FreshIds> {
  const made: Partial<FreshIds> = {};
  const base = { passwordHash: world.passwordHash };
  const demo = world.demoOrgId;
  for (const kind of kinds) {
    switch (kind) {
      case "plantId":
        made.plantId = (await createPlant(world.owner, { name: `Fresh cabinet ${uniqueText()}`, description: "", definition: SAMPLE_CABINET })).id;
        break;
      case "tuningSetId":
        made.tuningSetId = (await createTuningSet(world.owner, { plantRef: `preset:${PRESET}`, name: `PI ${uniqueText()}`, controller })).id;
        break;
      case "runId":
        made.runId = (await createRun(world.owner, runInput(`preset:${PRESET}`))).id;
        break;
      case "userId":
        made.userId = await makeUser(base, demo, "trainee", "Fresh Trainee");
        break;
      case "instructorId":
        made.instructorId = await makeUser(base, demo, "instructor", "Fresh Instructor");
        break;
      case "rosterTraineeId": {
        const id = await makeUser(base, demo, "trainee", "Fresh Roster Trainee");
        await db().insert(cohortMemberships).values({ cohortId: world.fixtures.cohortId, userId: id, role: "trainee" });
        made.rosterTraineeId = id;
        break;
      }
      case "invitationToken": {
        const token = newLinkToken();
        await db()
          .insert(invitations)
          .values({
            organizationId: demo,
            cohortId: world.fixtures.cohortId,
            email: `${uniqueText()}@access-matrix.test`,
            role: "trainee",
            invitedBy: world.userIds.instructor!,
            tokenHash: hashToken(token),
            expiresAt: new Date(Date.now() + 86_400_000),
          });
        made.invitationToken = token;
        break;
      }
      case "resetToken": {
        const userId = await makeUser(base, demo, "trainee", "Fresh Reset Trainee");
        const token = newLinkToken();
        await db().insert(passwordResetTokens).values({ userId, tokenHash: hashToken(token), expiresAt: new Date(Date.now() + 3_600_000) });
        made.resetToken = token;
        break;
      }
      case "signInEmail": {
        const id = await makeUser(base, demo, "trainee", "Fresh Sign-in Trainee");
        const [u] = await db().select({ email: users.email }).from(users).where(eq(users.id, id));
        made.signInEmail = u.email;
        break;
      }
      case "drillId":
        made.drillId = await sharedDrillWith(world.drillOwner, "draft v1");
        break;
      case "publishedDrillId":
        made.publishedDrillId = await sharedDrillWith(world.drillOwner, "published v1");
        break;
      case "startedAttemptId":
        made.startedAttemptId = (await startAttempt({ id: world.owner.id, organizationId: world.demoOrgId, role: "trainee" }, world.fixtures.assignmentId)).attemptId;
        break;
      case "recordId":
        made.recordId = await fixtureRecord(world.owner, world.fixtures.sharedPlantId, world.fixtures.tuningSetId);
        break;
      default: {
        const never: never = kind;
        throw new Error(`no fixture for fresh kind ${String(never)}`);
      }
    }
  }
  return new Proxy(made as FreshIds, {
    get(target, key) {
      if (typeof key === "string" && FRESH_KINDS.includes(key as FreshKind) && !(key in target)) throw new Error(`the case reads fresh.${key} without listing "${key}" in its \`fresh\``);
      return Reflect.get(target, key);
    },
  });
}
