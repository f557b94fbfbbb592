// Writing a tuning record: the request (record-document.ts) is checked against what the server
// knows — the plant the user may read, the user's own tuning set for that plant — and every
// number on the record is derived here: the plant snapshot, a twin's model and source file, each
// proof test re-run by the engine, the margins of the tuning. The engine runs outside the
// transaction (it can take seconds); the transaction then re-reads the sources, refuses if they
// changed meanwhile, and inserts the row, so nothing is written from stale or partial input.
import { and, eq } from "drizzle-orm";
import { getDb, type Transaction } from "@/db/client";
import { dataUploads, drillVersions, drills, plants, tuningRecords, tuningSets } from "@/db/schema";
import { ActionRefused } from "@/app/_lib/action";
import { firstIssue, parsePlantRef, readablePlant, type BenchUser, type PlantRef } from "@/app/_lib/bench-store";
import { controllerConfigSchema, type ControllerConfig } from "@/sim/control/config";
import type { DriveConfig } from "@/sim/actuator/drive-config";
import { isModelRule, isUltimateRule } from "@/sim/tuning/rules/catalog";
import { plantDefinitionSchema } from "@/sim/plant/plant-definition";
import { findPreset } from "@/sim/plant/presets";
import { ENGINE_VERSION } from "@/sim/version";
import { recordDocumentSchema, recordRequestSchema, type RecordDocument, type RecordRequestParsed } from "./record-document";
import { modelOfDefinition } from "./record-model";
import { recordMargins } from "./record-margins";
import { checkProofTest, storedProofTest } from "./proof-run";
import { canonicalRef } from "@/app/_lib/plant-ref";

/** The plant and tuning set a record is written from, as read at one moment. */
interface Sources {
  ref: string;
  plantId: string | null;
  plant: RecordDocument["plant"];
  tuningSetId: string;
  tuningSetName: string;
  controller: RecordDocument["controller"];
  /** the stored drill versions the proof tests name, as the database has them ("drillId@version" → title) */
  drillTitles: Record<string, string>;
}

const notFoundPlant = () => new ActionRefused("That plant does not exist.");
const notYourTuningSet = () => new ActionRefused("That tuning set does not exist or is not yours: choose one of your own tuning sets for this plant.");

async function readPlant(tx: Transaction, user: BenchUser, ref: PlantRef): Promise<Pick<Sources, "plantId" | "plant">> {
  if (ref.kind === "preset") {
    const preset = findPreset(ref.presetId);
    if (!preset) throw new ActionRefused("That preset does not exist.");
    return { plantId: null, plant: { ref: canonicalRef(ref), name: preset.title, origin: "preset", definition: preset.plant, sourceUpload: null } };
  }
  const [row] = await tx.select().from(plants).where(and(eq(plants.id, ref.plantId), readablePlant(user)));
  if (!row) throw notFoundPlant();
  const def = plantDefinitionSchema.safeParse(row.definition);
  if (!def.success) throw new ActionRefused(`The stored plant's definition is not valid — ${firstIssue(def.error)}`);
  let sourceUpload: RecordDocument["plant"]["sourceUpload"] = null;
  if (row.origin === "twin" && row.sourceUploadId) {
    const [u] = await tx
      .select({ id: dataUploads.id, fileName: dataUploads.fileName, sha256: dataUploads.sha256, byteSize: dataUploads.byteSize })
      .from(dataUploads)
      .where(eq(dataUploads.id, row.sourceUploadId));
    if (u) sourceUpload = u;
  }
  return { plantId: row.id, plant: { ref: canonicalRef(ref), name: row.name, origin: row.origin, definition: def.data, sourceUpload } };
}

async function readSources(tx: Transaction, user: BenchUser, p: RecordRequestParsed): Promise<Sources> {
  const ref = parsePlantRef(p.plantRef);
  if (!ref) throw new ActionRefused("Choose a plant (a preset or one of your plants).");
  const plant = await readPlant(tx, user, ref);
  const [set] = await tx.select().from(tuningSets).where(and(eq(tuningSets.id, p.tuningSetId), eq(tuningSets.ownerId, user.id)));
  if (!set) throw notYourTuningSet();
  const setRef = parsePlantRef(set.plantRef);
  if (!setRef || canonicalRef(setRef) !== canonicalRef(ref)) {
    throw new ActionRefused(`The tuning set "${set.name}" was saved for another plant: choose one saved for ${plant.plant.name}.`);
  }
  const controller = controllerConfigSchema.safeParse(set.controller);
  if (!controller.success) throw new ActionRefused(`The tuning set's controller configuration is not valid — ${firstIssue(controller.error)}`);
  const drillTitles: Record<string, string> = {};
  for (const t of p.proofTests) {
    if (!t.drillVersion) continue;
    const key = `${t.drillVersion.drillId}@${t.drillVersion.version}`;
    // a published version of a drill of the user's organisation; its title is the database's, not the request's
    const [v] = await tx
      .select({ title: drills.title })
      .from(drillVersions)
      .innerJoin(drills, eq(drills.id, drillVersions.drillId))
      .where(and(eq(drillVersions.drillId, t.drillVersion.drillId), eq(drillVersions.version, t.drillVersion.version), eq(drillVersions.status, "published"), eq(drills.organizationId, user.organizationId)));
    if (!v) throw new ActionRefused(`The proof test "${t.label}" names a drill version that is not a published drill of your organisation.`);
    drillTitles[key] = v.title;
  }
  return { ref: canonicalRef(ref), ...plant, tuningSetId: set.id, tuningSetName: set.name, controller: controller.data, drillTitles };
}

const canonical = (c: ControllerConfig) => JSON.stringify(controllerConfigSchema.parse(c), Object.keys(controllerConfigSchema.parse(c)).sort());

/** Which tuning a proof test ran, said by the server: the tuning set's name only when the controller is exactly the set's. */
export function proofTuningLabel(controller: ControllerConfig, set: ControllerConfig, setName: string): string {
  if (canonical(controller) === canonical(set)) return setName;
  const kind = controller.kind === "pid" ? (controller.td > 0 ? "PID" : "PI") : "on/off";
  return `${kind} (not the record's tuning set)`;
}

/** The final element the margins assume: the proof tests' (they must agree), else the engine's default drive. */
function recordDrive(p: RecordRequestParsed): DriveConfig {
  const drives = p.proofTests.map((t) => JSON.stringify(t.drill.drive));
  if (new Set(drives).size > 1) throw new ActionRefused("The proof tests ran with different final elements (heater drive settings): put tests with one drive on a record.");
  return p.proofTests[0]?.drill.drive ?? { kind: "time-proportioning", cycleTimeS: 2, minOnTimeS: 0, minOffTimeS: 0 };
}

/** What the record derives from its sources and the request (pure, CPU-bound). */
export function buildDocument(s: Sources, p: RecordRequestParsed): RecordDocument {
  p.proofTests.forEach((t, i) => checkProofTest(t, i, s.plant.definition, s.plant.name));
  if (p.relay && !isUltimateRule(p.relay.rule) && !isModelRule(p.relay.rule)) throw new ActionRefused(`"${p.relay.rule}" is not one of the toolkit's tuning rules.`);
  const twinModel = s.plant.origin === "twin" ? modelOfDefinition(s.plant.definition) : null;
  const model = twinModel ?? p.model;
  const drive = recordDrive(p);
  // a twin's sensor lag is simulated beside its model; a reported model was fitted to the measured PV and includes it
  const sensorLagS = twinModel && s.plant.definition.kind === "transfer-function" ? s.plant.definition.sensorTimeConstantS : 0;
  const doc: RecordDocument = {
    plant: s.plant,
    model,
    modelSource: twinModel ? "twin" : p.model ? "reported" : "none",
    tuningSetName: s.tuningSetName,
    controller: s.controller,
    margins: recordMargins(model, s.controller, drive, sensorLagS),
    drive,
    powerCurve: p.powerCurve,
    relay: p.relay,
    proofTests: p.proofTests.map((t) =>
      storedProofTest({
        ...t,
        tuningLabel: proofTuningLabel(t.controller, s.controller, s.tuningSetName),
        drillVersion: t.drillVersion ? { ...t.drillVersion, title: s.drillTitles[`${t.drillVersion.drillId}@${t.drillVersion.version}`] ?? t.drillVersion.title } : null,
      }),
    ),
    engineVersion: ENGINE_VERSION,
  };
  return recordDocumentSchema.parse(doc); // the stored contract, checked before it is written
}

const sameSources = (a: Sources, b: Sources) => JSON.stringify(a) === JSON.stringify(b);

export async function createTuningRecord(user: BenchUser, input: unknown): Promise<{ id: string }> {
  const r = recordRequestSchema.safeParse(input);
  if (!r.success) throw new ActionRefused(firstIssue(r.error));
  const p = r.data;
  const db = getDb();
  const before = await db.transaction((tx) => readSources(tx, user, p));
  const document = buildDocument(before, p);
  return db.transaction(async (tx) => {
    const now = await readSources(tx, user, p);
    if (!sameSources(before, now)) throw new ActionRefused("The plant or the tuning set changed while the record was being written. Write the record again.");
    const [row] = await tx
      .insert(tuningRecords)
      .values({
        organizationId: user.organizationId,
        ownerId: user.id,
        plantRef: now.ref,
        plantId: now.plantId,
        plantName: now.plant.name,
        tuningSetId: now.tuningSetId,
        title: p.title,
        notes: p.notes,
        document: document as unknown as Record<string, unknown>,
        engineVersion: ENGINE_VERSION,
      })
      .returning({ id: tuningRecords.id });
    return { id: row.id };
  });
}

