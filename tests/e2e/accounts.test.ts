// End to end through the production build in Debian's chromium: sign-in per role, refusals,
// invitation by e-mail, password reset, deactivation and sign-out.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { getDb } from "@/db/client";
import { cohorts, invitations, users } from "@/db/schema";
import { DEMO_COHORT, DEMO_PASSWORD, demoPeople } from "@/db/seed";
import { linkIn, uniqueEmail, waitForMail } from "../integration/helpers";
import { baseUrl, launchBrowser, serverRenderedFormFields, newUser, screenshot, signIn } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const demoCohortId = async () => (await getDb().select().from(cohorts).where(eq(cohorts.name, DEMO_COHORT)))[0].id;

describe("each demo role signs in and sees its dashboard", () => {
  const cases = [
    { who: demoPeople.admin, title: "Organisation overview" },
    { who: demoPeople.instructors[0], title: "Your cohorts" },
    { who: demoPeople.trainees[0], title: "Your training" },
  ];
  for (const { who, title } of cases) {
    it(`${who.role}: ${title}`, async () => {
      const { context, page } = await newUser(browser);
      await signIn(page, who.email);
      await page.waitForURL("**/dashboard");
      expect(await page.getByTestId("dashboard-title").textContent()).toBe(title);
      expect(await page.getByRole("contentinfo").textContent()).toMatch(/excess-temperature cutout/);
      await screenshot(page, `dashboard-${who.role}`);
      await context.close();
    });
  }

  it("a wrong password gets a clear message and no session", async () => {
    const { context, page } = await newUser(browser);
    await signIn(page, demoPeople.trainees[1].email, "not-the-password");
    await expect(page.getByTestId("form-error").textContent()).resolves.toBe("E-mail or password is wrong.");
    expect((await context.cookies()).find((c) => c.name === "loopwright_session")?.value ?? "").toBe("");
    await context.close();
  });
});

describe("authorization is enforced on the server", () => {
  it("a trainee is refused an instructor page and an instructor action", async () => {
    const cohortId = await demoCohortId();
    const trainee = await newUser(browser);
    await signIn(trainee.page, demoPeople.trainees[2].email);
    await trainee.page.waitForURL("**/dashboard");
    await trainee.page.goto(`/cohorts/${cohortId}`);
    expect(trainee.page.url()).toMatch(/\/forbidden$/);
    const api = await trainee.context.request.get(`/api/cohorts/${cohortId}/roster`);
    expect(api.status()).toBe(403);

    // Replay the instructor's invite form post with the trainee's session.
    const instructor = await newUser(browser);
    await signIn(instructor.page, demoPeople.instructors[0].email);
    await instructor.page.waitForURL("**/dashboard");
    const target = uniqueEmail("smuggled");
    const fields = { ...(await serverRenderedFormFields(browser, instructor.context, "/dashboard", 'form[aria-label="Invite a trainee"]')), email: target };
    const res = await trainee.context.request.post("/dashboard", { multipart: fields, headers: { origin: baseUrl() } });
    expect(res.status()).toBeLessThan(500);
    expect(await res.text()).toContain("You are not allowed to do that.");
    expect(await getDb().select().from(invitations).where(eq(invitations.email, target))).toHaveLength(0);

    // The same post from another origin is refused before it runs.
    // Control: the instructor's own replay of the same post is accepted…
    const allowed = uniqueEmail("genuine");
    const own = await instructor.context.request.post("/dashboard", { multipart: { ...fields, email: allowed }, headers: { origin: baseUrl() } });
    expect(await own.text()).toContain(`Invitation sent to ${allowed}.`);
    // …but from another origin it is refused before it runs.
    const forgedEmail = uniqueEmail("forged");
    const forged = await instructor.context.request.post("/dashboard", { multipart: { ...fields, email: forgedEmail }, headers: { origin: "http://attacker.example" } });
    expect(forged.ok()).toBe(false);
    expect(await getDb().select().from(invitations).where(eq(invitations.email, forgedEmail))).toHaveLength(0);
    await trainee.context.close();
    await instructor.context.close();
  });
});

describe("invitation by e-mail", () => {
  it("an instructor invites a new address; the invitee signs up through the link and lands in the cohort", async () => {
    const instructor = await newUser(browser);
    await signIn(instructor.page, demoPeople.instructors[0].email);
    await instructor.page.waitForURL("**/dashboard");
    const email = uniqueEmail("newcomer");
    const form = instructor.page.locator('form[aria-label="Invite a trainee"]');
    await form.getByLabel("Invite a trainee by e-mail").fill(email);
    await form.getByRole("button", { name: "Send invitation" }).click();
    await expect(form.getByTestId("form-status").textContent()).resolves.toBe(`Invitation sent to ${email}.`);
    await screenshot(instructor.page, "instructor-invited");

    const mail = await waitForMail(email, "invitation");
    const { url } = linkIn(mail.textBody, "/invitation");
    const invitee = await newUser(browser);
    await invitee.page.goto(url);
    await invitee.page.locator('input[name="displayName"]').fill("Nadia Okonkwo");
    await invitee.page.locator('input[name="password"]').fill("my own password 1");
    await invitee.page.locator('input[name="confirm"]').fill("my own password 1");
    await invitee.page.getByRole("button", { name: "Create account" }).click();
    await invitee.page.waitForURL("**/dashboard?welcome=1");
    expect(await invitee.page.textContent("main")).toContain(DEMO_COHORT);

    // The link is single-use.
    const again = await newUser(browser);
    await again.page.goto(url);
    expect(await again.page.textContent("h1")).toBe("This invitation no longer works");

    // The admin reads the same message in the mailbox page.
    const admin = await newUser(browser);
    await signIn(admin.page, demoPeople.admin.email);
    await admin.page.waitForURL("**/dashboard");
    await admin.page.goto("/admin/mailbox");
    expect(await admin.page.locator('[data-testid="caught-mail"]', { hasText: email }).count()).toBeGreaterThan(0);
    for (const c of [instructor, invitee, again, admin]) await c.context.close();
  });
});

describe("password reset, deactivation, sign-out", () => {
  it("a reset by e-mail works end to end and ends an older session", async () => {
    const who = demoPeople.trainees[3];
    const older = await newUser(browser);
    await signIn(older.page, who.email);
    await older.page.waitForURL("**/dashboard");

    const fresh = await newUser(browser);
    await fresh.page.goto("/forgot-password");
    await fresh.page.getByLabel("E-mail").fill(who.email);
    await fresh.page.getByRole("button", { name: "Send reset link" }).click();
    await fresh.page.getByTestId("form-status").waitFor();
    const { url } = linkIn((await waitForMail(who.email, "Reset")).textBody, "/reset-password");
    await fresh.page.goto(url);
    await fresh.page.locator('input[name="password"]').fill("a fresh password 9");
    await fresh.page.locator('input[name="confirm"]').fill("a fresh password 9");
    await fresh.page.getByRole("button", { name: "Save new password" }).click();
    await fresh.page.waitForURL("**/sign-in?reset=1");
    await signIn(fresh.page, who.email, "a fresh password 9");
    await fresh.page.waitForURL("**/dashboard");

    await older.page.goto("/dashboard");
    expect(older.page.url()).toMatch(/\/sign-in$/);
    // put the demo password back for other tests and reruns
    const { hashPassword } = await import("@/app/_lib/password");
    await getDb().update(users).set({ passwordHash: await hashPassword(DEMO_PASSWORD) }).where(eq(users.email, who.email));
    await older.context.close();
    await fresh.context.close();
  });

  it("a deactivated user cannot sign in", async () => {
    const target = demoPeople.trainees[4];
    const admin = await newUser(browser);
    await signIn(admin.page, demoPeople.admin.email);
    await admin.page.waitForURL("**/dashboard");
    await admin.page.goto("/admin/users");
    await admin.page.locator(`[data-testid="user-row"][data-email="${target.email}"]`).getByRole("button", { name: "Deactivate" }).click();
    await admin.page.locator(`[data-testid="user-row"][data-email="${target.email}"]`).getByRole("button", { name: "Reactivate" }).waitFor();

    const trainee = await newUser(browser);
    await signIn(trainee.page, target.email);
    await expect(trainee.page.getByTestId("form-error").textContent()).resolves.toMatch(/deactivated/);
    await getDb().update(users).set({ status: "active", deactivatedAt: null }).where(eq(users.email, target.email));
    await admin.context.close();
    await trainee.context.close();
  });

  it("signing out ends the session on the server, not only in the browser", async () => {
    const { context, page } = await newUser(browser);
    await signIn(page, demoPeople.trainees[5].email);
    await page.waitForURL("**/dashboard");
    const cookie = (await context.cookies()).find((c) => c.name === "loopwright_session")!;
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL("**/sign-in");
    const replay = await fetch(`${baseUrl()}/dashboard`, { headers: { cookie: `${cookie.name}=${cookie.value}` }, redirect: "manual" });
    expect(replay.status).toBeGreaterThanOrEqual(300);
    expect(replay.status).toBeLessThan(400);
    expect(replay.headers.get("location")).toMatch(/\/sign-in$/);
    await context.close();
  });
});
