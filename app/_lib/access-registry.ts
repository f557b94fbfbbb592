// The authorization registry: every route handler (method + path pattern) and every server action
// (module + export) of the app, with who may use it and how to call it validly. It is plain data
// read by one test, tests/integration/access-matrix.test.ts, which
//   - scans app/ (and components/) for route handlers and "use server" modules and fails on anything
//     not registered here, or registered here but gone;
//   - runs every case below as every kind of user (ACTORS) and checks that exactly the allowed ones
//     succeed, that the others are refused (401/403/404, or a refusal result), and that a refused
//     call changed nothing in the database.
// Nothing in the app imports this file. Adding a route or an action means adding one entry here:
// say who may use it and give a valid call built from the fixture ids (MatrixFixtures); when the
// call consumes something (deletes a row, spends a token), ask for a fresh one with `fresh`.
import { randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import ladder from "@/sim/examples/setpoint-ladder.json";

// ---- who ----

/** The kinds of user every case is run as. Fixtures: tests/integration/access/fixtures.ts. */
export const ACTORS = {
  admin: "admin of the demo organisation",
  instructor: "instructor of cohort A (demo organisation)",
  otherInstructor: "instructor of cohort B only (same organisation, another cohort)",
  trainee: "trainee member of cohort A; owns the Bench fixtures (plants, tuning set, saved run)",
  otherTrainee: "trainee of cohort B only: a non-member of cohort A in the same organisation",
  deactivated: "deactivated admin of the demo organisation whose session cookie is still presented",
  anonymous: "no session cookie",
  foreignAdmin: "admin of a second organisation",
  foreignInstructor: "instructor of the second organisation's cohort",
  foreignTrainee: "trainee member of the second organisation's cohort",
} as const;

export type Actor = keyof typeof ACTORS;
export const ALL_ACTORS = Object.keys(ACTORS) as Actor[];

/** Named groups, so an entry reads as a rule. */
export const who = {
  everyone: ALL_ACTORS,
  signedIn: ALL_ACTORS.filter((a) => a !== "anonymous" && a !== "deactivated"),
  demoOrg: ["admin", "instructor", "otherInstructor", "trainee", "otherTrainee"],
  foreignOrg: ["foreignAdmin", "foreignInstructor", "foreignTrainee"],
  admins: ["admin", "foreignAdmin"],
  demoAdmin: ["admin"],
  /** staff of cohort A: its instructors and its organisation's admins */
  cohortStaff: ["admin", "instructor"],
  foreignCohortStaff: ["foreignAdmin", "foreignInstructor"],
  /** the owner of the Bench fixtures */
  owner: ["trainee"],
  /** drill builders: instructors and admins, of either organisation */
  builders: ["admin", "instructor", "otherInstructor", "foreignAdmin", "foreignInstructor"],
  /** the owner of the drill fixtures */
  drillOwner: ["instructor"],
  /** who views a private drill of cohort A's instructor: the owner and the organisation's admins */
  privateDrillViewers: ["admin", "instructor"],
  /** cohort A's members and its organisation's admins */
  cohortMembers: ["admin", "instructor", "trainee"],
  /** who reads the owner's attempt: the owner, cohort A's instructors, the organisation's admins */
  attemptReaders: ["admin", "instructor", "trainee"],
  /** who views a shared drill: also the organisation's other instructors */
  sharedDrillViewers: ["admin", "instructor", "otherInstructor"],
  nobody: [],
} satisfies Record<string, readonly Actor[]>;

// ---- the ids a call is built from ----

/** Things made anew for one cell (one case as one actor) because the call uses them up. */
export interface FreshIds {
  /** a private plant of the owner */
  plantId: string;
  /** a tuning set of the owner (preset plant) */
  tuningSetId: string;
  /** a saved run of the owner (preset plant) */
  runId: string;
  /** an active trainee of the demo organisation, in no cohort */
  userId: string;
  /** an instructor of the demo organisation, in no cohort */
  instructorId: string;
  /** a trainee member of cohort A */
  rosterTraineeId: string;
  /** the link token of an open invitation (trainee, cohort A) */
  invitationToken: string;
  /** the link token of an unused password reset of an active user */
  resetToken: string;
  /** the e-mail address of an active user whose password is MatrixFixtures.password */
  signInEmail: string;
  /** a drill of the drill owner, shared within the organisation, with an open draft v1 */
  drillId: string;
  /** a drill of the drill owner, shared within the organisation, v1 published and no draft */
  publishedDrillId: string;
  /** a started (not submitted) attempt of the owner (cohort A's trainee) on the fixture assignment */
  startedAttemptId: string;
  /** an unsigned tuning record of the owner (shared plant, the fixture tuning set) */
  recordId: string;
}
export type FreshKind = keyof FreshIds;

export interface MatrixFixtures {
  /** demo organisation's cohort A: `instructor` and `trainee` are its members */
  cohortId: string;
  /** demo organisation's cohort B: `otherInstructor` and `otherTrainee` */
  otherCohortId: string;
  /** the second organisation's cohort */
  foreignCohortId: string;
  /** the owner's private plant */
  privatePlantId: string;
  /** the owner's plant shared within the demo organisation */
  sharedPlantId: string;
  /** the owner's saved run of the shared plant */
  runId: string;
  /** the owner's tuning set for the shared plant */
  tuningSetId: string;
  /** the drill owner's (cohort A instructor's) private drill, draft v1 */
  privateDrillId: string;
  /** the drill owner's drill shared within the organisation, v1 published and v2 a draft */
  sharedDrillId: string;
  /** the drill owner's shared drill, archived (hidden from other instructors) */
  archivedDrillId: string;
  /** the user id of the second organisation's instructor */
  foreignInstructorId: string;
  /** cohort A's assignment of the shared drill's published v1: open, due in a week, 50 attempts */
  assignmentId: string;
  /** the owner's (cohort A trainee's) verified attempt of that assignment */
  verifiedAttemptId: string;
  /** the owner's unsigned tuning record of the shared plant */
  recordId: string;
  /** the upload behind the owner's private twin */
  privateUploadId: string;
  /** the upload behind the owner's twin shared within the demo organisation */
  sharedUploadId: string;
  presetId: string;
  /** the password of every fixture user (the acting user's current password) */
  password: string;
  /** new for every cell, usable in names and e-mail local parts; contains "access-matrix" */
  unique: string;
  /** only the kinds the case lists in `fresh` (reading another one fails the test) */
  fresh: FreshIds;
}

// ---- entries ----

export interface RouteRequest {
  /** path and query, with fixture ids filled in */
  url: string;
  /** sent as JSON */
  body?: unknown;
  headers?: Record<string, string>;
}

export interface RouteCase {
  label: string;
  allowed: readonly Actor[];
  request: (fx: MatrixFixtures) => RouteRequest;
  fresh?: readonly FreshKind[];
  /**
   * "status" (default): a refused user gets 401 (signed out) or 403/404.
   * "omit": a list the refused user may read but which must not contain `marker`.
   */
  deny?: "status" | "omit";
  /** text an allowed answer contains and a refused one must not (usually a fixture id) */
  marker?: (fx: MatrixFixtures) => string;
}

export interface RouteEntry {
  kind: "route";
  method: "GET" | "POST" | "PUT" | "PATCH" | "DELETE" | "HEAD" | "OPTIONS";
  /** as in the app folder without route groups: /api/plants/[plantId] */
  path: string;
  rule: string;
  cases: readonly RouteCase[];
}

export interface ActionCase {
  label: string;
  allowed: readonly Actor[];
  /** the FormData fields of a valid call (a File for an upload) */
  form: (fx: MatrixFixtures) => Record<string, string | File>;
  fresh?: readonly FreshKind[];
  /** success is this redirect (the URL, or a pattern it matches) instead of { ok: true } */
  redirectsTo?: string | RegExp;
  /** false when a successful call need not write (default: success changes the database) */
  writes?: boolean;
}

export interface ActionEntry {
  kind: "action";
  /** the "use server" module, from the repository root */
  module: string;
  /** its export */
  name: string;
  rule: string;
  cases: readonly ActionCase[];
}

export type RegistryEntry = RouteEntry | ActionEntry;

export const entryKey = (e: RegistryEntry) => (e.kind === "route" ? `${e.method} ${e.path}` : `${e.module}#${e.name}`);

// ---- documents for valid calls ----

/** A small drying cabinet (fictional), valid for the engine's enclosure schema; the tests' plant too. */
export const SAMPLE_CABINET = {
  kind: "enclosure",
  volumeM3: 0.3,
  wallAreaM2: 2.8,
  wallUValueWPerM2K: 0.7,
  innerFilmCoefficientWPerM2K: 10,
  outerFilmCoefficientWPerM2K: 8,
  wallHeatCapacityJPerK: 20000,
  heaterRatingW: 1500,
  heaterHeatCapacityJPerK: 600,
  heaterTimeConstantS: 80,
  inletAirflowM3PerH: 20,
  ambientC: 19,
  sensorTimeConstantS: 12,
};
const controller = { kind: "pid", form: "standard", kc: 4, ti: 300, td: 30 };
const json = (value: unknown) => JSON.stringify(value);
const plantRef = (id: string) => `plant:${id}`;
const q = encodeURIComponent;
/** An example log (invented data, public/samples) and the mapping it is read with, for upload calls. */
export const SAMPLE_LOG = {
  fileName: "cabinet-bump-decimal-comma.csv",
  mapping: { delimiter: ";", decimalMark: ",", headerRow: true, columns: { time: 0, out: 1, pv: 2, sp: null, mode: null }, timeFormat: "timestamp", temperatureUnit: "C" },
  bytes: () => readFileSync(path.join(process.cwd(), "public/samples/cabinet-bump-decimal-comma.csv")),
} as const;
const sampleLogFile = (name: string) => new File([new Uint8Array(SAMPLE_LOG.bytes())], name, { type: "text/csv" });
const toNewDrill = /^\/drills\/[0-9a-f-]{36}$/;
const toAttempt = /^\/attempts\/[0-9a-f-]{36}$/;
/** A valid submission of an attempt (the replay, not this claim, decides its score). */
const submission = (attemptId: string) => json({ attemptId, submissionKey: randomUUID(), controller, actionLog: [], claimed: { score: 50, results: {} } });

export const ACCESS_REGISTRY: readonly RegistryEntry[] = [
  // ---------------- route handlers ----------------
  {
    kind: "route",
    method: "GET",
    path: "/api/cohorts/[cohortId]/roster",
    rule: "instructors of the cohort and admins of its organisation",
    cases: [
      { label: "cohort A", allowed: who.cohortStaff, request: (fx) => ({ url: `/api/cohorts/${fx.cohortId}/roster` }) },
      { label: "the second organisation's cohort", allowed: who.foreignCohortStaff, request: (fx) => ({ url: `/api/cohorts/${fx.foreignCohortId}/roster` }) },
      { label: "not a cohort id", allowed: who.nobody, request: () => ({ url: "/api/cohorts/not-a-uuid/roster" }) },
    ],
  },
  {
    kind: "route",
    method: "GET",
    path: "/api/plants",
    rule: "any signed-in user; lists presets, own plants and plants shared within the organisation",
    cases: [
      { label: "the owner's private plant is listed", allowed: who.owner, deny: "omit", marker: (fx) => fx.privatePlantId, request: () => ({ url: "/api/plants" }) },
      { label: "a shared plant is listed within its organisation", allowed: who.demoOrg, deny: "omit", marker: (fx) => fx.sharedPlantId, request: () => ({ url: "/api/plants" }) },
      { label: "presets", allowed: who.signedIn, marker: (fx) => `preset:${fx.presetId}`, request: () => ({ url: "/api/plants" }) },
    ],
  },
  {
    kind: "route",
    method: "GET",
    path: "/api/plants/[plantId]",
    rule: "a plant the user may read: own, shared within the organisation, or a preset; 404 otherwise",
    cases: [
      { label: "private plant", allowed: who.owner, request: (fx) => ({ url: `/api/plants/${fx.privatePlantId}` }) },
      { label: "shared plant", allowed: who.demoOrg, request: (fx) => ({ url: `/api/plants/${fx.sharedPlantId}` }) },
      { label: "preset", allowed: who.signedIn, request: (fx) => ({ url: `/api/plants/${fx.presetId}` }) },
    ],
  },
  {
    kind: "route",
    method: "GET",
    path: "/api/runs",
    rule: "any signed-in user; lists only their own saved runs of the plant",
    cases: [
      {
        label: "the owner's run of a shared plant",
        allowed: who.owner,
        deny: "omit",
        marker: (fx) => fx.runId,
        request: (fx) => ({ url: `/api/runs?plant=${q(plantRef(fx.sharedPlantId))}` }),
      },
    ],
  },
  {
    kind: "route",
    method: "GET",
    path: "/api/runs/[runId]",
    rule: "the owner of the saved run only; 404 otherwise",
    cases: [{ label: "the owner's run", allowed: who.owner, marker: (fx) => fx.runId, request: (fx) => ({ url: `/api/runs/${fx.runId}` }) }],
  },
  {
    kind: "route",
    method: "GET",
    path: "/api/tuning-sets",
    rule: "any signed-in user; lists only their own tuning sets for the plant",
    cases: [
      {
        label: "the owner's tuning set of a shared plant",
        allowed: who.owner,
        deny: "omit",
        marker: (fx) => fx.tuningSetId,
        request: (fx) => ({ url: `/api/tuning-sets?plant=${q(plantRef(fx.sharedPlantId))}` }),
      },
    ],
  },

  {
    kind: "route",
    method: "GET",
    path: "/api/records/[recordId]/pdf",
    rule: "signed-in users of the record's organisation (records are hand-over documents shared within it); 404 otherwise",
    cases: [{ label: "the owner's record", allowed: who.demoOrg, request: (fx) => ({ url: `/api/records/${fx.recordId}/pdf` }) }],
  },
  {
    kind: "route",
    method: "GET",
    path: "/api/records/[recordId]/traces",
    rule: "signed-in users of the record's organisation; 404 otherwise",
    cases: [{ label: "the owner's record", allowed: who.demoOrg, marker: (fx) => fx.recordId, request: (fx) => ({ url: `/api/records/${fx.recordId}/traces` }) }],
  },
  {
    kind: "route",
    method: "GET",
    path: "/api/uploads/[uploadId]",
    rule: "the uploader, and whoever may read a twin made from the upload; 404 otherwise",
    cases: [
      { label: "the owner's private twin's log", allowed: who.owner, request: (fx) => ({ url: `/api/uploads/${fx.privateUploadId}` }) },
      { label: "a shared twin's log", allowed: who.demoOrg, request: (fx) => ({ url: `/api/uploads/${fx.sharedUploadId}` }) },
      { label: "no such upload", allowed: who.nobody, request: () => ({ url: `/api/uploads/${randomUUID()}` }) },
    ],
  },
  // ---------------- server actions: accounts ----------------
  {
    kind: "action",
    module: "app/(app)/actions.ts",
    name: "signOut",
    rule: "anyone (ends this request's session, if any)",
    cases: [{ label: "sign out", allowed: who.everyone, form: () => ({}), redirectsTo: "/sign-in", writes: false }],
  },
  {
    kind: "action",
    module: "app/(app)/account/actions.ts",
    name: "changeOwnPassword",
    rule: "any signed-in user, for their own account",
    cases: [{ label: "own password", allowed: who.signedIn, form: (fx) => ({ current: fx.password, password: fx.password, confirm: fx.password }) }],
  },
  {
    kind: "action",
    module: "app/(auth)/sign-in/actions.ts",
    name: "signIn",
    rule: "public",
    cases: [{ label: "right password", allowed: who.everyone, fresh: ["signInEmail"], form: (fx) => ({ email: fx.fresh.signInEmail, password: fx.password }), redirectsTo: "/dashboard" }],
  },
  {
    kind: "action",
    module: "app/(auth)/forgot-password/actions.ts",
    name: "askForReset",
    rule: "public (the same answer for any address)",
    cases: [{ label: "an active account", allowed: who.everyone, fresh: ["signInEmail"], form: (fx) => ({ email: fx.fresh.signInEmail }) }],
  },
  {
    kind: "action",
    module: "app/(auth)/reset-password/[token]/actions.ts",
    name: "chooseNewPassword",
    rule: "public; the link token is the authorization",
    cases: [
      {
        label: "an unused token",
        allowed: who.everyone,
        fresh: ["resetToken"],
        form: (fx) => ({ token: fx.fresh.resetToken, password: "a-new-password-1", confirm: "a-new-password-1" }),
        redirectsTo: "/sign-in?reset=1",
      },
    ],
  },
  {
    kind: "action",
    module: "app/(auth)/invitation/[token]/actions.ts",
    name: "acceptInvite",
    rule: "public; the link token is the authorization",
    cases: [
      {
        label: "an open invitation",
        allowed: who.everyone,
        fresh: ["invitationToken"],
        form: (fx) => ({ token: fx.fresh.invitationToken, displayName: "Invited Person", password: "a-new-password-1", confirm: "a-new-password-1" }),
        redirectsTo: "/dashboard?welcome=1",
      },
    ],
  },

  // ---------------- server actions: administration ----------------
  {
    kind: "action",
    module: "app/(app)/admin/actions.ts",
    name: "inviteUser",
    rule: "admins, into their own organisation (and its cohorts)",
    cases: [
      { label: "a trainee into cohort A", allowed: who.demoAdmin, form: (fx) => ({ email: `${fx.unique}@access-matrix.test`, role: "trainee", cohortId: fx.cohortId }) },
      { label: "an instructor, no cohort", allowed: who.admins, form: (fx) => ({ email: `${fx.unique}@access-matrix.test`, role: "instructor", cohortId: "" }) },
      { label: "a trainee into the second organisation's cohort", allowed: ["foreignAdmin"], form: (fx) => ({ email: `${fx.unique}@access-matrix.test`, role: "trainee", cohortId: fx.foreignCohortId }) },
    ],
  },
  {
    kind: "action",
    module: "app/(app)/admin/actions.ts",
    name: "setActive",
    rule: "admins, for users of their own organisation",
    cases: [{ label: "deactivate a trainee of the demo organisation", allowed: who.demoAdmin, fresh: ["userId"], form: (fx) => ({ userId: fx.fresh.userId, active: "false" }) }],
  },
  {
    kind: "action",
    module: "app/(app)/admin/actions.ts",
    name: "createCohort",
    rule: "admins, in their own organisation",
    cases: [{ label: "a new cohort", allowed: who.admins, form: (fx) => ({ name: `Access matrix ${fx.unique}`, timeZone: "Europe/Dublin" }) }],
  },
  {
    kind: "action",
    module: "app/(app)/admin/actions.ts",
    name: "addInstructor",
    rule: "admins, for a cohort and an instructor of their own organisation",
    cases: [
      { label: "an instructor into cohort A", allowed: who.demoAdmin, fresh: ["instructorId"], form: (fx) => ({ cohortId: fx.cohortId, userId: fx.fresh.instructorId }) },
      // across organisations: neither admin has both the cohort and the instructor
      { label: "a demo instructor into the second organisation's cohort", allowed: who.nobody, fresh: ["instructorId"], form: (fx) => ({ cohortId: fx.foreignCohortId, userId: fx.fresh.instructorId }) },
      { label: "the second organisation's instructor into cohort A", allowed: who.nobody, form: (fx) => ({ cohortId: fx.cohortId, userId: fx.foreignInstructorId }) },
    ],
  },

  // ---------------- server actions: cohorts ----------------
  {
    kind: "action",
    module: "app/(app)/cohorts/[cohortId]/actions.ts",
    name: "inviteTrainee",
    rule: "instructors of the cohort and admins of its organisation",
    cases: [
      { label: "into cohort A", allowed: who.cohortStaff, form: (fx) => ({ cohortId: fx.cohortId, email: `${fx.unique}@access-matrix.test` }) },
      { label: "into the second organisation's cohort", allowed: who.foreignCohortStaff, form: (fx) => ({ cohortId: fx.foreignCohortId, email: `${fx.unique}@access-matrix.test` }) },
    ],
  },
  {
    kind: "action",
    module: "app/(app)/cohorts/[cohortId]/actions.ts",
    name: "removeTrainee",
    rule: "instructors of the cohort and admins of its organisation",
    cases: [
      { label: "a trainee of cohort A", allowed: who.cohortStaff, fresh: ["rosterTraineeId"], form: (fx) => ({ cohortId: fx.cohortId, userId: fx.fresh.rosterTraineeId }) },
      // the staff of cohort B name cohort A's trainee under their own cohort: nothing to remove there
      { label: "a trainee of cohort A, named under cohort B", allowed: who.nobody, fresh: ["rosterTraineeId"], form: (fx) => ({ cohortId: fx.otherCohortId, userId: fx.fresh.rosterTraineeId }) },
    ],
  },

  // ---------------- server actions: the Bench's saved work ----------------
  {
    kind: "action",
    module: "app/(app)/bench/actions.ts",
    name: "savePlant",
    rule: "any signed-in user, as the owner",
    cases: [{ label: "a new plant", allowed: who.signedIn, form: (fx) => ({ payload: json({ name: `Cabinet ${fx.unique}`, description: "", definition: SAMPLE_CABINET }) }) }],
  },
  {
    kind: "action",
    module: "app/(app)/bench/actions.ts",
    name: "updatePlant",
    rule: "the owner only (a shared plant is read-only to the organisation)",
    cases: [
      { label: "the shared plant", allowed: who.owner, form: (fx) => ({ payload: json({ plantId: fx.sharedPlantId, name: `Shared cabinet ${fx.unique}`, description: "", definition: SAMPLE_CABINET }) }) },
      { label: "the private plant", allowed: who.owner, form: (fx) => ({ payload: json({ plantId: fx.privatePlantId, name: `Private cabinet ${fx.unique}`, description: "", definition: SAMPLE_CABINET }) }) },
    ],
  },
  {
    kind: "action",
    module: "app/(app)/bench/actions.ts",
    name: "deletePlant",
    rule: "the owner only",
    cases: [{ label: "a private plant", allowed: who.owner, fresh: ["plantId"], form: (fx) => ({ id: fx.fresh.plantId }) }],
  },
  {
    kind: "action",
    module: "app/(app)/bench/actions.ts",
    name: "setPlantShared",
    rule: "the owner only",
    cases: [
      { label: "keep the shared plant shared", allowed: who.owner, form: (fx) => ({ id: fx.sharedPlantId, shared: "true" }) },
      { label: "share a private plant", allowed: who.owner, fresh: ["plantId"], form: (fx) => ({ id: fx.fresh.plantId, shared: "true" }) },
    ],
  },
  {
    kind: "action",
    module: "app/(app)/bench/actions.ts",
    name: "saveTuningSet",
    rule: "any signed-in user, for a plant they may read",
    cases: [
      { label: "for a preset", allowed: who.signedIn, form: (fx) => ({ payload: json({ plantRef: `preset:${fx.presetId}`, name: `PI ${fx.unique}`, controller }) }) },
      { label: "for the shared plant", allowed: who.demoOrg, form: (fx) => ({ payload: json({ plantRef: plantRef(fx.sharedPlantId), name: `PI ${fx.unique}`, controller }) }) },
      { label: "for the private plant", allowed: who.owner, form: (fx) => ({ payload: json({ plantRef: plantRef(fx.privatePlantId), name: `PI ${fx.unique}`, controller }) }) },
    ],
  },
  {
    kind: "action",
    module: "app/(app)/bench/actions.ts",
    name: "deleteTuningSet",
    rule: "the owner only",
    cases: [{ label: "the owner's tuning set", allowed: who.owner, fresh: ["tuningSetId"], form: (fx) => ({ id: fx.fresh.tuningSetId }) }],
  },
  {
    kind: "action",
    module: "app/(app)/bench/actions.ts",
    name: "saveRun",
    rule: "any signed-in user, for a plant they may read",
    cases: [
      {
        label: "of a preset",
        allowed: who.signedIn,
        form: (fx) => ({
          payload: json({ plantRef: `preset:${fx.presetId}`, title: `Run ${fx.unique}`, drill: ladder, controller, seed: 7, actionLog: [], results: {}, engineVersion: "1.0.0", durationS: 600 }),
        }),
      },
      {
        label: "of the private plant",
        allowed: who.owner,
        form: (fx) => ({
          payload: json({ plantRef: plantRef(fx.privatePlantId), title: `Run ${fx.unique}`, drill: ladder, controller, seed: 7, actionLog: [], results: {}, engineVersion: "1.0.0", durationS: 600 }),
        }),
      },
    ],
  },
  {
    kind: "action",
    module: "app/(app)/bench/actions.ts",
    name: "deleteRun",
    rule: "the owner only",
    cases: [{ label: "the owner's saved run", allowed: who.owner, fresh: ["runId"], form: (fx) => ({ id: fx.fresh.runId }) }],
  },

  // ---------------- drills (builder: instructors and admins) ----------------
  {
    kind: "route",
    method: "GET",
    path: "/api/drills",
    rule: "instructors and admins (trainees 403); lists own drills, shared ones of the organisation, all of it for admins",
    cases: [
      { label: "a private drill is listed", allowed: who.privateDrillViewers, deny: "omit", marker: (fx) => fx.privateDrillId, request: () => ({ url: "/api/drills" }) },
      { label: "a shared drill is listed", allowed: who.sharedDrillViewers, deny: "omit", marker: (fx) => fx.sharedDrillId, request: () => ({ url: "/api/drills" }) },
      { label: "the list itself", allowed: who.builders, request: () => ({ url: "/api/drills?archived=1" }) },
    ],
  },
  {
    kind: "route",
    method: "GET",
    path: "/api/drills/[drillId]",
    rule: "instructors and admins who may view the drill; 404 otherwise, trainees 403",
    cases: [
      { label: "private drill", allowed: who.privateDrillViewers, marker: (fx) => fx.privateDrillId, request: (fx) => ({ url: `/api/drills/${fx.privateDrillId}` }) },
      { label: "shared drill", allowed: who.sharedDrillViewers, marker: (fx) => fx.sharedDrillId, request: (fx) => ({ url: `/api/drills/${fx.sharedDrillId}` }) },
      { label: "archived shared drill", allowed: who.privateDrillViewers, marker: (fx) => fx.archivedDrillId, request: (fx) => ({ url: `/api/drills/${fx.archivedDrillId}` }) },
    ],
  },
  {
    kind: "route",
    method: "GET",
    path: "/api/drills/[drillId]/versions/[version]",
    rule: "instructors and admins who may view the drill; 404 otherwise, trainees 403",
    cases: [
      { label: "private drill, latest", allowed: who.privateDrillViewers, marker: (fx) => fx.privateDrillId, request: (fx) => ({ url: `/api/drills/${fx.privateDrillId}/versions/latest` }) },
      { label: "shared drill, published v1", allowed: who.sharedDrillViewers, marker: (fx) => fx.sharedDrillId, request: (fx) => ({ url: `/api/drills/${fx.sharedDrillId}/versions/1` }) },
    ],
  },
  {
    kind: "action",
    module: "app/(app)/drills/actions.ts",
    name: "createDrill",
    rule: "instructors and admins, as the owner",
    cases: [{ label: "from a starter", allowed: who.builders, form: (fx) => ({ title: `Drill ${fx.unique}`, starter: "setpoint-step" }), redirectsTo: toNewDrill }],
  },
  {
    kind: "action",
    module: "app/(app)/drills/actions.ts",
    name: "saveDraft",
    rule: "the drill's owner only",
    cases: [
      { label: "the private drill's draft", allowed: who.drillOwner, form: (fx) => ({ drillId: fx.privateDrillId, payload: json({ ...ladder, title: `Drill ${fx.unique}` }) }) },
      { label: "the shared drill's draft", allowed: who.drillOwner, form: (fx) => ({ drillId: fx.sharedDrillId, payload: json({ ...ladder, title: `Drill ${fx.unique}` }) }) },
    ],
  },
  {
    kind: "action",
    module: "app/(app)/drills/actions.ts",
    name: "publishDraft",
    rule: "the drill's owner only",
    cases: [{ label: "a shared drill's draft", allowed: who.drillOwner, fresh: ["drillId"], form: (fx) => ({ drillId: fx.fresh.drillId }) }],
  },
  {
    kind: "action",
    module: "app/(app)/drills/actions.ts",
    name: "newDraftFromPublished",
    rule: "the drill's owner only",
    cases: [{ label: "a shared drill's published v1", allowed: who.drillOwner, fresh: ["publishedDrillId"], form: (fx) => ({ drillId: fx.fresh.publishedDrillId, fromVersion: "1" }) }],
  },
  {
    kind: "action",
    module: "app/(app)/drills/actions.ts",
    name: "duplicateDrill",
    rule: "instructors and admins who may view the drill; the copy is theirs",
    cases: [
      { label: "the private drill", allowed: who.privateDrillViewers, form: (fx) => ({ drillId: fx.privateDrillId }), redirectsTo: toNewDrill },
      { label: "the shared drill", allowed: who.sharedDrillViewers, form: (fx) => ({ drillId: fx.sharedDrillId }), redirectsTo: toNewDrill },
      { label: "the archived shared drill", allowed: who.privateDrillViewers, form: (fx) => ({ drillId: fx.archivedDrillId }), redirectsTo: toNewDrill },
    ],
  },
  {
    kind: "action",
    module: "app/(app)/drills/actions.ts",
    name: "setDrillShared",
    rule: "the drill's owner only",
    cases: [
      { label: "keep the shared drill shared", allowed: who.drillOwner, form: (fx) => ({ drillId: fx.sharedDrillId, shared: "true" }) },
      { label: "keep the private drill private", allowed: who.drillOwner, form: (fx) => ({ drillId: fx.privateDrillId, shared: "false" }) },
    ],
  },
  {
    kind: "action",
    module: "app/(app)/drills/actions.ts",
    name: "archiveDrill",
    rule: "the drill's owner only",
    cases: [{ label: "a shared drill", allowed: who.drillOwner, fresh: ["drillId"], form: (fx) => ({ drillId: fx.fresh.drillId, archived: "true" }) }],
  },

  // ---------------- classroom: assignments, attempts, standings ----------------
  {
    kind: "route",
    method: "GET",
    path: "/api/assignments/[assignmentId]/standings",
    rule: "members of the assignment's cohort and its organisation's admins; trainees see what its visibility allows",
    cases: [
      { label: "cohort A's assignment", allowed: who.cohortMembers, request: (fx) => ({ url: `/api/assignments/${fx.assignmentId}/standings` }) },
      { label: "all attempts", allowed: who.cohortMembers, request: (fx) => ({ url: `/api/assignments/${fx.assignmentId}/standings?view=all` }) },
      { label: "not an assignment id", allowed: who.nobody, request: () => ({ url: "/api/assignments/not-a-uuid/standings" }) },
    ],
  },
  {
    kind: "route",
    method: "GET",
    path: "/api/assignments/[assignmentId]/standings/csv",
    rule: "instructors of the assignment's cohort and its organisation's admins",
    cases: [{ label: "cohort A's assignment", allowed: who.cohortStaff, request: (fx) => ({ url: `/api/assignments/${fx.assignmentId}/standings/csv?view=all` }) }],
  },
  {
    kind: "route",
    method: "GET",
    path: "/api/attempts/[attemptId]",
    rule: "the attempt's trainee, instructors of its cohort, its organisation's admins; 404 otherwise",
    cases: [{ label: "the owner's verified attempt", allowed: who.attemptReaders, marker: (fx) => fx.verifiedAttemptId, request: (fx) => ({ url: `/api/attempts/${fx.verifiedAttemptId}` }) }],
  },
  {
    kind: "action",
    module: "app/(app)/cohorts/[cohortId]/actions.ts",
    name: "createAssignment",
    rule: "instructors of the cohort and admins of its organisation, for a published version they may view",
    cases: [
      {
        label: "the shared drill's v1 to cohort A",
        allowed: who.cohortStaff,
        form: (fx) => ({ cohortId: fx.cohortId, drillVersion: `${fx.sharedDrillId}:1`, title: `Assignment ${fx.unique}`, opensAt: "2026-01-05T09:00", dueAt: "2026-01-12T17:00", attemptLimit: "3", lateRule: "accept-marked", latePenaltyPercent: "0", visibility: "initials" }),
      },
    ],
  },
  {
    kind: "action",
    module: "app/(app)/assignments/actions.ts",
    name: "startAttempt",
    rule: "trainee members of the assignment's cohort (the server issues the id and seed and counts it)",
    cases: [{ label: "cohort A's assignment", allowed: who.owner, form: (fx) => ({ assignmentId: fx.assignmentId }), redirectsTo: toAttempt }],
  },
  {
    kind: "action",
    module: "app/(app)/assignments/actions.ts",
    name: "setStandingsVisibility",
    rule: "instructors of the assignment's cohort and its organisation's admins",
    cases: [{ label: "initials", allowed: who.cohortStaff, form: (fx) => ({ assignmentId: fx.assignmentId, visibility: "initials" }), writes: false }],
  },
  {
    kind: "action",
    module: "app/(app)/attempts/[attemptId]/actions.ts",
    name: "submitAttempt",
    rule: "the attempt's trainee only, once (a retry with the same key is answered again)",
    cases: [{ label: "the owner's started attempt", allowed: who.owner, fresh: ["startedAttemptId"], form: (fx) => ({ payload: submission(fx.fresh.startedAttemptId) }) }],
  },
  {
    kind: "action",
    module: "app/(app)/attempts/[attemptId]/actions.ts",
    name: "leaveFeedback",
    rule: "instructors of the attempt's cohort and its organisation's admins",
    cases: [{ label: "the owner's verified attempt", allowed: who.cohortStaff, form: (fx) => ({ attemptId: fx.verifiedAttemptId, body: `Good recovery after the door opened. ${fx.unique}` }) }],
  },
  // ---------------- server actions: twins ----------------
  {
    kind: "action",
    module: "app/(app)/twins/actions.ts",
    name: "acceptTwin",
    rule: "any signed-in user, as the owner of the new twin and its upload",
    cases: [
      {
        label: "an example log, FOPDT",
        allowed: who.signedIn,
        form: (fx) => ({
          file: sampleLogFile(`${fx.unique}.csv`),
          mapping: json(SAMPLE_LOG.mapping),
          choice: "fopdt",
          name: `Twin ${fx.unique}`,
          description: "",
          ambientC: "",
          shared: "false",
        }),
      },
    ],
  },
  {
    kind: "action",
    module: "app/(app)/twins/actions.ts",
    name: "setTwinShared",
    rule: "the owner only",
    cases: [
      { label: "keep the shared plant shared", allowed: who.owner, form: (fx) => ({ id: fx.sharedPlantId, shared: "true" }) },
      { label: "share a private plant", allowed: who.owner, fresh: ["plantId"], form: (fx) => ({ id: fx.fresh.plantId, shared: "true" }) },
    ],
  },
  // ---------------- server actions: tuning records ----------------
  {
    kind: "action",
    module: "app/(app)/records/actions.ts",
    name: "createTuningRecord",
    rule: "any signed-in user, from their own tuning set on a plant they may read",
    cases: [
      {
        label: "from the owner's tuning set of the shared plant",
        allowed: who.owner,
        form: (fx) => ({ payload: json({ plantRef: plantRef(fx.sharedPlantId), tuningSetId: fx.tuningSetId, title: `Record ${fx.unique}`, proofTests: [] }) }),
      },
    ],
  },
  {
    kind: "action",
    module: "app/(app)/records/actions.ts",
    name: "updateTuningRecord",
    rule: "the author only, until sign-off",
    cases: [{ label: "the owner's record", allowed: who.owner, form: (fx) => ({ recordId: fx.recordId, title: `Record ${fx.unique}`, notes: "" }) }],
  },
  {
    kind: "action",
    module: "app/(app)/records/actions.ts",
    name: "signOffTuningRecord",
    rule: "the author only, once",
    cases: [
      {
        label: "an unsigned record of the owner",
        allowed: who.owner,
        fresh: ["recordId"],
        form: (fx) => ({ recordId: fx.fresh.recordId, name: "Fixture Signer", date: new Date().toISOString().slice(0, 10) }),
      },
    ],
  },
];
