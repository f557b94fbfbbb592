// The one server-side guard. Every page, route handler and server action states who may use it
// through an AccessPolicy; this file decides. Pages redirect, route handlers answer 401/403,
// actions throw AccessDenied (turned into a plain refusal by defineAction). Nothing is read
// before the guard has passed, so a refusal never leaks data.
import { and, eq, isNull } from "drizzle-orm";
import { redirect } from "next/navigation";
import { getDb } from "@/db/client";
import { assignments, cohortMemberships, cohorts, type UserRole } from "@/db/schema";
import { currentSession, type SignedInUser } from "./auth";

export interface AccessPolicy {
  roles?: readonly UserRole[];
  /** the user must belong to this cohort (admins of its organisation always may) */
  cohortId?: string;
  /** with cohortId: "instructor" requires an instructor membership; "member" any membership */
  cohortRole?: "instructor" | "member";
  /** like cohortId, for the cohort this assignment belongs to */
  assignmentId?: string;
}

export class AccessDenied extends Error {
  constructor(readonly reason: "signed-out" | "forbidden") {
    super(reason === "signed-out" ? "Sign in first." : "You are not allowed to do that.");
  }
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export async function cohortAccess(user: SignedInUser, cohortId: string, need: "instructor" | "member"): Promise<boolean> {
  if (!uuidPattern.test(cohortId)) return false;
  const db = getDb();
  const [cohort] = await db.select({ organizationId: cohorts.organizationId }).from(cohorts).where(eq(cohorts.id, cohortId));
  if (!cohort || cohort.organizationId !== user.organizationId) return false;
  if (user.role === "admin") return true;
  const [membership] = await db
    .select({ role: cohortMemberships.role })
    .from(cohortMemberships)
    .where(and(eq(cohortMemberships.cohortId, cohortId), eq(cohortMemberships.userId, user.id), isNull(cohortMemberships.removedAt)));
  if (!membership) return false;
  return need === "member" || membership.role === "instructor";
}

/** The cohort of an assignment of the user's organisation, or null. */
export async function assignmentCohortId(user: SignedInUser, assignmentId: string): Promise<string | null> {
  if (!uuidPattern.test(assignmentId)) return null;
  const [a] = await getDb()
    .select({ cohortId: assignments.cohortId })
    .from(assignments)
    .where(and(eq(assignments.id, assignmentId), eq(assignments.organizationId, user.organizationId)));
  return a?.cohortId ?? null;
}

/** Checks the policy for this request's user; throws AccessDenied. */
export async function authorize(policy: AccessPolicy = {}): Promise<SignedInUser> {
  const { user } = await currentSession();
  if (!user) throw new AccessDenied("signed-out");
  if (policy.roles && !policy.roles.includes(user.role)) throw new AccessDenied("forbidden");
  if (policy.cohortId !== undefined && !(await cohortAccess(user, policy.cohortId, policy.cohortRole ?? "member"))) {
    throw new AccessDenied("forbidden");
  }
  if (policy.assignmentId !== undefined) {
    const cohortId = await assignmentCohortId(user, policy.assignmentId);
    if (!cohortId || !(await cohortAccess(user, cohortId, policy.cohortRole ?? "member"))) throw new AccessDenied("forbidden");
  }
  return user;
}

/** For pages: signed-out users go to sign-in, others without access to the refusal page. */
export async function guardPage(policy: AccessPolicy = {}): Promise<SignedInUser> {
  try {
    return await authorize(policy);
  } catch (err) {
    if (err instanceof AccessDenied) redirect(err.reason === "signed-out" ? "/sign-in" : "/forbidden");
    throw err;
  }
}

/** For route handlers: the user, or a JSON 401/403 response. */
export async function guardRoute(policy: AccessPolicy = {}): Promise<SignedInUser | Response> {
  try {
    return await authorize(policy);
  } catch (err) {
    if (err instanceof AccessDenied) {
      return Response.json({ error: err.message }, { status: err.reason === "signed-out" ? 401 : 403 });
    }
    throw err;
  }
}
