// The classroom end to end in chromium against the production build, its worker and the SMTP
// catcher (issue 6, "Browser test"): an instructor builds a drill from the airflow-disturbance
// starter (lint blocks the drying room's exhaust inlet), publishes it and assigns it to the demo
// cohort; a trainee attempts it on the Bench in drill mode and sees the server's verified result
// with the automatic feedback per window; the instructor, whose standings page stayed open, sees
// the attempt appear without a reload, opens it and leaves written feedback, which reaches the
// trainee by e-mail. The demo people are the seed's (db/demo-people.ts).
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoPeople } from "@/db/demo-people";
import { waitForMail } from "../integration/helpers";
import { launchBrowser, newUser, screenshot, seriousAxeFindings, signIn } from "./browser";

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const instructorEmail = demoPeople.instructors[0].email;
const traineeEmail = "gideon@students.kestrelfen.example";

describe("classroom", () => {
  it("build, publish and assign a drill; attempt it; verified result and feedback; review and written feedback by e-mail", async () => {
    const title = `Lint on the inlet ${Date.now().toString(36)}`;
    const teacher = await newUser(browser);
    const t = teacher.page;
    await signIn(t, instructorEmail);
    await t.waitForURL("**/dashboard");

    // build from the airflow-disturbance starter and publish v1
    await t.goto("/drills");
    await t.getByRole("button", { name: "New drill" }).click();
    await t.locator('input[name="title"]').fill(title);
    await t.locator('input[name="starter"][value="airflow-disturbance"]').check();
    await t.getByRole("button", { name: "Create draft" }).click();
    await t.waitForURL(/\/drills\/[0-9a-f-]{36}$/);
    await t.getByTestId("drill-builder").waitFor();
    await t.getByRole("button", { name: "Publish v1" }).click();
    await t.getByText(/published/i).first().waitFor();
    await screenshot(t, "classroom-1-drill-published");

    // assign it to the demo cohort
    await t.goto("/cohorts");
    await t.getByRole("link", { name: /Process Control 2/ }).click();
    await t.getByText("Assign a drill…").click();
    await t.locator('select[name="drillVersion"]').selectOption({ label: `${title} — version 1` });
    await t.getByLabel("Title shown to trainees").fill(title);
    await t.getByRole("button", { name: "Assign to the cohort" }).click();
    await expect.poll(async () => (await t.getByTestId("form-status").allTextContents()).join(" "), { timeout: 15_000 }).toMatch(/Assigned/);
    await t.getByRole("link", { name: title }).click();
    await t.waitForURL(/\/assignments\/[0-9a-f-]{36}$/);
    const assignmentUrl = t.url();
    await t.getByTestId("standings-table").waitFor();
    const rowsBefore = await t.getByTestId("standings-row").count();
    await screenshot(t, "classroom-2-assignment-staff");

    // the trainee is told it opened, reads the rubric and starts an attempt
    await waitForMail(traineeEmail, `New drill assigned: ${title}`, 30_000);
    const learner = await newUser(browser);
    const p = learner.page;
    await signIn(p, traineeEmail);
    await p.waitForURL("**/dashboard");
    await p.getByRole("link", { name: title }).first().click();
    await p.getByTestId("attempt-rubric").waitFor();
    expect(await p.getByTestId("attempts-left").textContent()).toMatch(/3 of 3 left/);
    await p.getByRole("button", { name: "Start an attempt" }).click();
    await p.waitForURL(/\/attempts\/[0-9a-f-]{36}$/);
    const attemptUrl = p.url();
    await p.getByTestId("attempt-bench").waitFor();
    expect(await p.getByRole("tab", { name: "Relay test" }).count()).toBe(1);
    // a slightly firmer tuning than the reference, then the whole drill at ×600
    await p.getByRole("button", { name: "×600" }).click();
    await p.getByRole("button", { name: "Run", exact: true }).click();
    await p.getByTestId("attempt-submit").waitFor({ timeout: 120_000 });
    await expect.poll(() => p.getByTestId("attempt-submit").isEnabled(), { timeout: 30_000 }).toBe(true);
    const claimed = await p.getByTestId("attempt-claimed-score").textContent();
    await screenshot(p, "classroom-3-attempt-ended");
    await p.getByTestId("attempt-submit").click();

    // verifying, then the server's result with feedback per window
    await p.getByText(/verified/i).first().waitFor({ timeout: 60_000 });
    await p.getByText("inlet 60 % blocked").first().waitFor({ timeout: 30_000 });
    expect(claimed).toMatch(/\d/);
    expect(await seriousAxeFindings(p)).toEqual([]);
    await screenshot(p, "classroom-4-verified");

    // the instructor's open standings page shows the attempt without a reload
    expect(t.url()).toBe(assignmentUrl);
    await expect.poll(() => t.getByTestId("standings-row").count(), { timeout: 30_000 }).toBeGreaterThan(rowsBefore);
    // review and written feedback
    await t.goto(attemptUrl);
    await t.getByLabel("Written feedback to the trainee").fill("Recovered well after the inlet cleared. Next time try a shorter Ti to pull back faster while it is blocked.");
    await t.getByRole("button", { name: "Send feedback" }).click();
    await expect.poll(async () => (await t.getByTestId("form-status").allTextContents()).join(" "), { timeout: 15_000 }).toMatch(/e-mailed/);
    await screenshot(t, "classroom-5-review");
    const mail = await waitForMail(traineeEmail, "Feedback on your attempt", 30_000);
    expect(mail.textBody).toContain("shorter Ti");
    // and the trainee sees it in the app
    await p.reload();
    await p.getByText("Recovered well after the inlet cleared.", { exact: false }).waitFor();
    await teacher.context.close();
    await learner.context.close();
  }, 300_000);
});
