import { sql } from "drizzle-orm";
import {
  boolean,
  index,
  integer,
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
    organizationId: uuid("organization_id")
      .notNull()
      .references(() => organizations.id),
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
    organizationId: uuid("organization_id")
      .notNull()
      .references(() => organizations.id),
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
    organizationId: uuid("organization_id")
      .notNull()
      .references(() => organizations.id),
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
