// The authorization matrix (issue 6, "Tests"): generated from app/_lib/access-registry.ts, the
// registry of every route handler and server action, and run as every kind of user in ACTORS
// (admin; instructor of the cohort; instructor of another cohort; trainee member — the owner of
// the Bench fixtures; trainee non-member; deactivated user; anonymous; and the admin, instructor
// and trainee of a second organisation). Only the allowed ones succeed; the rest are refused and
// change nothing in the database.
//
// 1. Completeness: app/ and components/ are scanned (tests/integration/access/scan.ts, with the
//    TypeScript parser) for route handlers — route.ts files and their exported HTTP methods — and
//    for server actions — every export of a module whose directive prologue is "use server". A
//    handler or action that is not in the registry fails the test, and so does a registry entry
//    that no longer exists. Inline "use server" functions fail too: the matrix cannot call them;
//    put them in an actions file.
// 2. Route handlers are called over HTTP against the running production build (E2E_BASE_URL, set by
//    tests/run-all.ts). A signed-in user is a Lucia session row inserted for the fixture user and
//    sent as the cookie `loopwright_session=<id>`. Allowed: 2xx (and the case's marker, usually a
//    fixture id, in the body). Refused: 401 when signed out (anonymous, or a deactivated user's
//    still-presented cookie), otherwise 403/404 — or, for lists (deny "omit"), 200 without the
//    marker. The marker never appears in a refused answer.
// 3. Server actions are called directly in this process, as the exported function the form posts
//    to, with Next's request context mocked: next/headers gives cookies() (the session cookie) and
//    headers() (the peer address server.ts would set), next/cache's revalidatePath is recorded, and
//    next/navigation's redirect() throws a RedirectSignal that is the call's outcome. Chosen over
//    posting server-rendered forms to the running app (tests/e2e/accounts.test.ts does that for the
//    sign-in) because it runs the same code after Next has decoded the form — defineAction's zod
//    parse, the guard, the handler — in milliseconds per call and without scraping action ids
//    from pages, so the 600-odd cells stay fast and deterministic. What it does not exercise is Next's
//    own action routing and its Origin/Host check. Allowed: { ok: true } (or the expected
//    redirect), and the database changed. Refused: { ok: false } without field errors (a field
//    error would mean the registry's call is invalid, not that the guard refused), or a redirect
//    to /sign-in or /forbidden.
// 4. "Nothing changed" is a digest of every public table's rows that belong to the matrix
//    (tests/integration/access/db-digest.ts), taken before and after each refused call.
//
// Fixtures (tests/integration/access/fixtures.ts) live beside the seeded demo organisation; calls
// that use something up (a delete, a link token) get a fresh one per cell. Least privilege and
// "a denied request changes nothing" are common practice (OWASP Authorization Cheat Sheet, from
// memory); who may do what is the app's own rule, stated per entry in the registry.
// A submission queues its replay; in this file it goes to a queue no worker serves, so no replay
// writes to the fixtures while a refused call's "nothing changed" is being checked.
process.env.LOOPWRIGHT_QUEUE_PREFIX = "access-matrix-";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { ACCESS_REGISTRY, ACTORS, ALL_ACTORS, entryKey, type Actor, type ActionCase, type ActionEntry, type MatrixFixtures, type RouteCase, type RouteEntry } from "@/app/_lib/access-registry";
import type { ActionResult } from "@/app/_lib/action";
import { changedTables, digest } from "./access/db-digest";
import { buildWorld, makeFresh, MARKER, sessionFor, uniqueText, type MatrixWorld } from "./access/fixtures";
import { NavigationSignal, RedirectSignal, requestContext } from "./access/next-context";
import { scanApp } from "./access/scan";

vi.mock("next/headers", async () => {
  const ctx = await import("./access/next-context");
  return {
    cookies: async () => ctx.cookieJar,
    headers: async () => ctx.requestContext.headers,
    draftMode: async () => ({ isEnabled: false, enable() {}, disable() {} }),
  };
});
vi.mock("next/cache", async () => {
  const ctx = await import("./access/next-context");
  const record = (path: string) => void ctx.requestContext.revalidated.push(path);
  return { revalidatePath: record, revalidateTag: record, updateTag: record, refresh: () => {}, unstable_noStore: () => {} };
});
vi.mock("next/navigation", async () => {
  const ctx = await import("./access/next-context");
  const redirect = (url: string): never => {
    throw new ctx.RedirectSignal(url);
  };
  const signal = (kind: "notFound" | "forbidden" | "unauthorized") => (): never => {
    throw new ctx.NavigationSignal(kind);
  };
  return {
    redirect,
    permanentRedirect: redirect,
    notFound: signal("notFound"),
    forbidden: signal("forbidden"),
    unauthorized: signal("unauthorized"),
    RedirectType: { push: "push", replace: "replace" },
  };
});

const root = fileURLToPath(new URL("../..", import.meta.url));
const baseUrl = process.env.E2E_BASE_URL;
const SESSION_COOKIE = "loopwright_session";
const signedOut = (actor: Actor) => actor === "anonymous" || actor === "deactivated";

// Built once, by the first suite that runs cells; the registry checks need no database, so
// `vitest run tests/integration/access-matrix.test.ts -t "access registry"` lists what is missing.
let world: MatrixWorld;
let building: Promise<MatrixWorld> | null = null;
const needWorld = () =>
  beforeAll(async () => {
    world = await (building ??= buildWorld());
  }, 60_000);

async function cell(c: RouteCase | ActionCase, actor: Actor) {
  const fresh = await makeFresh(world, c.fresh ?? []);
  const fx: MatrixFixtures = { ...world.fixtures, unique: uniqueText(), fresh };
  const sessionId = actor === "anonymous" ? null : await sessionFor(world.userIds[actor]!);
  return { fx, sessionId };
}

const snapshot = () => digest(MARKER, world.ownIds);

/** One row of the matrix: the case as each kind of user, with what should happen. */
const cellsOf = (c: RouteCase | ActionCase) => ALL_ACTORS.map((actor) => ({ actor, expected: c.allowed.includes(actor) ? "allowed" : "refused" }));

// ---------------------------------------------------------------- completeness

describe("the access registry", () => {
  it("registers every route handler and server action in the app, and nothing that is gone", () => {
    const found = scanApp(root);
    const registered = ACCESS_REGISTRY.map(entryKey);
    const inApp = new Set([...found.routes, ...found.actions]);
    expect(found.routes.length + found.actions.length).toBeGreaterThan(0);
    const notRegistered = [...inApp].filter((k) => !registered.includes(k));
    const gone = registered.filter((k) => !inApp.has(k));
    expect(
      { notRegistered, gone, inlineServerActions: found.inlineActions },
      "add an entry to app/_lib/access-registry.ts for each handler or action listed, remove the gone ones",
    ).toEqual({ notRegistered: [], gone: [], inlineServerActions: [] });
  });

  it("has one entry per handler or action, each with cases for known kinds of user", () => {
    const keys = ACCESS_REGISTRY.map(entryKey);
    expect(keys.filter((k, i) => keys.indexOf(k) !== i), "registered twice").toEqual([]);
    for (const entry of ACCESS_REGISTRY) {
      expect(entry.cases.length, `${entryKey(entry)} has no cases`).toBeGreaterThan(0);
      for (const c of entry.cases) for (const a of c.allowed) expect(Object.keys(ACTORS), `${entryKey(entry)}: unknown actor`).toContain(a);
    }
  });

  it("names exported functions for every action entry", async () => {
    for (const entry of ACCESS_REGISTRY.filter((e): e is ActionEntry => e.kind === "action")) {
      expect(typeof (await loadAction(entry)), entryKey(entry)).toBe("function");
    }
  });
});

// ---------------------------------------------------------------- route handlers

async function routeCell(entry: RouteEntry, c: RouteCase, actor: Actor) {
  const { fx, sessionId } = await cell(c, actor);
  const req = c.request(fx);
  const headers: Record<string, string> = { ...req.headers };
  if (sessionId) headers.cookie = `${SESSION_COOKIE}=${sessionId}`;
  if (req.body !== undefined) headers["content-type"] = "application/json";
  const marker = c.marker?.(fx);

  const before = await snapshot();
  const res = await fetch(`${baseUrl}${req.url}`, {
    method: entry.method,
    headers,
    body: req.body === undefined ? undefined : JSON.stringify(req.body),
    redirect: "manual",
  });
  const text = await res.text();
  const after = await snapshot();
  const what = `${entry.method} ${req.url} as ${actor} (${ACTORS[actor]}) → ${res.status} ${text.slice(0, 200)}`;

  if (c.allowed.includes(actor)) {
    expect(res.status >= 200 && res.status < 300, `allowed, but refused: ${what}`).toBe(true);
    if (marker) expect(text.includes(marker), `allowed, but the answer lacks ${marker}: ${what}`).toBe(true);
    return;
  }
  if (signedOut(actor)) expect(res.status, `signed out must be 401: ${what}`).toBe(401);
  else if (c.deny === "omit") expect([200, 403, 404], `refused: ${what}`).toContain(res.status);
  else expect([403, 404], `refused must be 403/404: ${what}`).toContain(res.status);
  if (marker) expect(text.includes(marker), `refused, but the answer reveals ${marker}: ${what}`).toBe(false);
  expect(changedTables(before, after), `refused, but the database changed: ${what}`).toEqual([]);
}

describe.skipIf(!baseUrl)("route handlers, over HTTP", () => {
  needWorld();
  for (const entry of ACCESS_REGISTRY.filter((e): e is RouteEntry => e.kind === "route")) {
    describe(`${entryKey(entry)} — ${entry.rule}`, () => {
      for (const c of entry.cases) {
        describe(c.label, () => {
          it.each(cellsOf(c))("as $actor → $expected", ({ actor }) => routeCell(entry, c, actor));
        });
      }
    });
  }
});

// ---------------------------------------------------------------- server actions

type ServerAction = (previous: ActionResult, form: FormData) => Promise<ActionResult | void>;

async function loadAction(entry: ActionEntry): Promise<ServerAction> {
  const mod = (await import(/* @vite-ignore */ join(root, entry.module))) as Record<string, unknown>;
  return mod[entry.name] as ServerAction;
}

type Outcome = { result: ActionResult | void } | { redirect: string } | { navigation: string };

const describeOutcome = (o: Outcome) => JSON.stringify(o).slice(0, 300);

async function actionCell(entry: ActionEntry, c: ActionCase, actor: Actor) {
  const { fx, sessionId } = await cell(c, actor);
  const form = new FormData();
  for (const [k, v] of Object.entries(c.form(fx))) form.set(k, v);
  // x-loopwright-peer is what server.ts sets from the socket; a peer of its own per cell, so the
  // per-address limits (sign-in failures, reset requests) count each cell as a separate client
  const headers = { "x-loopwright-peer": `peer-${fx.unique}`, host: new URL(baseUrl ?? "http://127.0.0.1").host };
  requestContext.reset(sessionId ? { [SESSION_COOKIE]: sessionId } : {}, headers);
  const action = await loadAction(entry);

  const before = await snapshot();
  let outcome: Outcome;
  try {
    outcome = { result: await action({ ok: true }, form) };
  } catch (err) {
    if (err instanceof RedirectSignal) outcome = { redirect: err.url };
    else if (err instanceof NavigationSignal) outcome = { navigation: err.kind };
    else throw err;
  }
  const after = await snapshot();
  const changed = changedTables(before, after);
  const what = `${entryKey(entry)} (${c.label}) as ${actor} (${ACTORS[actor]}) → ${describeOutcome(outcome)}`;

  if (c.allowed.includes(actor)) {
    if (typeof c.redirectsTo === "string") expect(outcome, `allowed, but: ${what}`).toEqual({ redirect: c.redirectsTo });
    else if (c.redirectsTo) expect("redirect" in outcome && c.redirectsTo.test(outcome.redirect), `allowed, but: ${what}`).toBe(true);
    else expect("result" in outcome && outcome.result && outcome.result.ok, `allowed, but: ${what}`).toBe(true);
    if (c.writes !== false) expect(changed.length, `allowed and answered, but wrote nothing: ${what}`).toBeGreaterThan(0);
    return;
  }
  const refused =
    ("result" in outcome && outcome.result !== undefined && outcome.result.ok === false && !outcome.result.fieldErrors) ||
    ("redirect" in outcome && /^\/(sign-in|forbidden)(\?|$)/.test(outcome.redirect)) ||
    "navigation" in outcome;
  expect(refused, `should be refused: ${what}`).toBe(true);
  expect(changed, `refused, but the database changed: ${what}`).toEqual([]);
}

describe("server actions, called in process", () => {
  needWorld();
  for (const entry of ACCESS_REGISTRY.filter((e): e is ActionEntry => e.kind === "action")) {
    describe(`${entryKey(entry)} — ${entry.rule}`, () => {
      for (const c of entry.cases) {
        describe(c.label, () => {
          it.each(cellsOf(c))("as $actor → $expected", ({ actor }) => actionCell(entry, c, actor));
        });
      }
    });
  }
});
