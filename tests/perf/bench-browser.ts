// npm run perf:bench — browser figures for the Bench (a benchmark, not a test): trend redraw
// rate and long tasks at ×60 with 2 h of 10 Hz data on screen, the time of a 20 × 20 tuning map
// of a 1-hour proof test, and the compressed JavaScript /bench loads (worker included).
// Needs the app running (npm start) or E2E_BASE_URL; signs in as a demo trainee.
import { chromium } from "playwright-core";

const base = process.env.E2E_BASE_URL ?? "http://127.0.0.1:3000";
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function main() {
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", args: ["--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync"] });
  const context = await browser.newContext({ baseURL: base, viewport: { width: 1600, height: 1000 } });
  const page = await context.newPage();
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill("hoa@students.kestrelfen.example");
  await page.getByLabel("Password").fill("demo-loop-2026");
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL("**/dashboard");

  let scriptBytes = 0;
  const scripts: string[] = [];
  page.on("requestfinished", async (req) => {
    if (req.resourceType() !== "script" && !/\.js(\?|$)/.test(req.url())) return;
    const sizes = await req.sizes().catch(() => null);
    if (sizes) {
      scriptBytes += sizes.responseBodySize + sizes.responseHeadersSize;
      scripts.push(req.url());
    }
  });
  await page.goto("/bench");
  await page.getByTestId("pv-readout").filter({ hasText: /\d/ }).waitFor();
  await page.waitForTimeout(1500); // the worker chunk and lazy chunks

  // 10 Hz sample time, then 2 h of data at ×600
  await page.getByLabel("Sample time").fill("0.1");
  await page.getByRole("button", { name: "Apply tuning (bumpless)" }).click();
  await page.waitForTimeout(500);
  await page.getByRole("button", { name: "×600" }).click(); // 2 h in about 12 s
  await page.waitForFunction(() => Number(/sim (\d+):\d\d:\d\d/.exec(document.querySelector('[data-testid="sim-time"]')?.textContent ?? "")?.[1] ?? 0) >= 2, null, { timeout: 120_000, polling: 20 });
  await page.getByRole("button", { name: "Pause" }).click();
  await page.getByRole("button", { name: "2 h", exact: true }).click();
  await page.getByRole("button", { name: "×60", exact: true }).click();

  const fps: number[] = [];
  const longTasks: number[] = [];
  await page.evaluate(() => {
    const w = window as unknown as { __lt: number[] };
    w.__lt = [];
    new PerformanceObserver((list) => list.getEntries().forEach((e) => w.__lt.push(e.duration))).observe({ type: "longtask", buffered: false });
  });
  for (let i = 0; i < 5; i++) {
    const before = await page.evaluate(() => (window as unknown as { __loopwrightTrendDraws: number }).__loopwrightTrendDraws);
    const t0 = Date.now();
    await page.waitForTimeout(2000);
    const after = await page.evaluate(() => (window as unknown as { __loopwrightTrendDraws: number }).__loopwrightTrendDraws);
    fps.push(((after - before) * 1000) / (Date.now() - t0));
  }
  longTasks.push(...(await page.evaluate(() => (window as unknown as { __lt: number[] }).__lt)));
  const rows = await page.evaluate(() => document.querySelector('[data-testid="sim-time"]')?.textContent);
  await page.getByRole("button", { name: "Pause" }).click();

  // 20 × 20 tuning map of a 1-hour proof test
  await page.getByRole("tab", { name: "Experiments" }).click();
  await page.getByRole("tab", { name: "Tuning map" }).click();
  await page.getByLabel("Run length").fill("60");
  await page.getByLabel("Grid (n × n)").fill("20");
  const mapTimes: number[] = [];
  for (let i = 0; i < 3; i++) {
    await page.getByRole("button", { name: "Run experiment" }).click();
    await page.getByTestId("experiment-status").filter({ hasText: "done" }).waitFor({ timeout: 120_000 });
    const text = (await page.getByTestId("experiment-status").textContent()) ?? "";
    mapTimes.push(Number(/([\d.]+) s$/.exec(text.trim())?.[1] ?? NaN));
  }

  console.log(JSON.stringify({ trend: { onScreen: "2 h of 10 Hz (72 000 samples)", at: rows, redrawsPerSecondMedian: median(fps), redrawsPerSecond: fps, longTasksOver50ms: longTasks.filter((d) => d > 50).length, longestTaskMs: Math.max(0, ...longTasks) }, tuningMap20x20OneHour: { medianS: median(mapTimes), runsS: mapTimes }, benchJavaScript: { compressedKiB: Math.round(scriptBytes / 1024), files: scripts.length } }, null, 2));
  await browser.close();
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
