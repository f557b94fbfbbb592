// Reads shared by pages and route handlers. Callers authorize first (app/_lib/guard.ts).
import { and, asc, count, desc, eq, isNull, sql } from "drizzle-orm";
import { getDb } from "./client";
import { caughtMail, cohortMemberships, cohorts, invitations, organizations, users, type UserRole } from "./schema";

export async function organizationName(organizationId: string): Promise<string> {
  const [org] = await getDb().select({ name: organizations.name }).from(organizations).where(eq(organizations.id, organizationId));
  return org?.name ?? "";
}

/** Cohorts the user belongs to (all of the organisation's for an admin), with member counts. */
export async function cohortsFor(user: { id: string; role: UserRole; organizationId: string }) {
  const db = getDb();
  const trainees = db
    .select({ cohortId: cohortMemberships.cohortId, n: count().as("n") })
    .from(cohortMemberships)
    .where(and(eq(cohortMemberships.role, "trainee"), isNull(cohortMemberships.removedAt)))
    .groupBy(cohortMemberships.cohortId)
    .as("trainees");
  const base = db
    .select({
      id: cohorts.id,
      name: cohorts.name,
      timeZone: cohorts.timeZone,
      traineeCount: sql<number>`coalesce(${trainees.n}, 0)`.mapWith(Number),
      myRole: user.role === "admin" ? sql<string>`'admin'` : cohortMemberships.role,
    })
    .from(cohorts)
    .leftJoin(trainees, eq(trainees.cohortId, cohorts.id));
  if (user.role === "admin") return base.where(eq(cohorts.organizationId, user.organizationId)).orderBy(asc(cohorts.name));
  return base
    .innerJoin(cohortMemberships, and(eq(cohortMemberships.cohortId, cohorts.id), eq(cohortMemberships.userId, user.id), isNull(cohortMemberships.removedAt)))
    .orderBy(asc(cohorts.name));
}

export async function cohortById(cohortId: string) {
  const [row] = await getDb().select().from(cohorts).where(eq(cohorts.id, cohortId));
  return row ?? null;
}

export async function roster(cohortId: string) {
  const members = await getDb()
    .select({ userId: users.id, displayName: users.displayName, email: users.email, role: cohortMemberships.role, status: users.status, joinedAt: cohortMemberships.joinedAt })
    .from(cohortMemberships)
    .innerJoin(users, eq(users.id, cohortMemberships.userId))
    .where(and(eq(cohortMemberships.cohortId, cohortId), isNull(cohortMemberships.removedAt)))
    .orderBy(desc(cohortMemberships.role), asc(users.displayName));
  const pending = await getDb()
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt, createdAt: invitations.createdAt })
    .from(invitations)
    .where(and(eq(invitations.cohortId, cohortId), isNull(invitations.acceptedAt), eq(invitations.revoked, false), sql`${invitations.expiresAt} > now()`))
    .orderBy(desc(invitations.createdAt));
  return { members, pending };
}

export async function organizationUsers(organizationId: string) {
  return getDb()
    .select({ id: users.id, displayName: users.displayName, email: users.email, role: users.role, status: users.status, createdAt: users.createdAt })
    .from(users)
    .where(eq(users.organizationId, organizationId))
    .orderBy(asc(users.role), asc(users.displayName));
}

/** Caught mail addressed to the organisation's users or to its invitations only: an admin never reads another organisation's links. */
export async function recentMail(organizationId: string, limit = 50) {
  return getDb()
    .select()
    .from(caughtMail)
    .where(
      sql`exists (select 1 from ${users} u where u.organization_id = ${organizationId} and lower(u.email) = any(${caughtMail.envelopeTo}))
          or exists (select 1 from ${invitations} i where i.organization_id = ${organizationId} and lower(i.email) = any(${caughtMail.envelopeTo}))`,
    )
    .orderBy(desc(caughtMail.receivedAt))
    .limit(limit);
}
