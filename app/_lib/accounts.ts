// Account rules, independent of Next: sign-in checks, invitations, password resets,
// deactivation. Server actions call these after validating and authorizing; integration tests
// call them directly against a real database.
import { and, eq, gt, isNull, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { cohortMemberships, cohorts, invitations, organizations, passwordResetTokens, users, type UserRole } from "@/db/schema";
import { ActionRefused } from "./action";
import { endAllSessionsOf } from "./auth";
import { appLink, invitationMail, passwordResetMail, sendMail } from "./mail";
import { hashPassword, verifyPassword } from "./password";
import { SIGN_IN_LIMITS, accountKey, addressKey, clearFailures, lockedMinutes, recordFailure } from "./rate-limit";
import { hashToken, newLinkToken, newUserId } from "./tokens";

export const INVITATION_DAYS = 7;
export const RESET_MINUTES = 60;

const byEmail = (email: string) => eq(sql`lower(${users.email})`, email.trim().toLowerCase());

// A fixed argon2id hash so an unknown e-mail costs as much time as a wrong password.
let decoyHash: Promise<string> | null = null;

/** Checks e-mail and password with rate limiting; returns the user id or refuses with a reason. */
export async function checkSignIn(email: string, password: string, address: string): Promise<string> {
  const keys = [accountKey(email), addressKey(address)];
  const wait = await lockedMinutes(keys);
  if (wait > 0) throw new ActionRefused(`Too many failed sign-ins. Try again in ${wait} minute${wait === 1 ? "" : "s"}.`);

  const [user] = await getDb().select().from(users).where(byEmail(email));
  decoyHash ??= hashPassword("decoy-password-for-timing");
  const ok = await verifyPassword(user?.passwordHash ?? (await decoyHash), password);
  if (!user || !ok) {
    await recordFailure(keys[0], SIGN_IN_LIMITS.perAccount);
    await recordFailure(keys[1], SIGN_IN_LIMITS.perAddress);
    throw new ActionRefused("E-mail or password is wrong.");
  }
  if (user.status !== "active") throw new ActionRefused("This account has been deactivated. Ask your administrator.");
  await clearFailures(keys[0]);
  return user.id;
}

export async function changePassword(userId: string, current: string, next: string): Promise<void> {
  const [user] = await getDb().select().from(users).where(eq(users.id, userId));
  if (!user || !(await verifyPassword(user.passwordHash, current))) throw new ActionRefused("The current password is wrong.");
  await getDb().update(users).set({ passwordHash: await hashPassword(next) }).where(eq(users.id, userId));
}

/** Mails a single-use reset link when the address belongs to an active account; silent otherwise. */
export async function requestPasswordReset(email: string): Promise<void> {
  const [user] = await getDb().select().from(users).where(byEmail(email));
  if (!user || user.status !== "active") return;
  const token = newLinkToken();
  const expiresAt = new Date(Date.now() + RESET_MINUTES * 60_000);
  await getDb().insert(passwordResetTokens).values({ userId: user.id, tokenHash: hashToken(token), expiresAt });
  await sendMail(passwordResetMail({ to: user.email, link: appLink(`/reset-password/${token}`), expires: expiresAt }));
}

export async function findUsableResetToken(token: string) {
  const [row] = await getDb()
    .select()
    .from(passwordResetTokens)
    .where(and(eq(passwordResetTokens.tokenHash, hashToken(token)), isNull(passwordResetTokens.usedAt), gt(passwordResetTokens.expiresAt, new Date())));
  return row ?? null;
}

/** Sets the new password, spends the token and ends every session of the user. */
export async function resetPassword(token: string, password: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  const userId = await getDb().transaction(async (tx) => {
    const [spent] = await tx
      .update(passwordResetTokens)
      .set({ usedAt: new Date() })
      .where(and(eq(passwordResetTokens.tokenHash, hashToken(token)), isNull(passwordResetTokens.usedAt), gt(passwordResetTokens.expiresAt, new Date())))
      .returning();
    if (!spent) throw new ActionRefused("This reset link has expired or was already used. Ask for a new one.");
    // any other open link for this account dies with this one
    await tx.update(passwordResetTokens).set({ usedAt: new Date() }).where(and(eq(passwordResetTokens.userId, spent.userId), isNull(passwordResetTokens.usedAt)));
    await tx.update(users).set({ passwordHash }).where(eq(users.id, spent.userId));
    return spent.userId;
  });
  await endAllSessionsOf(userId);
}

export interface Inviter {
  id: string;
  displayName: string;
  organizationId: string;
}

/** Creates an invitation and mails its link. Refuses an address that already has an account. */
export async function inviteByEmail(inviter: Inviter, p: { email: string; role: UserRole; cohortId: string | null }): Promise<void> {
  const email = p.email.trim().toLowerCase();
  const token = newLinkToken();
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000);
  const { organization, cohortName } = await getDb().transaction(async (tx) => {
    const [existing] = await tx.select({ id: users.id }).from(users).where(byEmail(email));
    if (existing) throw new ActionRefused(`${email} already has a Loopwright account.`);
    const [org] = await tx.select().from(organizations).where(eq(organizations.id, inviter.organizationId));
    let cohortName: string | null = null;
    if (p.cohortId) {
      const [cohort] = await tx.select().from(cohorts).where(eq(cohorts.id, p.cohortId));
      if (!cohort || cohort.organizationId !== inviter.organizationId) throw new ActionRefused("That cohort does not exist.");
      cohortName = cohort.name;
    }
    // A new invitation replaces any open one for the same address and cohort.
    await tx
      .update(invitations)
      .set({ revoked: true })
      .where(and(eq(sql`lower(${invitations.email})`, email), isNull(invitations.acceptedAt), p.cohortId ? eq(invitations.cohortId, p.cohortId) : isNull(invitations.cohortId)));
    await tx.insert(invitations).values({
      organizationId: inviter.organizationId,
      cohortId: p.cohortId,
      email,
      role: p.role,
      invitedBy: inviter.id,
      tokenHash: hashToken(token),
      expiresAt,
    });
    return { organization: org.name, cohortName };
  });
  await sendMail(invitationMail({ to: email, inviter: inviter.displayName, organization, cohort: cohortName, link: appLink(`/invitation/${token}`), expires: expiresAt }));
}

export async function findOpenInvitation(token: string) {
  const [row] = await getDb()
    .select({ invitation: invitations, organization: organizations.name, cohort: cohorts.name })
    .from(invitations)
    .innerJoin(organizations, eq(organizations.id, invitations.organizationId))
    .leftJoin(cohorts, eq(cohorts.id, invitations.cohortId))
    .where(and(eq(invitations.tokenHash, hashToken(token)), isNull(invitations.acceptedAt), eq(invitations.revoked, false), gt(invitations.expiresAt, new Date())));
  return row ?? null;
}

/** Creates the account an invitation promised, with its cohort membership; returns the user id. */
export async function acceptInvitation(token: string, p: { displayName: string; password: string }): Promise<string> {
  const passwordHash = await hashPassword(p.password);
  return getDb().transaction(async (tx) => {
    const [invitation] = await tx
      .select()
      .from(invitations)
      .where(and(eq(invitations.tokenHash, hashToken(token)), isNull(invitations.acceptedAt), eq(invitations.revoked, false), gt(invitations.expiresAt, new Date())))
      .for("update");
    if (!invitation) throw new ActionRefused("This invitation has expired or was already used. Ask for a new one.");
    const [existing] = await tx.select({ id: users.id }).from(users).where(byEmail(invitation.email));
    if (existing) throw new ActionRefused(`${invitation.email} is already registered. Sign in instead.`);
    const id = newUserId();
    await tx.insert(users).values({
      id,
      organizationId: invitation.organizationId,
      email: invitation.email,
      displayName: p.displayName.trim(),
      passwordHash,
      role: invitation.role,
    });
    if (invitation.cohortId && invitation.role !== "admin") {
      await tx.insert(cohortMemberships).values({ cohortId: invitation.cohortId, userId: id, role: invitation.role === "instructor" ? "instructor" : "trainee" });
    }
    await tx.update(invitations).set({ acceptedAt: new Date(), acceptedUserId: id }).where(eq(invitations.id, invitation.id));
    return id;
  });
}

/** Deactivation keeps the data, ends every session and refuses further sign-ins. */
export async function setUserActive(organizationId: string, userId: string, active: boolean): Promise<void> {
  const [updated] = await getDb()
    .update(users)
    .set({ status: active ? "active" : "deactivated", deactivatedAt: active ? null : new Date() })
    .where(and(eq(users.id, userId), eq(users.organizationId, organizationId)))
    .returning({ id: users.id });
  if (!updated) throw new ActionRefused("No such user in your organisation.");
  if (!active) await endAllSessionsOf(userId);
}

/** The first admin of a new installation, with its organisation (npm run admin:create). */
export async function createFirstAdmin(p: { organization: string; email: string; displayName: string; password: string }): Promise<string> {
  const passwordHash = await hashPassword(p.password);
  return getDb().transaction(async (tx) => {
    const [existing] = await tx.select({ id: users.id }).from(users).where(byEmail(p.email));
    if (existing) throw new ActionRefused(`${p.email} is already registered.`);
    const [org] = await tx.insert(organizations).values({ name: p.organization.trim() }).returning();
    const id = newUserId();
    await tx.insert(users).values({ id, organizationId: org.id, email: p.email.trim().toLowerCase(), displayName: p.displayName.trim(), passwordHash, role: "admin" });
    return id;
  });
}
