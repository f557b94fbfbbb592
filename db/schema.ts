import { sql } from "drizzle-orm";
import {
  bigint,
  customType,
  boolean,
  check,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";

// The foundation's tables. Later issues add tables through new migrations (npm run db:generate),
// never by editing an applied one.

export const userRole = pgEnum("user_role", ["admin", "instructor", "trainee"]);
export const userStatus = pgEnum("user_status", ["active", "deactivated"]);
export const membershipRole = pgEnum("membership_role", ["trainee", "instructor"]);

const createdAt = () => timestamp("created_at", { withTimezone: true, mode: "date" }).notNull().defaultNow();
// the organisation a row belongs to, and the user who owns it (references resolved lazily)
const organizationRef = () =>
  uuid("organization_id")
    .notNull()
    .references(() => organizations.id);
const ownerRef = () =>
  text("owner_id")
    .notNull()
    .references(() => users.id);

export const organizations = pgTable("organizations", {
  id: uuid("id").primaryKey().defaultRandom(),
  name: text("name").notNull(),
  createdAt: createdAt(),
});

export const users = pgTable(
  "users",
  {
    // Lucia wants a string id.
    id: text("id").primaryKey(),
    organizationId: organizationRef(),
    email: text("email").notNull(),
    displayName: text("display_name").notNull(),
    passwordHash: text("password_hash").notNull(),
    role: userRole("role").notNull(),
    status: userStatus("status").notNull().default("active"),
    deactivatedAt: timestamp("deactivated_at", { withTimezone: true, mode: "date" }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("users_email_unique").on(sql`lower(${t.email})`), index("users_org_idx").on(t.organizationId)],
);

export const sessions = pgTable(
  "sessions",
  {
    id: text("id").primaryKey(),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    expiresAt: timestamp("expires_at", { withTimezone: true, mode: "date" }).notNull(),
  },
  (t) => [index("sessions_user_idx").on(t.userId)],
);

export const passwordResetTokens = pgTable(
  "password_reset_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    // SHA-256 of the token; the token itself only ever exists in the e-mail.
    tokenHash: text("token_hash").notNull().unique(),
    expiresAt: timestamp("expires_at", { withTimezone: true, mode: "date" }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true, mode: "date" }),
    createdAt: createdAt(),
  },
  (t) => [index("password_reset_user_idx").on(t.userId)],
);

export const cohorts = pgTable(
  "cohorts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: organizationRef(),
    name: text("name").notNull(),
    // IANA time zone; assignment dates are shown and interpreted in it.
    timeZone: text("time_zone").notNull(),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("cohorts_org_name_unique").on(t.organizationId, t.name)],
);

export const cohortMemberships = pgTable(
  "cohort_memberships",
  {
    cohortId: uuid("cohort_id")
      .notNull()
      .references(() => cohorts.id, { onDelete: "cascade" }),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: membershipRole("role").notNull(),
    joinedAt: timestamp("joined_at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
    // A removed trainee keeps their records; removal hides them from the roster and standings.
    removedAt: timestamp("removed_at", { withTimezone: true, mode: "date" }),
  },
  (t) => [primaryKey({ columns: [t.cohortId, t.userId] }), index("memberships_user_idx").on(t.userId)],
);

export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: organizationRef(),
    cohortId: uuid("cohort_id").references(() => cohorts.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: userRole("role").notNull(),
    invitedBy: text("invited_by")
      .notNull()
      .references(() => users.id),
    tokenHash: text("token_hash").notNull().unique(),
    expiresAt: timestamp("expires_at", { withTimezone: true, mode: "date" }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true, mode: "date" }),
    acceptedUserId: text("accepted_user_id").references(() => users.id),
    revoked: boolean("revoked").notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [index("invitations_cohort_idx").on(t.cohortId), index("invitations_email_idx").on(sql`lower(${t.email})`)],
);

// Failed sign-ins per key ("account:<email>" or "address:<ip>"), in PostgreSQL because the app
// servers are stateless and any of them may see the next attempt.
export const signInAttempts = pgTable("sign_in_attempts", {
  key: text("key").primaryKey(),
  failures: integer("failures").notNull().default(0),
  windowStartedAt: timestamp("window_started_at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
  lockedUntil: timestamp("locked_until", { withTimezone: true, mode: "date" }),
});

// Mail received by the local SMTP catcher (development and demo installations).
export const caughtMail = pgTable(
  "caught_mail",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    receivedAt: timestamp("received_at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
    envelopeFrom: text("envelope_from").notNull(),
    envelopeTo: text("envelope_to").array().notNull(),
    subject: text("subject").notNull().default(""),
    textBody: text("text_body").notNull().default(""),
    raw: text("raw").notNull(),
  },
  (t) => [index("caught_mail_received_idx").on(t.receivedAt)],
);

export type UserRole = (typeof userRole.enumValues)[number];
export type User = typeof users.$inferSelect;

// ---- The Bench's saved work (migration 0001_bench_saved_work) ----
// A plant reference is "preset:<presetId>" (the engine's built-in rigs) or "plant:<uuid>" (a row of
// `plants`). Tuning sets and saved runs carry the reference as text, so a preset needs no row.
// JSON columns hold documents already validated with the engine's zod schemas (sim/): the
// application is the only writer. The trace of a saved run is never stored; replay re-derives it.

export const plantOrigin = pgEnum("plant_origin", ["physical", "twin"]);

/** Raw bytes (bytea), read and written as a Node Buffer. */
const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => "bytea" });

// ---- Twins (migration 0005_twins_and_records) ----
// A data upload is a bump-test log exactly as the technician uploaded it: the raw bytes and their
// SHA-256, so an identification can always be redone from the original. The mapping (columns,
// time format, decimal mark, unit) it was read with is kept beside it. A twin is a plant row with
// origin "twin" whose source_upload_id points here; uploads are never changed once written.

export const dataUploads = pgTable(
  "data_uploads",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: organizationRef(),
    ownerId: ownerRef(),
    fileName: text("file_name").notNull(),
    byteSize: integer("byte_size").notNull(),
    /** lowercase hex SHA-256 of `content` */
    sha256: text("sha256").notNull(),
    content: bytea("content").notNull(),
    /** a LogMapping (sim/import/log-mapping.ts) */
    mapping: jsonb("mapping").$type<Record<string, unknown>>().notNull(),
    /** what was read: rows, time span, sampling, noise and quantization (sim/import) */
    summary: jsonb("summary").$type<Record<string, unknown>>().notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("data_uploads_owner_idx").on(t.ownerId, t.createdAt), check("data_uploads_sha256_hex", sql`${t.sha256} ~ '^[0-9a-f]{64}$'`)],
);

export const plants = pgTable(
  "plants",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: organizationRef(),
    ownerId: ownerRef(),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    /** a PlantDefinition (sim/plant/plant-definition.ts), parsed output with defaults filled */
    definition: jsonb("definition").$type<Record<string, unknown>>().notNull(),
    origin: plantOrigin("origin").notNull().default("physical"),
    /** readable by every signed-in user of the organisation; only the owner edits */
    shared: boolean("shared").notNull().default(false),
    /** a twin's bump-test log (migration 0005); null for plants described physically */
    sourceUploadId: uuid("source_upload_id").references(() => dataUploads.id, { onDelete: "restrict" }),
    /** a twin's identification: the candidates with fit quality, the chosen one, noise and quantization */
    identification: jsonb("identification").$type<Record<string, unknown>>(),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
  },
  (t) => [
    index("plants_owner_idx").on(t.ownerId),
    index("plants_org_shared_idx").on(t.organizationId, t.shared),
    check("plants_twin_has_source", sql`${t.origin} <> 'twin' OR ${t.sourceUploadId} IS NOT NULL OR ${t.identification} IS NULL`),
  ],
);

export const tuningSets = pgTable(
  "tuning_sets",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: organizationRef(),
    ownerId: ownerRef(),
    plantRef: text("plant_ref").notNull(),
    name: text("name").notNull(),
    /** a ControllerConfig (sim/control/config.ts) */
    controller: jsonb("controller").$type<Record<string, unknown>>().notNull(),
    notes: text("notes").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("tuning_sets_owner_plant_name_unique").on(t.ownerId, t.plantRef, t.name)],
);

export const savedRuns = pgTable(
  "saved_runs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: organizationRef(),
    ownerId: ownerRef(),
    plantRef: text("plant_ref").notNull(),
    title: text("title").notNull(),
    /** the drill document the Bench ran (sim/drill/schema.ts, parsed) */
    drill: jsonb("drill").$type<Record<string, unknown>>().notNull(),
    /** the controller configuration at the start of the run */
    controller: jsonb("controller").$type<Record<string, unknown>>().notNull(),
    // bigint: a drill seed spans 0 … 2³² − 1, beyond PostgreSQL's integer
    seed: bigint("seed", { mode: "number" }).notNull(),
    /** the stamped operator actions (sim/drill/actions.ts) */
    actionLog: jsonb("action_log").$type<unknown[]>().notNull(),
    /** run results as the Bench computed them (sim/drill/results.ts); a record, not a score */
    results: jsonb("results").$type<Record<string, unknown>>().notNull(),
    engineVersion: text("engine_version").notNull(),
    durationS: doublePrecision("duration_s").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("saved_runs_owner_plant_idx").on(t.ownerId, t.plantRef, t.createdAt)],
);

export type PlantRow = typeof plants.$inferSelect;
export type TuningSetRow = typeof tuningSets.$inferSelect;
export type SavedRunRow = typeof savedRuns.$inferSelect;

// ---- Drills (migration 0002_drill_builder) ----
// A drill is an instructor's scenario; its content lives in numbered versions. A version is a
// draft (at most one per drill, edited in place by its owner) or published (frozen: the
// application never updates it, and a trigger of migration 0002 refuses any UPDATE or DELETE of a
// published row). Editing a published drill starts a new draft version N+1. Attempts (later
// work) reference a drill_versions row, so standings compare runs of the same document.

export const drillVersionStatus = pgEnum("drill_version_status", ["draft", "published"]);

export const drills = pgTable(
  "drills",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: organizationRef(),
    ownerId: ownerRef(),
    /** the latest version's title, kept here for lists */
    title: text("title").notNull(),
    /** readable and duplicable by the organisation's instructors; only the owner edits */
    sharedWithOrg: boolean("shared_with_org").notNull().default(false),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
    archivedAt: timestamp("archived_at", { withTimezone: true, mode: "date" }),
  },
  (t) => [index("drills_owner_idx").on(t.ownerId), index("drills_org_shared_idx").on(t.organizationId, t.sharedWithOrg)],
);

export const drillVersions = pgTable(
  "drill_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    drillId: uuid("drill_id")
      .notNull()
      .references(() => drills.id),
    version: integer("version").notNull(),
    status: drillVersionStatus("status").notNull().default("draft"),
    /** a drill document (sim/drill/schema.ts, parsed output) whose id is the drill's and revision this version */
    document: jsonb("document").$type<Record<string, unknown>>().notNull(),
    publishedAt: timestamp("published_at", { withTimezone: true, mode: "date" }),
    createdBy: text("created_by")
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex("drill_versions_drill_version_unique").on(t.drillId, t.version),
    uniqueIndex("drill_versions_one_draft").on(t.drillId).where(sql`${t.status} = 'draft'`),
    check("drill_versions_version_positive", sql`${t.version} >= 1`),
    check("drill_versions_published_at", sql`(${t.status} = 'published') = (${t.publishedAt} is not null)`),
  ],
);

export type DrillRow = typeof drills.$inferSelect;
export type DrillVersionRow = typeof drillVersions.$inferSelect;

// ---- Assignments and attempts (migration 0003_classroom) ----
// An assignment gives one published drill version to one cohort. An attempt is one trainee's run
// of it: the server issues its id and seed and counts it at once (an abandoned attempt still
// counts); the submission carries the inputs (starting controller, action log) and the browser's
// claimed results; the queue worker replays it and writes the official results. Standings read
// the summary columns, which only the replay writes.

export const lateRule = pgEnum("late_rule", ["refuse", "accept-marked", "accept-penalty"]);
export const standingsVisibility = pgEnum("standings_visibility", ["names", "initials", "own-rank"]);
export const attemptStatus = pgEnum("attempt_status", ["started", "submitted", "verified", "failed"]);

export const assignments = pgTable(
  "assignments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: organizationRef(),
    cohortId: uuid("cohort_id")
      .notNull()
      .references(() => cohorts.id),
    drillVersionId: uuid("drill_version_id")
      .notNull()
      .references(() => drillVersions.id),
    title: text("title").notNull(),
    opensAt: timestamp("opens_at", { withTimezone: true, mode: "date" }).notNull(),
    dueAt: timestamp("due_at", { withTimezone: true, mode: "date" }).notNull(),
    attemptLimit: integer("attempt_limit").notNull(),
    lateRule: lateRule("late_rule").notNull().default("accept-marked"),
    /** accept-penalty: the score is multiplied by (1 − latePenaltyPercent/100) */
    latePenaltyPercent: integer("late_penalty_percent").notNull().default(0),
    visibility: standingsVisibility("visibility").notNull().default("initials"),
    createdBy: ownerRef(),
    createdAt: createdAt(),
    /** set once the "assignment open" e-mail has gone to the roster (idempotent notice) */
    openNoticeSentAt: timestamp("open_notice_sent_at", { withTimezone: true, mode: "date" }),
    archivedAt: timestamp("archived_at", { withTimezone: true, mode: "date" }),
  },
  (t) => [
    index("assignments_cohort_idx").on(t.cohortId, t.dueAt),
    check("assignments_due_after_open", sql`${t.dueAt} > ${t.opensAt}`),
    check("assignments_limit_range", sql`${t.attemptLimit} between 1 and 50`),
    check("assignments_penalty_range", sql`${t.latePenaltyPercent} between 0 and 100`),
  ],
);

export const attempts = pgTable(
  "attempts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    assignmentId: uuid("assignment_id")
      .notNull()
      .references(() => assignments.id),
    traineeId: text("trainee_id")
      .notNull()
      .references(() => users.id),
    drillVersionId: uuid("drill_version_id")
      .notNull()
      .references(() => drillVersions.id),
    /** 1, 2, … per trainee and assignment, counted when started */
    number: integer("number").notNull(),
    seed: bigint("seed", { mode: "number" }).notNull(),
    status: attemptStatus("status").notNull().default("started"),
    startedAt: createdAt(),
    submittedAt: timestamp("submitted_at", { withTimezone: true, mode: "date" }),
    /** the key of the submission that was accepted; a retry with the same key is answered again */
    submissionKey: uuid("submission_key"),
    late: boolean("late").notNull().default(false),
    controller: jsonb("controller").$type<Record<string, unknown>>(),
    actionLog: jsonb("action_log").$type<unknown[]>(),
    claimedScore: doublePrecision("claimed_score"),
    claimedFingerprint: text("claimed_fingerprint"),
    claimedResults: jsonb("claimed_results").$type<Record<string, unknown>>(),
    // ---- official, written only by the replay ----
    verifiedAt: timestamp("verified_at", { withTimezone: true, mode: "date" }),
    engineVersion: text("engine_version"),
    officialFingerprint: text("official_fingerprint"),
    officialResults: jsonb("official_results").$type<Record<string, unknown>>(),
    /** AttemptScore and per-window feedback (sim/drill/score.ts, feedback.ts) */
    officialScoreDetail: jsonb("official_score_detail").$type<Record<string, unknown>>(),
    score: doublePrecision("score"),
    rawScore: doublePrecision("raw_score"),
    settlingTimeS: doublePrecision("settling_time_s"),
    overshootC: doublePrecision("overshoot_c"),
    iae: doublePrecision("iae"),
    recoveryTimeS: doublePrecision("recovery_time_s"),
    energyKWh: doublePrecision("energy_kwh"),
    safetyTrips: integer("safety_trips"),
    violations: text("violations").array(),
    flagged: boolean("flagged").notNull().default(false),
    flagReason: text("flag_reason"),
    failureReason: text("failure_reason"),
    verifyRuns: integer("verify_runs").notNull().default(0),
  },
  (t) => [
    uniqueIndex("attempts_assignment_trainee_number_unique").on(t.assignmentId, t.traineeId, t.number),
    index("attempts_standings_idx").on(t.assignmentId, t.status, t.score),
    index("attempts_trainee_idx").on(t.traineeId, t.assignmentId),
    // the standings' change stamp reads the latest verification and start by index (standings.ts)
    index("attempts_assignment_verified_idx").on(t.assignmentId, t.verifiedAt),
    index("attempts_assignment_started_idx").on(t.assignmentId, t.startedAt),
    check("attempts_number_positive", sql`${t.number} >= 1`),
  ],
);

export const attemptFeedback = pgTable(
  "attempt_feedback",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    attemptId: uuid("attempt_id")
      .notNull()
      .references(() => attempts.id),
    authorId: text("author_id")
      .notNull()
      .references(() => users.id),
    body: text("body").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("attempt_feedback_attempt_idx").on(t.attemptId, t.createdAt)],
);

export type AssignmentRow = typeof assignments.$inferSelect;
export type AttemptRow = typeof attempts.$inferSelect;

export type DataUploadRow = typeof dataUploads.$inferSelect;

// ---- Tuning records (migration 0005_twins_and_records) ----
// The hand-over document of one loop. `document` is a snapshot validated by
// app/_lib/records/record-document.ts: the plant as it was, the model, the tuning, the tests with
// their drills, seeds and results. Trends are not stored: the server re-runs each test (the engine
// is deterministic) for the page, the PDF and the traces CSV. A signed-off record is frozen.

export const tuningRecords = pgTable(
  "tuning_records",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    organizationId: organizationRef(),
    ownerId: ownerRef(),
    plantRef: text("plant_ref").notNull(),
    /** the stored plant, when the record is for one (presets have none) */
    plantId: uuid("plant_id").references(() => plants.id, { onDelete: "set null" }),
    plantName: text("plant_name").notNull(),
    tuningSetId: uuid("tuning_set_id").references(() => tuningSets.id, { onDelete: "set null" }),
    title: text("title").notNull(),
    notes: text("notes").notNull().default(""),
    document: jsonb("document").$type<Record<string, unknown>>().notNull(),
    engineVersion: text("engine_version").notNull(),
    signedOffBy: text("signed_off_by"),
    signedOffOn: text("signed_off_on"),
    signedOffAt: timestamp("signed_off_at", { withTimezone: true, mode: "date" }),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
  },
  (t) => [
    index("tuning_records_org_idx").on(t.organizationId, t.createdAt),
    index("tuning_records_owner_idx").on(t.ownerId),
    index("tuning_records_plant_idx").on(t.plantRef),
    check("tuning_records_signoff_complete", sql`(${t.signedOffBy} IS NULL) = (${t.signedOffOn} IS NULL)`),
    check("tuning_records_signoff_date", sql`${t.signedOffOn} IS NULL OR ${t.signedOffOn} ~ '^[0-9]{4}-[0-9]{2}-[0-9]{2}$'`),
  ],
);

export type TuningRecordRow = typeof tuningRecords.$inferSelect;
