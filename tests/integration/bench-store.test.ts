// The Bench's saved-work rules against the real PostgreSQL test database: owner-only changes,
// sharing within the organisation and never outside it, refusal of bad documents with nothing
// written, tuning-set name uniqueness, and saved runs that round-trip what replay needs.
// The behaviours are ours (docs/brief: "Saved work"); least-privilege and "deny writes nothing"
// are common practice (OWASP Authorization Cheat Sheet, from memory).
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { ActionRefused, fieldErrorsOf, formToObject } from "@/app/_lib/action";
import {
  countOwnedRows,
  createPlant,
  createRun,
  createTuningSet,
  deletePlant,
  deleteRun,
  deleteTuningSet,
  jsonPayloadField,
  plantInputSchema,
  setPlantShared,
  updatePlant,
  type BenchUser,
} from "@/app/_lib/bench-store";
import { hashPassword } from "@/app/_lib/password";
import { plantByRef, plantFor, plantsFor, runFor, runsFor, tuningSetsFor } from "@/db/bench-queries";
import { getDb } from "@/db/client";
import { organizations, plants, savedRuns, sessions } from "@/db/schema";
import { DEMO_ORGANIZATION } from "@/db/seed";
import { runDrill } from "@/sim/drill/run-drill";
import type { DrillInput } from "@/sim/drill/schema";
import { PLANT_PRESETS } from "@/sim/plant/presets";
import ladder from "@/sim/examples/setpoint-ladder.json";
import { randomBytes } from "node:crypto";
import { makeUser } from "./helpers";
import { SAMPLE_CABINET } from "@/app/_lib/access-registry";

const db = () => getDb();
let passwordHash = "";


let owner: BenchUser; // Kestrel Fen
let colleague: BenchUser; // Kestrel Fen
let outsider: BenchUser; // another organisation

beforeAll(async () => {
  passwordHash = await hashPassword("not-used-for-sign-in");
  const [demo] = await db().select().from(organizations).where(eq(organizations.name, DEMO_ORGANIZATION));
  const [other] = await db().insert(organizations).values({ name: `Saltmarsh Packaging Works ${Date.now()}` }).returning();
  owner = await makeUser(demo.id, "Owner", passwordHash);
  colleague = await makeUser(demo.id, "Colleague", passwordHash);
  outsider = await makeUser(other.id, "Outsider", passwordHash);
});

// A small drying cabinet of our own (fictional), shared with the access registry; a fresh copy per use.
const cabinet = () => ({ ...SAMPLE_CABINET });

const plantInput = (name: string) => ({ name, description: "Bay 2 drying cabinet", definition: cabinet() });

describe("the payload field of the actions' forms", () => {
  // the same parse defineAction does: FormData → object → zod; the first message is what the form shows
  const form = z.object({ payload: jsonPayloadField(plantInputSchema, 2000) });
  const parse = (payload: string) => {
    const fd = new FormData();
    fd.set("payload", payload);
    const r = form.safeParse(formToObject(fd));
    return r.success ? { ok: true as const, data: r.data } : { ok: false as const, error: Object.values(fieldErrorsOf(r.error))[0] };
  };

  it("parses a valid document and fills the engine's defaults", () => {
    const r = parse(JSON.stringify(plantInput("Cabinet K-9")));
    expect(r.ok && r.data.payload.definition).toMatchObject({ kind: "enclosure", nominalVoltageV: 230, pressurePa: 101325 });
  });

  it("answers one clear message for broken JSON, a bad field, an oversized or a missing payload", () => {
    expect(parse("{not json")).toEqual({ ok: false, error: "The form sent something that is not JSON." });
    expect(parse(JSON.stringify({ ...plantInput("x"), definition: { ...cabinet(), heaterRatingW: 0 } }))).toEqual({
      ok: false,
      error: expect.stringMatching(/^definition: The plant definition is not valid — heaterRatingW: /),
    });
    expect(parse(JSON.stringify({ ...plantInput("x"), description: "y".repeat(3000) }))).toEqual({ ok: false, error: "This is too large to save." });
    expect(form.safeParse(formToObject(new FormData())).success).toBe(false);
  });
});

describe("plants", () => {
  it("are changed, shared and deleted by their owner only", async () => {
    const { id, ref } = await createPlant(owner, plantInput("Cabinet K-7"));
    expect(ref).toBe(`plant:${id}`);

    const change = { plantId: id, ...plantInput("Cabinet K-7 (renamed)") };
    await expect(updatePlant(colleague, change)).rejects.toThrow(ActionRefused);
    await expect(setPlantShared(colleague, id, true)).rejects.toThrow("That plant does not exist."); // private: not even revealed
    await setPlantShared(owner, id, true);
    await expect(updatePlant(colleague, change)).rejects.toThrow("Only the owner of this plant can change it.");
    await expect(deletePlant(colleague, id)).rejects.toThrow("Only the owner of this plant can change it.");
    await expect(setPlantShared(colleague, id, false)).rejects.toThrow("Only the owner of this plant can change it.");
    await expect(updatePlant(outsider, change)).rejects.toThrow("That plant does not exist.");
    let [row] = await db().select().from(plants).where(eq(plants.id, id));
    expect(row.name).toBe("Cabinet K-7");
    expect(row.shared).toBe(true);

    await updatePlant(owner, { ...change, definition: { ...cabinet(), heaterRatingW: 2000 } });
    [row] = await db().select().from(plants).where(eq(plants.id, id));
    expect(row.name).toBe("Cabinet K-7 (renamed)");
    expect((row.definition as { heaterRatingW: number }).heaterRatingW).toBe(2000);
    // stored with the engine's defaults filled and the plant's name
    expect(row.definition).toMatchObject({ nominalVoltageV: 230, lossModel: "linear", name: "Cabinet K-7 (renamed)" });

    await deletePlant(owner, id);
    expect(await db().select().from(plants).where(eq(plants.id, id))).toHaveLength(0);
  });

  it("shared ones are visible within the organisation and never outside it; private ones only to the owner", async () => {
    const shared = await createPlant(owner, plantInput("Shared cabinet"));
    const privateOne = await createPlant(owner, plantInput("Private cabinet"));
    await setPlantShared(owner, shared.id, true);

    const refsOf = async (u: BenchUser) => (await plantsFor(u)).map((p) => p.ref);
    const presetRefs = PLANT_PRESETS.map((p) => `preset:${p.id}`);

    const ownerSees = await refsOf(owner);
    expect(ownerSees).toEqual(expect.arrayContaining([...presetRefs, shared.ref, privateOne.ref]));

    const colleagueSees = await plantsFor(colleague);
    expect(colleagueSees.map((p) => p.ref)).toContain(shared.ref);
    expect(colleagueSees.map((p) => p.ref)).not.toContain(privateOne.ref);
    expect(colleagueSees.find((p) => p.ref === shared.ref)).toMatchObject({ source: "shared", ownerName: "Owner" });
    expect(await plantFor(colleague, privateOne.id)).toBeNull();

    const outsiderSees = await refsOf(outsider);
    expect(outsiderSees).toEqual(expect.arrayContaining(presetRefs)); // presets are readable by all
    expect(outsiderSees).not.toContain(shared.ref);
    expect(outsiderSees).not.toContain(privateOne.ref);
    expect(await plantFor(outsider, shared.id)).toBeNull();
    expect(await plantByRef(outsider, shared.ref)).toBeNull();

    // every listed plant carries its derived figures
    const mine = (await plantsFor(owner)).find((p) => p.ref === shared.ref)!;
    expect(mine.figures!.staticGainCPerPercent).toBeGreaterThan(0);
    expect(mine.figures!.dominantTimeConstantS).toBeGreaterThan(mine.figures!.apparentDeadTimeS);

    await setPlantShared(owner, shared.id, false);
    expect((await refsOf(colleague))).not.toContain(shared.ref);
  });

  it("refuses a bad definition with a clear message and writes nothing", async () => {
    const before = await countOwnedRows([owner.id]);
    // U must include both films: 1/U > 1/h_inner + 1/h_outer (the engine's refinement)
    await expect(createPlant(owner, { ...plantInput("Bad U"), definition: { ...cabinet(), wallUValueWPerM2K: 9 } })).rejects.toThrow(
      /plant definition is not valid — wallUValueWPerM2K: 1\/U must exceed/,
    );
    await expect(createPlant(owner, { ...plantInput("Negative volume"), definition: { ...cabinet(), volumeM3: -1 } })).rejects.toThrow(/volumeM3/);
    await expect(createPlant(owner, { ...plantInput("Unknown field"), definition: { ...cabinet(), colour: "grey" } })).rejects.toThrow(ActionRefused);
    await expect(createPlant(owner, { ...plantInput(""), definition: cabinet() })).rejects.toThrow("Give the plant a name.");
    const { id } = await createPlant(owner, plantInput("Good one"));
    await expect(updatePlant(owner, { plantId: id, ...plantInput("Good one"), definition: { ...cabinet(), sensorTimeConstantS: 0 } })).rejects.toThrow(/sensorTimeConstantS/);
    const [row] = await db().select().from(plants).where(eq(plants.id, id));
    expect((row.definition as { sensorTimeConstantS: number }).sensorTimeConstantS).toBe(12);
    const after = await countOwnedRows([owner.id]);
    expect(after).toEqual({ ...before, plants: before.plants + 1 });
  });
});

describe("tuning sets", () => {
  const controller = { kind: "pid", form: "standard", kc: 4, ti: 300, td: 30, pvFilterTauS: 2 };

  it("are unique by name per owner and plant, with a message that says so", async () => {
    const ref = "preset:benchtop-curing-cabinet";
    await createTuningSet(owner, { plantRef: ref, name: "Relay test, Tyreus–Luyben PI", controller });
    const before = await countOwnedRows([owner.id]);
    await expect(createTuningSet(owner, { plantRef: ref, name: "Relay test, Tyreus–Luyben PI", controller: { ...controller, kc: 5 } })).rejects.toThrow(
      'You already have a tuning set named "Relay test, Tyreus–Luyben PI" for this plant.',
    );
    expect(await countOwnedRows([owner.id])).toEqual(before);
    // the same name is free on another plant and for another user
    await createTuningSet(owner, { plantRef: "preset:walk-in-drying-room", name: "Relay test, Tyreus–Luyben PI", controller });
    await createTuningSet(colleague, { plantRef: ref, name: "Relay test, Tyreus–Luyben PI", controller });

    const listed = await tuningSetsFor(owner, ref);
    const mine = listed.find((t) => t.name === "Relay test, Tyreus–Luyben PI")!;
    expect(mine.controller).toMatchObject({ kc: 4, ti: 300, td: 30, pvFilterTauS: 2, sampleTimeS: 0.1 }); // engine defaults filled
    expect((await tuningSetsFor(colleague, ref)).map((t) => t.id)).not.toContain(mine.id);

    await expect(deleteTuningSet(colleague, mine.id)).rejects.toThrow("That tuning set does not exist.");
    await deleteTuningSet(owner, mine.id);
    expect((await tuningSetsFor(owner, ref)).map((t) => t.id)).not.toContain(mine.id);
  });

  it("refuses a bad controller, an unknown preset and a plant the user cannot read", async () => {
    const privatePlant = await createPlant(owner, plantInput("Owner's private rig"));
    const before = await countOwnedRows([owner.id, colleague.id]);
    await expect(createTuningSet(owner, { plantRef: "preset:benchtop-curing-cabinet", name: "Bad limits", controller: { ...controller, outMinPct: 50, outMaxPct: 10 } })).rejects.toThrow(
      /controller configuration is not valid — outMaxPct/,
    );
    await expect(createTuningSet(owner, { plantRef: "preset:no-such-rig", name: "x", controller })).rejects.toThrow("That preset does not exist.");
    await expect(createTuningSet(owner, { plantRef: "rig-7", name: "x", controller })).rejects.toThrow(/Choose a plant/);
    await expect(createTuningSet(colleague, { plantRef: privatePlant.ref, name: "Borrowed", controller })).rejects.toThrow("That plant does not exist.");
    expect(await countOwnedRows([owner.id, colleague.id])).toEqual(before);
  });
});

describe("saved runs", () => {
  // A short version of the example cure ladder: the first step only, 600 s.
  const drill: DrillInput = {
    ...(ladder as unknown as DrillInput),
    id: "bench-store-test",
    title: "First step of the cure ladder",
    events: [{ type: "setpoint", timeS: 300, setpointC: 80 }],
    scoring: { ...(ladder as unknown as DrillInput).scoring, windows: [{ id: "step-80", label: "60 → 80 °C", kind: "setpoint", startS: 300, endS: 600, weight: 1 }] },
    durationS: 600,
  };
  const actionLog = [
    { sample: 200, type: "setpoint", setpointC: 61 },
    { sample: 900, type: "tuning", controller: { kc: 5, ti: 350, sampleTimeS: 0.5 } },
    { sample: 1000, type: "mode", mode: "manual" },
    { sample: 1010, type: "manual-output", outPercent: 40 },
    { sample: 1100, type: "mode", mode: "auto" },
  ];

  async function saveOne(user: BenchUser, title: string) {
    const run = runDrill(drill, null, [], 3141);
    return createRun(user, {
      plantRef: "preset:benchtop-curing-cabinet",
      title,
      drill,
      controller: run.controller,
      seed: run.seed,
      actionLog,
      results: JSON.parse(JSON.stringify(run.results)),
      engineVersion: run.engineVersion,
      durationS: 600,
    });
  }

  it("round-trip the drill, controller, seed, action log and engine version; lists are newest first and light", async () => {
    const first = await saveOne(owner, "Ladder step, reference tuning");
    const second = await saveOne(owner, "Ladder step, again");
    const full = await runFor(owner, first.id);
    expect(full).not.toBeNull();
    expect(full!.engineVersion).toBe(runDrill(drill, null, [], 3141).engineVersion);
    expect(full!.seed).toBe(3141);
    expect(full!.durationS).toBe(600);
    expect(full!.actionLog).toHaveLength(actionLog.length);
    expect(full!.actionLog[0]).toEqual({ sample: 200, type: "setpoint", setpointC: 61 });
    expect(full!.actionLog[1]).toMatchObject({ sample: 900, type: "tuning", controller: { kc: 5, ti: 350, sampleTimeS: 0.5, form: "standard" } });
    expect(full!.actionLog.map((a) => a.sample)).toEqual([200, 900, 1000, 1010, 1100]);
    expect(full!.drill).toMatchObject({ id: "bench-store-test", durationS: 600, noise: { seed: 3141 } });
    expect(full!.controller).toMatchObject({ kc: 6, ti: 400, sampleTimeS: 0.5 });

    // replaying what was stored gives the stored results (the trace is re-derived, never stored)
    const replay = runDrill(full!.drill, full!.controller, [], full!.seed);
    expect(JSON.parse(JSON.stringify(replay.results))).toEqual(full!.results);

    const list = await runsFor(owner, "preset:benchtop-curing-cabinet");
    const ids = list.map((r) => r.id);
    expect(ids.indexOf(second.id)).toBeLessThan(ids.indexOf(first.id));
    const summary = list.find((r) => r.id === first.id)!;
    expect(summary).toMatchObject({ title: "Ladder step, reference tuning", seed: 3141, actionCount: 5, durationS: 600 });
    // key results come from the scoring window (the one step here), on the true temperature
    const win = (full!.results as { windows: { trueTemperature: { iae: number; overshootPct: number | null; settlingTimeS: number | null } }[] }).windows[0].trueTemperature;
    expect(summary.keyResults.iae).toBeCloseTo(win.iae, 9);
    expect(summary.keyResults.iae).toBeGreaterThan(0);
    expect(summary.keyResults.overshootPct).toBe(win.overshootPct);
    expect(summary.keyResults.settlingTimeS).toBe(win.settlingTimeS);
    expect(summary).not.toHaveProperty("drill");
    expect(summary).not.toHaveProperty("actionLog");
  });

  it("are the owner's only, and refuse bad action logs with nothing written", async () => {
    const { id } = await saveOne(owner, "Mine");
    expect(await runFor(colleague, id)).toBeNull();
    expect(await runFor(outsider, id)).toBeNull();
    expect((await runsFor(colleague, "preset:benchtop-curing-cabinet")).map((r) => r.id)).not.toContain(id);
    await expect(deleteRun(colleague, id)).rejects.toThrow("That saved run does not exist.");

    const before = await db().select({ id: savedRuns.id }).from(savedRuns);
    const base = { plantRef: "preset:benchtop-curing-cabinet", title: "bad", drill, controller: {}, seed: 1, results: {}, engineVersion: "1.0.0", durationS: 600 };
    await expect(createRun(owner, { ...base, actionLog: [{ sample: -1, type: "setpoint", setpointC: 50 }] })).rejects.toThrow(/action log is not valid/);
    await expect(createRun(owner, { ...base, actionLog: [{ sample: 3, type: "open-door" }] })).rejects.toThrow(/action log is not valid/);
    await expect(createRun(owner, { ...base, actionLog: [], drill: { ...drill, durationS: -5 } })).rejects.toThrow(/drill is not valid/);
    await expect(createRun(owner, { ...base, actionLog: [], seed: 1.5 })).rejects.toThrow(/whole number/);
    await expect(createRun(owner, { ...base, actionLog: [], results: { wholeRun: { trueTemperature: { iae: "lots" } } } })).rejects.toThrow(/results record/);
    expect(await db().select({ id: savedRuns.id }).from(savedRuns)).toHaveLength(before.length);

    await deleteRun(owner, id);
    expect(await runFor(owner, id)).toBeNull();
  });

  it("go with their plant when the owner deletes it", async () => {
    const plant = await createPlant(owner, plantInput("Short-lived rig"));
    await createTuningSet(owner, { plantRef: plant.ref, name: "PI", controller: { kc: 3, ti: 200 } });
    await createRun(owner, {
      plantRef: plant.ref,
      title: "",
      drill,
      controller: { kc: 3, ti: 200 },
      seed: 7,
      actionLog: [],
      results: {},
      engineVersion: "1.0.0",
      durationS: 600,
    });
    const [run] = await runsFor(owner, plant.ref);
    expect(run.title).toBe("First step of the cure ladder · seed 7"); // a title when none was given
    expect(run.keyResults).toEqual({ iae: null, overshootPct: null, settlingTimeS: null, trips: 0 });
    await deletePlant(owner, plant.id);
    expect(await tuningSetsFor(owner, plant.ref)).toHaveLength(0);
    expect(await runsFor(owner, plant.ref)).toHaveLength(0);
  });
});

// The route handlers over HTTP against the running production build (tests/run-all.ts starts it
// and sets E2E_BASE_URL). A session row stands in for a sign-in: Lucia's cookie carries its id.
describe.skipIf(!process.env.E2E_BASE_URL)("route handlers", () => {
  const base = process.env.E2E_BASE_URL!;
  const cookies = new Map<string, string>();
  async function cookieOf(user: BenchUser) {
    if (!cookies.has(user.id)) {
      const id = randomBytes(20).toString("hex");
      await db().insert(sessions).values({ id, userId: user.id, expiresAt: new Date(Date.now() + 3_600_000) });
      cookies.set(user.id, `loopwright_session=${id}`);
    }
    return cookies.get(user.id)!;
  }
  async function get(path: string, user?: BenchUser) {
    const res = await fetch(`${base}${path}`, { headers: user ? { cookie: await cookieOf(user) } : {}, redirect: "manual" });
    return { status: res.status, body: (await res.json()) as Record<string, unknown> };
  }

  it("answer 401 without a session, 400 without a plant, and only the rows the user may read", async () => {
    const privatePlant = await createPlant(owner, plantInput("HTTP private rig"));
    const sharedPlant = await createPlant(owner, plantInput("HTTP shared rig"));
    await setPlantShared(owner, sharedPlant.id, true);
    const run = await createRun(owner, {
      plantRef: sharedPlant.ref,
      title: "HTTP run",
      drill: ladder,
      controller: { kc: 4, ti: 300 },
      seed: 99,
      actionLog: [{ sample: 10, type: "setpoint", setpointC: 65 }],
      results: {},
      engineVersion: "1.0.0",
      durationS: 7500,
    });

    expect(await get("/api/plants")).toEqual({ status: 401, body: { error: "Sign in first." } });
    expect((await get(`/api/runs/${run.id}`)).status).toBe(401);

    const refs = async (u: BenchUser) => ((await get("/api/plants", u)).body.plants as { ref: string }[]).map((p) => p.ref);
    expect(await refs(owner)).toEqual(expect.arrayContaining([privatePlant.ref, sharedPlant.ref, "preset:benchtop-curing-cabinet"]));
    expect(await refs(colleague)).toContain(sharedPlant.ref);
    expect(await refs(colleague)).not.toContain(privatePlant.ref);
    expect(await refs(outsider)).not.toContain(sharedPlant.ref);
    expect((await get(`/api/plants/${privatePlant.id}`, colleague)).status).toBe(404);
    expect((await get(`/api/plants/${sharedPlant.id}`, outsider)).status).toBe(404);
    expect((await get(`/api/plants/${sharedPlant.id}`, colleague)).body.plant).toMatchObject({ ref: sharedPlant.ref, source: "shared" });
    expect((await get("/api/plants/walk-in-drying-room", outsider)).status).toBe(200);

    expect((await get("/api/tuning-sets", owner)).status).toBe(400);
    expect((await get("/api/runs?plant=rig-7", owner)).status).toBe(400);
    const listed = (await get(`/api/runs?plant=${encodeURIComponent(sharedPlant.ref)}`, owner)).body.runs as Record<string, unknown>[];
    expect(listed.map((r) => r.id)).toEqual([run.id]);
    expect(listed[0]).not.toHaveProperty("actionLog");
    expect((await get(`/api/runs?plant=${encodeURIComponent(sharedPlant.ref)}`, colleague)).body.runs).toEqual([]);

    const full = await get(`/api/runs/${run.id}`, owner);
    expect(full.status).toBe(200);
    expect(full.body.run).toMatchObject({ id: run.id, seed: 99, engineVersion: "1.0.0", actionLog: [{ sample: 10, type: "setpoint", setpointC: 65 }] });
    expect(await get(`/api/runs/${run.id}`, colleague)).toEqual({ status: 404, body: { error: "No such saved run." } });
    expect((await get(`/api/runs/${run.id}`, outsider)).status).toBe(404);
    expect((await get("/api/runs/not-a-uuid", owner)).status).toBe(404);
  });
});
