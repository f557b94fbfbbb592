// The Bench in Debian's chromium against the production build: a trainee runs the default
// preset and sees PV follow a new SP; a five-value filter sweep equals what the CLI computes for
// the exported inputs; the worker's trace fingerprint equals the CLI's replay of the same drill,
// seed and action log; and an axe-core scan finds no serious or critical accessibility issue
// (WCAG 2.1 A/AA rules as implemented by axe-core).
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { demoPeople } from "@/db/seed";
import { launchBrowser, openBench, screenshot, seriousAxeFindings } from "./browser";

let browser: Browser;
let page: Page;
const scratch = mkdtempSync(path.join(tmpdir(), "loopwright-bench-"));

beforeAll(async () => {
  browser = await launchBrowser();
  page = await openBench(browser, demoPeople.trainees[6].email);
});
afterAll(async () => {
  await browser?.close();
});

const cli = (...args: string[]) => execFileSync("npx", ["tsx", "sim/cli/main.ts", ...args], { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 });

describe("the Bench", () => {
  it("runs the default preset; PV follows a new SP", async () => {
    expect(Number(await page.getByTestId("pv-readout").textContent())).toBeCloseTo(60, 0);
    await page.getByRole("button", { name: "×600" }).click();
    await page.getByTestId("sp-input").fill("72");
    await page.getByTestId("sp-input").press("Enter");
    // 10 min of simulated time at ×600 is about a second of wall time
    await expect.poll(async () => Number(await page.getByTestId("pv-readout").textContent()), { timeout: 30_000, interval: 250 }).toBeGreaterThan(71.2);
    // then settled near the new SP (filtered PV within 0.6 °C), however fast the worker runs
    await expect.poll(async () => Math.abs(Number(await page.getByTestId("pv-readout").textContent()) - 72), { timeout: 30_000, interval: 250 }).toBeLessThan(0.6);
    await page.getByRole("button", { name: "Pause" }).click();
    await screenshot(page, "bench-after-step");
  });

  it("a worker trace equals the CLI's replay of the exported drill, seed and action log", async () => {
    const download = page.waitForEvent("download");
    await page.getByRole("button", { name: "Export replay file" }).click();
    const file = path.join(scratch, "replay.json");
    await (await download).saveAs(file);
    const bundle = JSON.parse(readFileSync(file, "utf8"));
    expect(bundle.actions.length).toBeGreaterThan(0); // the SP change is in the log
    const shown = await page.getByTestId("trace-fingerprint").textContent();
    expect(shown).toContain(bundle.fingerprint);
    const replay = JSON.parse(cli("replay", file));
    expect(replay.rows).toBe(bundle.rows);
    expect(replay.fingerprint).toBe(bundle.fingerprint);
    expect(replay.matches).toBe(true);
  });

  it("a saved run reopens and replays the same trend", async () => {
    const title = `step to 72 °C ${Date.now()}`;
    await page.getByRole("button", { name: "Export replay file" }).click();
    const before = (await page.getByTestId("trace-fingerprint").textContent())!;
    await page.getByLabel("Run title").fill(title);
    await page.getByRole("button", { name: "Save this run" }).click();
    await page.getByRole("cell", { name: title }).first().waitFor();

    await page.reload();
    await page.getByTestId("pv-readout").filter({ hasText: /\d/ }).waitFor();
    const row = page.getByRole("row").filter({ hasText: title });
    await screenshot(page, "saved-run-listed");
    await row.getByRole("button", { name: "Open" }).click();
    // the worker replays it to its end at full speed; ask for the fingerprint until it has
    await expect
      .poll(
        async () => {
          await page.getByRole("button", { name: "Export replay file" }).click();
          await page.waitForTimeout(250);
          return page.getByTestId("trace-fingerprint").textContent();
        },
        { timeout: 20_000, interval: 300 },
      )
      .toBe(before);
  });

  it("a sweep of five PV filter values gives five rows equal to the CLI's results", async () => {
    await page.getByRole("tab", { name: "Experiments" }).click();
    await page.getByRole("tab", { name: "Sweep" }).click();
    await page.getByLabel("Parameter").selectOption("pvFilterTauS");
    await page.getByLabel("Values").fill("0, 1, 2, 4, 8");
    await page.getByRole("button", { name: "Run experiment" }).click();
    await page.getByTestId("experiment-status").filter({ hasText: "done" }).waitFor({ timeout: 60_000 });
    expect(await page.getByTestId("experiment-row").count()).toBe(5);
    const shownIae = (await page.getByTestId("experiment-iae").allTextContents()).map(Number);

    const download = page.waitForEvent("download");
    await page.getByRole("button", { name: /Export the experiment/ }).click();
    const file = path.join(scratch, "experiment.json");
    await (await download).saveAs(file);
    const doc = JSON.parse(readFileSync(file, "utf8"));
    writeFileSync(path.join(scratch, "drill.json"), JSON.stringify(doc.drill));
    expect(doc.runs.map((r: { controller: { pvFilterTauS: number } }) => r.controller.pvFilterTauS)).toEqual([0, 1, 2, 4, 8]);
    doc.runs.forEach((r: { controller: unknown }, i: number) => {
      const c = path.join(scratch, `c${i}.json`);
      writeFileSync(c, JSON.stringify(r.controller));
      const out = JSON.parse(cli("run", path.join(scratch, "drill.json"), "--controller", c, "--seed", String(doc.seed), "--no-score"));
      expect(out.results.windows[0].trueTemperature.iae.toFixed(1)).toBe(shownIae[i].toFixed(1));
    });
    await screenshot(page, "bench-sweep");
  });

  it("has no serious or critical accessibility findings (axe-core)", async () => {
    const serious = await seriousAxeFindings(page);
    expect(serious, JSON.stringify(serious, null, 2)).toEqual([]);
  });
});
