// Browser end-to-end helpers: playwright-core driving Debian's chromium (never a downloaded browser).
import path from "node:path";
import { createRequire } from "node:module";
import { chromium, type Browser, type BrowserContext, type Page } from "playwright-core";
import { DEMO_PASSWORD } from "@/db/seed";

export const baseUrl = () => {
  const url = process.env.E2E_BASE_URL;
  if (!url) throw new Error("E2E_BASE_URL is not set: run the browser tests through `npm test`");
  return url;
};

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--disable-dev-shm-usage"],
  });
}

export async function newUser(browser: Browser): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ baseURL: baseUrl(), viewport: { width: 1280, height: 860 } });
  const page = await context.newPage();
  return { context, page };
}

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

export async function screenshot(page: Page, name: string) {
  const dir = process.env.E2E_SCREENSHOTS;
  if (!dir) return;
  await page.screenshot({ path: path.join(dir, `${name}.png`), fullPage: true });
}

/**
 * The fields of a form as the server renders it (with JavaScript off, so React's hidden
 * server-action fields are still there), to replay its post from another session or origin.
 */
export async function serverRenderedFormFields(browser: Browser, as: BrowserContext, pathname: string, selector: string): Promise<Record<string, string>> {
  const noScript = await browser.newContext({ baseURL: baseUrl(), javaScriptEnabled: false, storageState: await as.storageState() });
  try {
    const page = await noScript.newPage();
    await page.goto(pathname);
    const pairs = await page.$$eval(`${selector} input`, (els) => els.map((i) => [(i as HTMLInputElement).name, (i as HTMLInputElement).value]));
    return Object.fromEntries(pairs);
  } finally {
    await noScript.close();
  }
}

/** A demo user signed in with the Bench open and its first readings shown. */
export async function openBench(browser: Browser, email: string): Promise<Page> {
  const { page } = await newUser(browser);
  await signIn(page, email);
  await page.waitForURL("**/dashboard");
  await page.goto("/bench");
  await page.getByTestId("pv-readout").filter({ hasText: /\d/ }).waitFor();
  return page;
}

/** axe-core's serious and critical findings on the page as it is (WCAG 2.1 A/AA rules as axe implements them). */
export async function seriousAxeFindings(page: Page) {
  const require = createRequire(import.meta.url);
  await page.addScriptTag({ path: require.resolve("axe-core/axe.min.js") });
  const result = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: unknown, opts: unknown) => Promise<{ violations: { id: string; impact: string; nodes: { target: string[] }[] }[] }> } }).axe;
    const r = await axe.run(document, { resultTypes: ["violations"] });
    return r.violations.map((v) => ({ id: v.id, impact: v.impact, nodes: v.nodes.slice(0, 3).map((n) => n.target.join(" ")) }));
  });
  return result.filter((v) => v.impact === "serious" || v.impact === "critical");
}
