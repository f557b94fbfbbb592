// A commissioning technician's path in Debian's chromium against the production build: upload an
// example bump-test log (invented data, public/samples: semicolons, decimal commas, timestamps, a
// logger dropout), map its columns, identify, accept the twin, run a relay test on it in the
// pre-commissioning flow, apply the rule, save a tuning set, write the tuning record and open it;
// the record page shows the tuning saved and offers its PDF. The demo trainee fenna is used by no
// other browser test.
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { demoPeople } from "@/db/seed";
import { launchBrowser, newUser, screenshot, seriousAxeFindings, signIn } from "./browser";

const technician = demoPeople.trainees[5].email; // fenna
const SAMPLE = path.join(process.cwd(), "public/samples/cabinet-bump-decimal-comma.csv");
const twinName = `Germination cabinet GC-7 twin ${Date.now().toString(36)}`;

let browser: Browser;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  ({ page } = await newUser(browser));
  await signIn(page, technician);
  await page.waitForURL("**/dashboard");
});
afterAll(async () => {
  await browser?.close();
});

describe("twin → pre-commissioning → tuning record", () => {
  let twinUrl = "";

  it("uploads a log, maps its columns, identifies both candidates and accepts a twin", async () => {
    await page.goto("/twins/new");
    await page.getByLabel("Log file").setInputFiles(SAMPLE);
    const mapping = page.getByTestId("mapping-form");
    await mapping.waitFor();
    // the guess reads the decimal comma; set to a point, the file's numbers are refused with their line
    await page.getByLabel("Decimal mark").selectOption(".");
    await expect.poll(async () => (await page.getByTestId("mapping-refusal").textContent()) ?? "").toMatch(/line \d+, column .*is not a number/i);
    await page.getByLabel("Decimal mark").selectOption(",");
    await page.getByTestId("mapping-ok").waitFor();
    expect(await page.getByLabel("Time written as").inputValue()).toBe("timestamp");
    expect(await page.locator("#map-pv").inputValue()).toBe("2"); // the PV select (its label holds the chosen option too)
    await page.getByRole("region", { name: "Read the log" }).locator("canvas").first().waitFor();
    await screenshot(page, "twin-mapping");

    await page.getByRole("button", { name: "Identify", exact: true }).click();
    const results = page.getByTestId("identify-results");
    await results.waitFor({ timeout: 60_000 });
    await results.getByTestId("candidate-fopdt").waitFor();
    await results.getByTestId("candidate-sopdt").waitFor();
    expect(await results.textContent()).toMatch(/R²/);
    await screenshot(page, "twin-candidates");

    const form = page.getByTestId("accept-twin-form");
    await form.getByLabel(/^Name/).fill(twinName);
    await form.getByRole("button", { name: "Save twin" }).click();
    await page.waitForURL(/\/twins\/[0-9a-f-]{36}$/, { timeout: 60_000 });
    twinUrl = page.url();
    await page.getByText(twinName).first().waitFor();
    expect(await page.textContent("body")).toMatch(/[0-9a-f]{64}/); // the source file's SHA-256
    await screenshot(page, "twin-page");
    const findings = await seriousAxeFindings(page);
    expect(findings, JSON.stringify(findings, null, 2)).toEqual([]);
  });

  it("runs a relay test on the twin, saves the tuning and writes the tuning record", async () => {
    expect(twinUrl).not.toBe("");
    await page.getByRole("link", { name: "Pre-commission" }).first().click();
    await page.waitForURL(/\/commissioning\/[0-9a-f-]{36}$/);
    const path = page.getByRole("region", { name: "Hand-over path" });
    await path.waitFor();
    await page.getByTestId("pv-readout").filter({ hasText: /\d/ }).waitFor({ timeout: 30_000 });
    await path.getByRole("button", { name: "Go to the relay test" }).click();

    const panel = page.getByTestId("relay-panel");
    await panel.getByLabel("Run the test").selectOption("max");
    await panel.getByRole("button", { name: "Start relay test" }).click();
    await panel.getByTestId("relay-result").waitFor({ timeout: 90_000 });
    const kc = Number((await panel.getByTestId("relay-kc").textContent())!.split(" ")[0]);
    expect(kc).toBeGreaterThan(0);
    await panel.getByRole("button", { name: "Apply…" }).click();
    await panel.getByRole("group", { name: "Confirm the new tuning" }).getByRole("button", { name: "Yes, load it" }).click();
    await panel.getByText(/Loaded into the controller/).waitFor();
    await screenshot(page, "commissioning-relay");

    await path.getByRole("button", { name: "Go to the tuning sets" }).click();
    const save = page.getByRole("form", { name: "Save a tuning set" });
    await save.getByLabel("Tuning set name").fill("PI from the relay test");
    await save.getByRole("button", { name: "Save current tuning" }).click();
    const record = page.getByRole("form", { name: "Tuning record" });
    await expect.poll(async () => record.getByLabel("Tuning set on the record").locator("option", { hasText: "PI from the relay test" }).count(), { timeout: 20_000 }).toBeGreaterThan(0);
    await record.getByLabel("Tuning set on the record").selectOption({ label: "PI from the relay test" });
    await record.getByLabel("Record title").fill("GC-7 hand-over (browser test)");
    await record.getByLabel("Notes for the record").fill("Relay test on the twin; rule applied as proposed.");
    await record.getByRole("button", { name: "Write tuning record" }).click();
    await page.waitForURL(/\/records\/[0-9a-f-]{36}$/, { timeout: 60_000 });

    const body = (await page.textContent("body")) ?? "";
    expect(body).toContain("GC-7 hand-over (browser test)");
    expect(body).toContain(twinName);
    expect(body).toMatch(/Kc/);
    await page.getByRole("link", { name: /Download PDF/ }).waitFor();
    await screenshot(page, "tuning-record");
    const findings = await seriousAxeFindings(page);
    expect(findings, JSON.stringify(findings, null, 2)).toEqual([]);

    // the record is listed under Records for its plant
    await page.goto("/records");
    await page.getByText("GC-7 hand-over (browser test)").first().waitFor();
  });
});
