// Tuning records against the real PostgreSQL test database: writing one from a preset and from a
// stored plant (every proof test re-run on the server), each refusal with its message and no row
// written, the list and its filters, visibility within the organisation only, the frozen
// sign-off (here and by the trigger of migration 0005), and the traces CSV that re-runs the tests.
// The rules are ours (docs/brief: "Tuning record"); "deny writes nothing" and answering a missing
// and a foreign id alike are common practice (OWASP Authorization Cheat Sheet, from memory).
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { fieldErrorsOf, formToObject } from "@/app/_lib/action";
import { createPlant, createTuningSet, jsonPayloadField, setPlantShared, type BenchUser } from "@/app/_lib/bench-store";
import { createTuningRecord } from "@/app/_lib/records/create-record";
import { recordRequestSchema, type ProofTestRequest, type RecordRequest } from "@/app/_lib/records/record-document";
import { recordDetail, recordsFor } from "@/app/_lib/records/record-queries";
import { recordTracesCsv } from "@/app/_lib/records/record-traces-csv";
import { signOffRecord, updateRecordNotes } from "@/app/_lib/records/update-record";
import { hashPassword } from "@/app/_lib/password";
import { SAMPLE_CABINET } from "@/app/_lib/access-registry";
import { getDb } from "@/db/client";
import { dataUploads, organizations, plants, tuningRecords, tuningSets } from "@/db/schema";
import { DEMO_ORGANIZATION } from "@/db/seed";
import { drillSchema, type DrillInput } from "@/sim/drill/schema";
import { runDrill } from "@/sim/drill/run-drill";
import { traceFingerprint } from "@/sim/drill/trace-hash";
import { findPreset } from "@/sim/plant/presets";
import ladder from "@/sim/examples/setpoint-ladder.json";
import { createHash, randomUUID } from "node:crypto";
import { dbRefusal, makeUser } from "./helpers";

const db = () => getDb();
let passwordHash = "";


let author: BenchUser; // Kestrel Fen
let colleague: BenchUser; // Kestrel Fen
let outsider: BenchUser; // another organisation

const PRESET = "benchtop-curing-cabinet";
const pid = { kind: "pid", form: "standard", kc: 5, ti: 420, td: 20, sampleTimeS: 0.5, pvFilterTauS: 2 } as const;

/** A short proof test on the ladder's preset: 60 → 70 °C, 20 min of simulated time. */
function presetDrill(): DrillInput {
  return {
    ...(ladder as DrillInput),
    id: "record-proof-preset",
    title: "Proof: step to 70 °C",
    events: [{ type: "setpoint", timeS: 60, setpointC: 70 }],
    scoring: { ...(ladder as DrillInput).scoring, windows: [{ id: "step-70", label: "60 → 70 °C", kind: "setpoint", startS: 60, endS: 1200, weight: 1 }] },
    durationS: 1200,
  };
}

/** The same step on a stored plant: the drill carries the plant's definition in full, and a cutout. */
function plantDrill(definition: Record<string, unknown>): DrillInput {
  return {
    ...presetDrill(),
    id: "record-proof-plant",
    plant: definition as DrillInput["plant"],
    cutout: { enabled: true, tripPointC: 150, sensorTimeConstantS: 10, resetMarginC: 5 },
    sensor: undefined,
  };
}

const proof = (drill: DrillInput, over: Partial<ProofTestRequest> = {}): ProofTestRequest => ({
  kind: "proof",
  label: "SP step 60 → 70 °C",
  tuningLabel: "PID",
  drill: drillSchema.parse(drill),
  drillVersion: null,
  controller: { ...drill.referenceTuning, ...pid } as ProofTestRequest["controller"],
  seed: 7,
  ...over,
});

const recordCount = async (u: BenchUser) => (await db().select({ id: tuningRecords.id }).from(tuningRecords).where(eq(tuningRecords.ownerId, u.id))).length;

/** Refused with this message, and nothing written. */
async function refused(u: BenchUser, input: unknown, message: string | RegExp) {
  const before = await recordCount(u);
  await expect(createTuningRecord(u, input)).rejects.toThrow(message);
  expect(await recordCount(u)).toBe(before);
}

let presetSetId = "";
let plantId = "";
let plantSetId = "";

beforeAll(async () => {
  passwordHash = await hashPassword("not-used-for-sign-in");
  const [demo] = await db().select().from(organizations).where(eq(organizations.name, DEMO_ORGANIZATION));
  const [other] = await db().insert(organizations).values({ name: `Saltmarsh Packaging Works ${Date.now()}` }).returning();
  author = await makeUser(demo.id, `Rowan Author ${Date.now()}`, passwordHash);
  colleague = await makeUser(demo.id, `Ilse Colleague ${Date.now()}`, passwordHash);
  outsider = await makeUser(other.id, `Outsider ${Date.now()}`, passwordHash);
  presetSetId = (await createTuningSet(author, { plantRef: `preset:${PRESET}`, name: "Cure PID", notes: "", controller: pid })).id;
  plantId = (await createPlant(author, { name: "Bay 2 drying cabinet", description: "", definition: { ...SAMPLE_CABINET } })).id;
  plantSetId = (await createTuningSet(author, { plantRef: `plant:${plantId}`, name: "Bay 2 PID", notes: "", controller: pid })).id;
});

const presetRequest = (over: Partial<RecordRequest> = {}): RecordRequest => ({
  plantRef: `preset:${PRESET}`,
  tuningSetId: presetSetId,
  title: "C-2 cure loop hand-over",
  notes: "Tuned on the bench before the site visit.",
  model: { kind: "fopdt", gainCPerPercent: 1.6, timeConstantS: 900, deadTimeS: 60 },
  powerCurve: { kind: "power-curve", points: [{ outPercent: 20, temperatureC: 52 }, { outPercent: 40, temperatureC: 84 }] },
  relay: { kind: "relay", ultimateGain: 14, ultimatePeriodS: 260, pvAmplitudeC: 0.9, relayAmplitudePercent: 10, rule: "tyreus-luyben" },
  proofTests: [proof(presetDrill())],
  ...over,
});

async function storedDefinition(id: string) {
  const [row] = await db().select({ definition: plants.definition }).from(plants).where(eq(plants.id, id));
  return row.definition;
}

describe("writing a tuning record", () => {
  it("on a preset: re-runs each proof test on the server and stores its results, trend and fingerprint", async () => {
    const { id } = await createTuningRecord(author, presetRequest());
    const detail = await recordDetail(author, id);
    expect(detail).not.toBeNull();
    const doc = detail!.document;
    expect(doc.plant).toMatchObject({ ref: `preset:${PRESET}`, origin: "preset", name: findPreset(PRESET)!.title, sourceUpload: null });
    expect(doc.modelSource).toBe("reported");
    expect(doc.controller).toMatchObject({ kc: 5, ti: 420, td: 20 });
    expect(doc.drive).toMatchObject({ kind: "time-proportioning", cycleTimeS: 2 });
    // a sensible PID on a lag-dominant FOPDT has finite margins (Åström & Hägglund: GM > 1, PM > 0 for a stable loop)
    expect(doc.margins!.gainMargin).toBeGreaterThan(1);
    expect(doc.margins!.phaseMarginDeg).toBeGreaterThan(0);
    expect(doc.margins!.lags).toEqual({ pvFilterTauS: 2, sensorLagS: 0, sampleTimeS: 0.5, cycleTimeS: 2 });
    const [t] = doc.proofTests;
    // the engine is deterministic (DEVELOPERS.md, "Determinism"): our own run gives the same fingerprint
    const own = runDrill(t.drill, t.controller, [], 7);
    expect(t.traceFingerprint).toBe(traceFingerprint(own.trace));
    expect(t.windows[0]).toMatchObject({ label: "60 → 70 °C", kind: "setpoint" });
    expect(t.windows[0].iae).toBeCloseTo(own.results.windows[0].trueTemperature.iae, 9);
    expect(t.trend.length).toBeLessThanOrEqual(600);
    expect(t.trend.length).toBeGreaterThan(100);
    expect(t.trend[0][0]).toBe(0);
    expect(t.safetyTrips).toBe(0);
    expect(t.heaterEnergyKWh).toBeGreaterThan(0);
    expect(detail!.engineVersion).toBe(doc.engineVersion);
  });

  it("on a stored plant, and on a twin with the twin's own model and source file", async () => {
    const definition = await storedDefinition(plantId);
    const { id } = await createTuningRecord(author, {
      ...presetRequest({ plantRef: `plant:${plantId}`, tuningSetId: plantSetId, model: null }),
      proofTests: [proof(plantDrill(definition))],
    });
    const detail = await recordDetail(author, id);
    expect(detail!.plantId).toBe(plantId);
    expect(detail!.document.plant).toMatchObject({ origin: "physical", name: "Bay 2 drying cabinet" });
    expect(detail!.document.modelSource).toBe("none");
    expect(detail!.document.margins).toBeNull();

    // a twin: a transfer-function plant with its bump-test log (fictional numbers of our own)
    const content = Buffer.from("t_s,pv_c,out_pct\n0,40.0,20\n60,40.1,30\n");
    const [upload] = await db()
      .insert(dataUploads)
      .values({
        organizationId: author.organizationId,
        ownerId: author.id,
        fileName: "bay4-bump.csv",
        byteSize: content.length,
        sha256: createHash("sha256").update(content).digest("hex"),
        content,
        mapping: {},
        summary: {},
      })
      .returning();
    const twinDef = {
      kind: "transfer-function",
      gainCPerPercent: 0.9,
      timeConstantsS: [300, 700],
      deadTimeS: 25,
      operatingPoint: { outPercent: 30, temperatureC: 48 },
      ambientC: 20,
      sensorTimeConstantS: 5,
    };
    const twin = await createPlant(author, { name: "Bay 4 twin", description: "", definition: twinDef, origin: "twin" });
    await db().update(plants).set({ sourceUploadId: upload.id }).where(eq(plants.id, twin.id));
    const twinSet = await createTuningSet(author, { plantRef: twin.ref, name: "Twin PI", notes: "", controller: { ...pid, td: 0 } });
    const twinDrill = { ...plantDrill(await storedDefinition(twin.id)), initialState: { temperatures: { kind: "steady", outPercent: 30 }, mode: "auto", setpointC: 48 } } as DrillInput;
    const rec = await createTuningRecord(author, presetRequest({ plantRef: twin.ref, tuningSetId: twinSet.id, model: null, proofTests: [proof(twinDrill, { controller: { ...pid, td: 0 } as ProofTestRequest["controller"] })] }));
    const doc = (await recordDetail(author, rec.id))!.document;
    expect(doc.modelSource).toBe("twin");
    // τ1 ≥ τ2 as the toolkit orders an SOPDT (sim/tuning/models.ts)
    expect(doc.model).toEqual({ kind: "sopdt", gainCPerPercent: 0.9, timeConstant1S: 700, timeConstant2S: 300, deadTimeS: 25 });
    expect(doc.plant.sourceUpload).toEqual({ id: upload.id, fileName: "bay4-bump.csv", sha256: upload.sha256, byteSize: content.length });
    expect(doc.margins!.lags!.sensorLagS).toBe(5);
  });

  it("from the action's form: one hidden `payload` field parsed as the action does, then written", async () => {
    // the same parse defineAction does (app/(app)/records/actions.ts): FormData → object → zod
    const form = z.object({ payload: jsonPayloadField(recordRequestSchema, 2_000_000) });
    const parse = (payload: string) => {
      const fd = new FormData();
      fd.set("payload", payload);
      const r = form.safeParse(formToObject(fd));
      return r.success ? { ok: true as const, data: r.data } : { ok: false as const, error: Object.values(fieldErrorsOf(r.error))[0] };
    };
    expect(parse("{not json")).toEqual({ ok: false, error: "The form sent something that is not JSON." });
    expect(parse(JSON.stringify({ ...presetRequest(), title: "" }))).toEqual({ ok: false, error: "title: Give the record a title." });
    const ok = parse(JSON.stringify(presetRequest({ title: "Through the form" })));
    expect(ok.ok).toBe(true);
    const { id } = await createTuningRecord(author, ok.ok ? ok.data.payload : null);
    expect((await recordDetail(author, id))!.title).toBe("Through the form");
  });

  it("on a colleague's shared plant, with the writer's own tuning set", async () => {
    const shared = await createPlant(author, { name: "Shared oven O-3", description: "", definition: { ...SAMPLE_CABINET, heaterRatingW: 1800 } });
    await setPlantShared(author, shared.id, true);
    const setOfColleague = await createTuningSet(colleague, { plantRef: shared.ref, name: "O-3 PI", notes: "", controller: { ...pid, td: 0 } });
    const request = presetRequest({ plantRef: shared.ref, tuningSetId: setOfColleague.id, proofTests: [] });
    await setPlantShared(author, shared.id, false);
    await refused(colleague, request, "That plant does not exist."); // private again: not readable, not revealed
    await setPlantShared(author, shared.id, true);
    const { id } = await createTuningRecord(colleague, request);
    expect((await recordDetail(colleague, id))!.document.plant).toMatchObject({ ref: shared.ref, name: "Shared oven O-3" });
  });

  it("refuses bad input with a clear message and writes nothing", async () => {
    const otherSet = (await createTuningSet(colleague, { plantRef: `preset:${PRESET}`, name: "Colleague PID", notes: "", controller: pid })).id;
    const privatePlant = await createPlant(colleague, { name: "Colleague's private cabinet", description: "", definition: { ...SAMPLE_CABINET } });

    await refused(author, presetRequest({ tuningSetId: "00000000-0000-4000-8000-000000000000" }), "That tuning set does not exist or is not yours");
    await refused(author, presetRequest({ tuningSetId: otherSet }), "That tuning set does not exist or is not yours");
    await refused(author, presetRequest({ tuningSetId: plantSetId }), 'The tuning set "Bay 2 PID" was saved for another plant');
    await refused(author, presetRequest({ plantRef: `plant:${privatePlant.id}` }), "That plant does not exist.");
    await refused(outsider, presetRequest({ plantRef: `plant:${plantId}` }), "That plant does not exist.");
    await refused(author, presetRequest({ plantRef: "preset:no-such-rig" }), "That preset does not exist.");
    await refused(author, presetRequest({ proofTests: [proof(plantDrill(await storedDefinition(plantId)))] }), /Proof test 1 \("SP step 60 → 70 °C"\) ran on a different plant/);
    await refused(author, presetRequest({ proofTests: Array.from({ length: 9 }, () => proof(presetDrill())) }), "proofTests: At most 8 proof tests per record.");
    await refused(author, presetRequest({ proofTests: [proof({ ...presetDrill(), durationS: 13 * 3600 })] }), /runs 13 h: a proof test on a record may simulate at most 12 h/);
    await refused(
      author,
      presetRequest({ proofTests: [proof({ ...presetDrill(), durationS: 11 * 3600 }, { controller: { ...pid, sampleTimeS: 0.02 } as ProofTestRequest["controller"] })] }),
      /needs 1,980,000 controller samples: at most 864,000 per test/,
    );
    await refused(author, presetRequest({ title: "  " }), "title: Give the record a title.");
    // a drill version is looked up on the server: a made-up one is refused, not printed
    await refused(author, presetRequest({ proofTests: [proof(presetDrill(), { drillVersion: { drillId: randomUUID(), version: 1, title: "Made-up drill" } })] }), /names a drill version that is not a published drill of your organisation/);
    await refused(
      author,
      presetRequest({ proofTests: [proof(presetDrill()), proof({ ...presetDrill(), drive: { kind: "continuous" } } as DrillInput)] }),
      /ran with different final elements/,
    );
    await refused(author, presetRequest({ relay: { kind: "relay", ultimateGain: 14, ultimatePeriodS: 260, pvAmplitudeC: 0.9, relayAmplitudePercent: 10, rule: "my-own-rule" } }), /"my-own-rule" is not one of the toolkit's tuning rules/);
    await refused(author, { ...presetRequest(), tuningSetId: "nope" }, "tuningSetId: Save the tuning as a tuning set first.");
  });
});

describe("which tuning a proof test ran", () => {
  it("is said by the server: the tuning set's name only for its exact controller, otherwise PI or PID", async () => {
    const [set] = await db().select().from(tuningSets).where(eq(tuningSets.id, presetSetId));
    const exact = set.controller as ProofTestRequest["controller"];
    const { id } = await createTuningRecord(
      author,
      presetRequest({
        proofTests: [
          proof(presetDrill(), { controller: exact, tuningLabel: "anything the browser says" }),
          proof(presetDrill(), { controller: { ...exact, kc: (exact as { kc: number }).kc * 2 } as ProofTestRequest["controller"], tuningLabel: "Cure PID" }),
        ],
      }),
    );
    const labels = (await recordDetail(author, id))!.document.proofTests.map((t) => t.tuningLabel);
    expect(labels).toEqual(["Cure PID", "PID (not the record's tuning set)"]);
  });
});

describe("the records list and a record's detail", () => {
  it("show every record of the organisation, newest first, filtered by plant and author; never another organisation's", async () => {
    const colleaguesOwn = await createTuningSet(colleague, { plantRef: `preset:${PRESET}`, name: `Colleague cure ${Date.now()}`, notes: "", controller: pid });
    const mine = await createTuningRecord(author, presetRequest({ title: "List check: author's", proofTests: [] }));
    const theirs = await createTuningRecord(colleague, presetRequest({ title: "List check: colleague's", tuningSetId: colleaguesOwn.id, proofTests: [] }));

    const all = await recordsFor(colleague);
    const ids = all.items.map((i) => i.id);
    expect(ids).toEqual(expect.arrayContaining([mine.id, theirs.id]));
    expect(ids.indexOf(theirs.id)).toBeLessThan(ids.indexOf(mine.id)); // newest first
    const item = all.items.find((i) => i.id === mine.id)!;
    expect(item).toMatchObject({ plantRef: `preset:${PRESET}`, origin: "preset", tuning: "PID · Kc 5 %/°C · Ti 420 s · Td 20 s", authorId: author.id, signedOffBy: null });
    expect(all.plants).toEqual(expect.arrayContaining([{ ref: `preset:${PRESET}`, name: findPreset(PRESET)!.title }, { ref: `plant:${plantId}`, name: "Bay 2 drying cabinet" }]));
    expect(all.authors.map((a) => a.id)).toEqual(expect.arrayContaining([author.id, colleague.id]));

    const byAuthor = await recordsFor(colleague, { ownerId: colleague.id });
    expect(byAuthor.items.every((i) => i.authorId === colleague.id)).toBe(true);
    expect(byAuthor.items.map((i) => i.id)).toContain(theirs.id);
    const byPlant = await recordsFor(author, { plantRef: `plant:${plantId.toUpperCase()}` });
    expect(byPlant.items.length).toBeGreaterThan(0);
    expect(byPlant.items.every((i) => i.plantRef === `plant:${plantId}`)).toBe(true);

    const outside = await recordsFor(outsider);
    expect(outside.items.map((i) => i.id)).not.toContain(mine.id);
    expect(outside.authors.map((a) => a.id)).not.toContain(author.id);
    // the same answer for a foreign id as for a missing one
    expect(await recordDetail(outsider, mine.id)).toBeNull();
    expect(await recordDetail(outsider, "00000000-0000-4000-8000-000000000000")).toBeNull();
    expect(await recordDetail(outsider, "not-a-uuid")).toBeNull();
    const seen = await recordDetail(colleague, mine.id);
    expect(seen).toMatchObject({ isOwner: false, title: "List check: author's" });
  });
});

describe("editing and signing off", () => {
  it("only the author edits and signs off, with a valid date, once; then the record is frozen, by the trigger too", async () => {
    const { id } = await createTuningRecord(author, presetRequest({ title: "Sign-off check", proofTests: [] }));
    await expect(updateRecordNotes(colleague, { recordId: id, title: "Taken over", notes: "" })).rejects.toThrow("Only the author of this record can change it.");
    await expect(updateRecordNotes(outsider, { recordId: id, title: "Taken over", notes: "" })).rejects.toThrow("That record does not exist.");
    await updateRecordNotes(author, { recordId: id, title: "Sign-off check (final)", notes: "Filter 2 s kept: the element is noisy." });
    expect(await recordDetail(author, id)).toMatchObject({ title: "Sign-off check (final)", notes: "Filter 2 s kept: the element is noisy." });

    const [{ createdAt }] = await db().select({ createdAt: tuningRecords.createdAt }).from(tuningRecords).where(eq(tuningRecords.id, id));
    const day = (offsetDays: number) => new Date(createdAt.getTime() + offsetDays * 86_400_000).toISOString().slice(0, 10);
    const now = new Date(createdAt.getTime() + 3 * 86_400_000);
    await expect(signOffRecord(author, { recordId: id, name: "R. Author", date: "2026-02-30" }, now)).rejects.toThrow("Write the date as yyyy-mm-dd");
    await expect(signOffRecord(author, { recordId: id, name: "R. Author", date: day(5) }, now)).rejects.toThrow("The sign-off date is in the future.");
    await expect(signOffRecord(author, { recordId: id, name: "R. Author", date: day(-2) }, now)).rejects.toThrow("The sign-off date is before the record was written");
    await expect(signOffRecord(author, { recordId: id, name: "", date: day(1) }, now)).rejects.toThrow("name: Write the name of the person signing off.");
    await expect(signOffRecord(colleague, { recordId: id, name: "I. Colleague", date: day(1) }, now)).rejects.toThrow("Only the author of this record can change it.");
    expect((await recordDetail(author, id))!.signedOffBy).toBeNull();

    await signOffRecord(author, { recordId: id, name: "Rowan Author", date: day(1) }, now);
    expect(await recordDetail(colleague, id)).toMatchObject({ signedOffBy: "Rowan Author", signedOffOn: day(1) });
    await expect(signOffRecord(author, { recordId: id, name: "Rowan Author", date: day(2) }, now)).rejects.toThrow("This record is signed off: it is frozen and cannot be changed.");
    await expect(updateRecordNotes(author, { recordId: id, title: "Changed after", notes: "" })).rejects.toThrow("This record is signed off: it is frozen and cannot be changed.");
    // the database refuses a raw change too (migration 0005's trigger)
    expect(await dbRefusal(db().update(tuningRecords).set({ notes: "sneaked in" }).where(eq(tuningRecords.id, id)))).toMatch(/a signed-off tuning record cannot be changed/);
    expect((await recordDetail(author, id))!.notes).toBe("Filter 2 s kept: the element is noisy.");
  });
});

describe("the traces CSV", () => {
  it("re-runs every proof test at full resolution and confirms the stored fingerprint", async () => {
    const { id } = await createTuningRecord(author, presetRequest({ title: "CSV check", proofTests: [proof(presetDrill()), proof(presetDrill(), { label: "Second seed", seed: 8 })] }));
    const detail = (await recordDetail(author, id))!;
    const csv = recordTracesCsv(detail);
    const lines = csv.trimEnd().split("\n");
    const header = lines.find((l) => !l.startsWith("#"))!;
    expect(header).toBe("test,t_s,sp_c,pv_c,pv_filtered_c,true_c,out_pct");
    for (const t of detail.document.proofTests) expect(csv).toContain(`fingerprint ${t.traceFingerprint} matches`);
    // 1200 s at 0.5 s: 2401 rows per test (samples 0 … 2400)
    expect(lines.filter((l) => l.startsWith("1,")).length).toBe(2401);
    expect(lines.filter((l) => l.startsWith("2,")).length).toBe(2401);

    // a stored fingerprint that no longer matches is refused, not served
    const tampered = structuredClone(detail);
    tampered.document.proofTests[0].traceFingerprint = "0000000000000000";
    expect(() => recordTracesCsv(tampered)).toThrow(/does not match/);
  });
});

