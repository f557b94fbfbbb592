// Account rules against the real PostgreSQL test database, with mail going over SMTP to the
// running catcher. Sources: OWASP Authentication Cheat Sheet for the expected behaviours
// (generic failure message, lockout, single-use expiring reset tokens) — from memory, common practice.
import { and, eq, sql as dsql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { acceptInvitation, checkSignIn, createFirstAdmin, inviteByEmail, requestPasswordReset, resetPassword, setUserActive } from "@/app/_lib/accounts";
import { recentMail } from "@/db/queries";
import { ActionRefused } from "@/app/_lib/action";
import { hashPassword } from "@/app/_lib/password";
import { SIGN_IN_LIMITS } from "@/app/_lib/rate-limit";
import { newUserId } from "@/app/_lib/tokens";
import { getDb } from "@/db/client";
import { caughtMail, cohortMemberships, cohorts, invitations, passwordResetTokens, sessions, signInAttempts, users } from "@/db/schema";
import { DEMO_COHORT, demoPeople } from "@/db/seed";
import { linkIn, uniqueEmail, waitForMail } from "./helpers";

const db = () => getDb();

async function demoInstructor() {
  const [u] = await db().select().from(users).where(eq(users.email, demoPeople.instructors[0].email));
  const [c] = await db().select().from(cohorts).where(eq(cohorts.name, DEMO_COHORT));
  return { inviter: { id: u.id, displayName: u.displayName, organizationId: u.organizationId }, cohortId: c.id };
}

async function makeUser(password: string) {
  const { inviter } = await demoInstructor();
  const id = newUserId();
  const email = uniqueEmail("user");
  await db().insert(users).values({ id, email, displayName: "Test Person", passwordHash: await hashPassword(password), role: "trainee", organizationId: inviter.organizationId });
  return { id, email };
}

describe("sign-in checks", () => {
  it("accepts the right password and refuses a wrong one with a generic message", async () => {
    const { id, email } = await makeUser("correct horse battery");
    await expect(checkSignIn(email, "correct horse battery", "10.0.0.1")).resolves.toBe(id);
    await expect(checkSignIn(email, "wrong password!", "10.0.0.1")).rejects.toThrow("E-mail or password is wrong.");
    await expect(checkSignIn(uniqueEmail("nobody"), "whatever12345", "10.0.0.1")).rejects.toThrow("E-mail or password is wrong.");
  });

  it("locks an account after repeated failures, even for the right password", async () => {
    const { email } = await makeUser("correct horse battery");
    for (let i = 0; i < SIGN_IN_LIMITS.perAccount; i++) {
      await expect(checkSignIn(email, `wrong-${i}-password`, `10.1.0.${i}`)).rejects.toThrow(ActionRefused);
    }
    await expect(checkSignIn(email, "correct horse battery", "10.1.0.99")).rejects.toThrow(/Too many failed sign-ins/);
    const [row] = await db().select().from(signInAttempts).where(eq(signInAttempts.key, `account:${email}`));
    expect(row.lockedUntil!.getTime()).toBeGreaterThan(Date.now());
  });

  it("locks a client address that fails across many accounts", async () => {
    const address = `192.0.2.${Math.floor(Math.random() * 200)}`;
    for (let i = 0; i < SIGN_IN_LIMITS.perAddress; i++) {
      await expect(checkSignIn(uniqueEmail("spray"), "wrong-password-x", address)).rejects.toThrow(ActionRefused);
    }
    const { email } = await makeUser("correct horse battery");
    await expect(checkSignIn(email, "correct horse battery", address)).rejects.toThrow(/Too many failed sign-ins/);
    await expect(checkSignIn(email, "correct horse battery", "198.51.100.7")).resolves.toBeTruthy();
  });

  it("refuses a deactivated user and ends their sessions", async () => {
    const { id, email } = await makeUser("correct horse battery");
    await db().insert(sessions).values({ id: `s-${id}`, userId: id, expiresAt: new Date(Date.now() + 3_600_000) });
    const [u] = await db().select().from(users).where(eq(users.id, id));
    await setUserActive(u.organizationId, id, false);
    await expect(checkSignIn(email, "correct horse battery", "10.2.0.1")).rejects.toThrow(/deactivated/);
    expect(await db().select().from(sessions).where(eq(sessions.userId, id))).toHaveLength(0);
    const [after] = await db().select().from(users).where(eq(users.id, id));
    expect(after.status).toBe("deactivated");
    expect(after.email).toBe(email); // data kept
  });
});

describe("the mailbox", () => {
  it("shows an admin only the mail of their own organisation", async () => {
    const { inviter, cohortId } = await demoInstructor();
    const email = uniqueEmail("scoped");
    await inviteByEmail(inviter, { email, role: "trainee", cohortId });
    await waitForMail(email, "invitation");
    const other = await createFirstAdmin({ organization: `Elsewhere Works ${Date.now()}`, email: uniqueEmail("otheradmin"), displayName: "Other Admin", password: "long enough pw" });
    const [otherAdmin] = await getDb().select().from(users).where(eq(users.id, other));
    const theirs = await recentMail(otherAdmin.organizationId, 500);
    expect(theirs.some((m) => m.envelopeTo.includes(email))).toBe(false);
    const ours = await recentMail(inviter.organizationId, 500);
    expect(ours.some((m) => m.envelopeTo.includes(email))).toBe(true);
  });
});

describe("invitations", () => {
  it("mails a link over SMTP; accepting it creates the account in the cohort, once", async () => {
    const { inviter, cohortId } = await demoInstructor();
    const email = uniqueEmail("invitee");
    await inviteByEmail(inviter, { email, role: "trainee", cohortId });
    const mail = await waitForMail(email, "invitation");
    const { token } = linkIn(mail.textBody, "/invitation");
    const [stored] = await db().select().from(invitations).where(eq(invitations.email, email));
    expect(stored.tokenHash).not.toContain(token); // only the hash is stored

    const userId = await acceptInvitation(token, { displayName: "New Trainee", password: "a-new-password-1" });
    const [member] = await db().select().from(cohortMemberships).where(and(eq(cohortMemberships.userId, userId), eq(cohortMemberships.cohortId, cohortId)));
    expect(member.role).toBe("trainee");
    await expect(acceptInvitation(token, { displayName: "Again", password: "a-new-password-2" })).rejects.toThrow(/expired or was already used/);
  });

  it("refuses an address that is already registered and writes nothing", async () => {
    const { inviter, cohortId } = await demoInstructor();
    const before = await db().select({ n: dsql<number>`count(*)::int` }).from(invitations);
    await expect(inviteByEmail(inviter, { email: demoPeople.trainees[0].email, role: "trainee", cohortId })).rejects.toThrow(/already has a Loopwright account/);
    const after = await db().select({ n: dsql<number>`count(*)::int` }).from(invitations);
    expect(after[0].n).toBe(before[0].n);
  });

  it("refuses an expired invitation and creates no user", async () => {
    const { inviter, cohortId } = await demoInstructor();
    const email = uniqueEmail("late");
    await inviteByEmail(inviter, { email, role: "trainee", cohortId });
    const { token } = linkIn((await waitForMail(email, "invitation")).textBody, "/invitation");
    await db().update(invitations).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitations.email, email));
    await expect(acceptInvitation(token, { displayName: "Late Person", password: "a-new-password-1" })).rejects.toThrow(/expired/);
    expect(await db().select().from(users).where(eq(users.email, email))).toHaveLength(0);
  });
});

describe("password reset", () => {
  it("is single-use, ends every session, and is silent for unknown addresses", async () => {
    const { id, email } = await makeUser("old password 123");
    await db().insert(sessions).values({ id: `r-${id}`, userId: id, expiresAt: new Date(Date.now() + 3_600_000) });
    await requestPasswordReset(email);
    const { token } = linkIn((await waitForMail(email, "Reset")).textBody, "/reset-password");
    await resetPassword(token, "brand new password");
    expect(await db().select().from(sessions).where(eq(sessions.userId, id))).toHaveLength(0);
    await expect(checkSignIn(email, "brand new password", "10.3.0.1")).resolves.toBe(id);
    await expect(resetPassword(token, "another password")).rejects.toThrow(/expired or was already used/);
    await expect(requestPasswordReset(uniqueEmail("ghost"))).resolves.toBeUndefined();
  });

  it("using one reset link kills the account's other open links", async () => {
    const { id, email } = await makeUser("old password 123");
    await requestPasswordReset(email);
    const first = linkIn((await waitForMail(email, "Reset")).textBody, "/reset-password").token;
    await new Promise((r) => setTimeout(r, 20));
    await requestPasswordReset(email);
    const mails = await getDb().select().from(caughtMail).where(dsql`${email} = any(${caughtMail.envelopeTo})`);
    expect(mails.length).toBe(2);
    const second = mails.map((m) => linkIn(m.textBody, "/reset-password").token).find((t) => t !== first)!;
    await resetPassword(second, "brand new password");
    await expect(resetPassword(first, "another new password")).rejects.toThrow(/expired or was already used/);
    await expect(checkSignIn(email, "brand new password", "10.5.0.1")).resolves.toBe(id);
  });

  it("refuses an expired token and keeps the old password", async () => {
    const { id, email } = await makeUser("old password 123");
    await requestPasswordReset(email);
    const { token } = linkIn((await waitForMail(email, "Reset")).textBody, "/reset-password");
    await db().update(passwordResetTokens).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(passwordResetTokens.userId, id));
    await expect(resetPassword(token, "brand new password")).rejects.toThrow(/expired/);
    await expect(checkSignIn(email, "old password 123", "10.4.0.1")).resolves.toBe(id);
  });
});
