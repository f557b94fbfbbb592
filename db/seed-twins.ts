// Demo pre-commissioning data: a twin identified from one of the example logs (public/samples,
// invented data), a PI and a PID tuning set worked out on it with the SIMC rule, and a signed-off
// tuning record with both proven on a site proof test (SP ladder + ambient change + supply dip).
// Everything goes through the same domain functions the app uses (acceptTwin re-identifies the
// uploaded bytes; createTuningRecord re-runs the proof tests), so the demo shows honest numbers.
// Idempotent: each step is found or made, and nothing is done once the signed-off record exists.
import { readFileSync } from "node:fs";
import path from "node:path";
import { and, eq, isNotNull, sql as dsql } from "drizzle-orm";
import { drizzle } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { createTuningSet } from "../app/_lib/bench-store";
import { createTuningRecord } from "../app/_lib/records/create-record";
import { signOffRecord } from "../app/_lib/records/update-record";
import { acceptTwin } from "../app/_lib/twins/accept-twin";
import { benchDrill } from "../components/bench/bench-drill";
import { ladderDrill } from "../components/commissioning/proof-drill";
import { controllerConfigSchema, type ControllerConfigInput } from "../sim/control/config";
import { guessMappingForText } from "../sim/import";
import { transferFunctionParamsSchema } from "../sim/plant/transfer-function-params";
import { simc } from "../sim/tuning/rules/simc";
import { isRefusal } from "../sim/tuning/rules/tuning";
import { modelOfTransferFunction } from "../sim/tuning/model-definition";
import * as schema from "./schema";
import { plants, tuningRecords, tuningSets, users } from "./schema";
import { demoPeople } from "./demo-people";

export const DEMO_TWIN_NAME = "Veneer dryer VD-2 (twin)";
export const DEMO_RECORD_TITLE = "Veneer dryer VD-2 — hand-over tuning";
const SAMPLE = "dryer-bump-irregular.csv";

export async function seedDemoTwins(url: string): Promise<void> {
  const client = postgres(url, { max: 2, onnotice: () => {} });
  // the domain functions use the app's pool (db/client getDb); point it at this database for the seed
  const g = globalThis as unknown as { loopwrightDb?: unknown };
  const previous = g.loopwrightDb;
  g.loopwrightDb = drizzle(client, { schema });
  try {
    const db = g.loopwrightDb as ReturnType<typeof drizzle<typeof schema>>;
    const [tech] = await db.select().from(users).where(eq(dsql`lower(${users.email})`, demoPeople.instructors[1].email));
    if (!tech) throw new Error("the demo people must be seeded first");
    const user = { id: tech.id, organizationId: tech.organizationId };
    // each step is found or made, so a seed interrupted half-way is completed by the next one
    const [done] = await db
      .select({ id: tuningRecords.id })
      .from(tuningRecords)
      .where(and(eq(tuningRecords.ownerId, tech.id), eq(tuningRecords.title, DEMO_RECORD_TITLE), isNotNull(tuningRecords.signedOffBy)));
    if (done) return;
    const [existing] = await db.select({ id: plants.id }).from(plants).where(and(eq(plants.ownerId, tech.id), eq(plants.name, DEMO_TWIN_NAME)));

    const bytes = readFileSync(path.resolve(process.env.LOOPWRIGHT_ROOT ?? process.cwd(), "public/samples", SAMPLE));
    const guessed = guessMappingForText(bytes.toString("utf8"));
    if (!guessed.ok) throw new Error(`demo sample ${SAMPLE}: ${guessed.message}`);
    const plantId = existing?.id ?? (await acceptTwin(user, {
      fileName: SAMPLE,
      bytes,
      mapping: guessed.mapping,
      choice: "sopdt",
      name: DEMO_TWIN_NAME,
      description: "Identified from the example bump test of the veneer dryer (invented data, public/samples).",
      // the dryer hall's air during the (invented) test; without it the twin would take the PV before the step
      ambientC: 18,
      shared: true,
    })).plantId;
    const [twin] = await db.select().from(plants).where(eq(plants.id, plantId));
    const def = transferFunctionParamsSchema.parse(twin.definition);
    const model = modelOfTransferFunction(def);
    const plantRef = `plant:${plantId}`;
    const tuned = (type: "PI" | "PID"): ControllerConfigInput => {
      const r = simc(model, type);
      if (isRefusal(r)) throw new Error(`SIMC ${type} on the demo twin: ${r.reason}`);
      return { kind: "pid", form: r.form, kc: +r.kc.toPrecision(3), ti: Math.round(r.tiS), td: Math.round(r.tdS), sampleTimeS: 1, pvFilterTauS: 2, antiWindup: "back-calculation" };
    };
    const pi = tuned("PI");
    const pid = tuned("PID");
    const tuningSet = async (name: string, controller: ControllerConfigInput) => {
      const [found] = await db.select({ id: tuningSets.id }).from(tuningSets).where(and(eq(tuningSets.ownerId, tech.id), eq(tuningSets.plantRef, plantRef), eq(tuningSets.name, name)));
      return found ?? (await createTuningSet(user, { plantRef, name, notes: "From the twin's SOPDT model (SIMC, τc = θ).", controller }));
    };
    await tuningSet("PI — SIMC", pi);
    const pidSet = await tuningSet("PID — SIMC", pid);

    const working = Math.round(def.operatingPoint.temperatureC + 5);
    const base = benchDrill({ plant: { kind: "stored", definition: def, cutoutTripC: working + 40 }, title: DEMO_TWIN_NAME, setpointC: working, reference: pid, seed: 2026 });
    const proof = ladderDrill(base, {
      leadInS: 300,
      steps: [
        { setpointC: working + 5, holdS: 1800 },
        { setpointC: working + 10, holdS: 1800 },
      ],
      disturbances: [
        { disturbance: { kind: "ambient", temperatureC: def.ambientC - 8, forS: 1800 }, holdS: 1800 },
        { disturbance: { kind: "supply-voltage", percentOfNominal: 90, forS: 900 }, holdS: 1800 },
      ],
    });
    const proofTest = (tuningLabel: string, controller: ControllerConfigInput) => ({
      kind: "proof" as const,
      label: `Site proof test — ${tuningLabel}`,
      tuningLabel,
      drill: proof,
      drillVersion: null,
      controller: controllerConfigSchema.parse(controller),
      seed: 2026,
    });
    const [unsigned] = await db.select({ id: tuningRecords.id }).from(tuningRecords).where(and(eq(tuningRecords.ownerId, tech.id), eq(tuningRecords.title, DEMO_RECORD_TITLE)));
    const { id } = unsigned ?? (await createTuningRecord(user, {
      plantRef,
      tuningSetId: pidSet.id,
      title: DEMO_RECORD_TITLE,
      notes:
        "Demo record (invented). Worked out on the twin before the dryer was taken offline: PID settles the SP ladder with less overshoot than PI and recovers faster from the ambient drop. The PV filter of 2 s keeps the logged noise (σ ≈ 0.06 °C) off the derivative.",
      proofTests: [proofTest("PI", pi), proofTest("PID — SIMC", pid)],
    }));
    await signOffRecord(user, { recordId: id, name: "Hanne Lindqvist", date: new Date().toISOString().slice(0, 10) });
  } finally {
    g.loopwrightDb = previous;
    await client.end();
  }
}
