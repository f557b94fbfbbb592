// What a tuning record holds (the `document` column of tuning_records), in two halves:
// - RecordRequest: what the pre-commissioning flow sends when the technician writes the record
//   (the chosen tuning, the tests the technician ran, notes). Validated with zod; never trusted
//   for numbers the server can compute itself.
// - RecordDocument: what is stored: the request's choices plus what the server derived when the
//   record was written — the plant snapshot, the model, every proof test re-run by the engine on the
//   server (results and a decimated trend), and the robustness margins of the chosen tuning.
import { z } from "zod";
import { controllerConfigSchema } from "@/sim/control/config";
import { driveConfigSchema } from "@/sim/actuator/drive-config";
import { drillSchema } from "@/sim/drill/schema";
import { plantDefinitionSchema } from "@/sim/plant/plant-definition";

const finite = z.number().finite();

/** A model in the toolkit's terms (sim/tuning/models.ts). */
export const recordModelSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("fopdt"), gainCPerPercent: finite, timeConstantS: finite.positive(), deadTimeS: finite.nonnegative() }).strict(),
  z
    .object({
      kind: z.literal("sopdt"),
      gainCPerPercent: finite,
      timeConstant1S: finite.positive(),
      timeConstant2S: finite.positive(),
      deadTimeS: finite.nonnegative(),
    })
    .strict(),
]);
export type RecordModel = z.infer<typeof recordModelSchema>;

/** Tests the technician ran in the browser, reported as measured there (labelled so on the record). */
export const powerCurveTestSchema = z
  .object({
    kind: z.literal("power-curve"),
    points: z.array(z.object({ outPercent: finite.min(0).max(100), temperatureC: finite }).strict()).min(2).max(60),
  })
  .strict();

export const relayTestSchema = z
  .object({
    kind: z.literal("relay"),
    ultimateGain: finite.positive(),
    ultimatePeriodS: finite.positive(),
    /** PV oscillation amplitude, °C, and the relay's OUT amplitude, % */
    pvAmplitudeC: finite.nonnegative(),
    relayAmplitudePercent: finite.positive(),
    /** the tuning rule chosen on the result (sim/tuning/rules/catalog.ts id) */
    rule: z.string().trim().min(1).max(60),
  })
  .strict();

/** A proof test: the server runs it again and records what it measured. */
export const proofTestRequestSchema = z
  .object({
    kind: z.literal("proof"),
    label: z.string().trim().min(1, "Give each proof test a label.").max(80),
    /** "PI", "PID" or the tuning set's name: which tuning ran */
    tuningLabel: z.string().trim().min(1).max(80),
    /** the drill that was run, its plant being the record's plant */
    drill: drillSchema,
    /** the stored drill version it came from; null for an ad-hoc timeline */
    drillVersion: z.object({ drillId: z.uuid(), version: z.number().int().positive(), title: z.string().max(200) }).strict().nullable(),
    controller: controllerConfigSchema,
    seed: z.number().int().min(0).max(4294967295),
  })
  .strict();
export type ProofTestRequest = z.infer<typeof proofTestRequestSchema>;

export const MAX_PROOF_TESTS = 8;

export const recordRequestSchema = z
  .object({
    plantRef: z.string().max(200),
    /** the tuning set settled on (own); its controller is the record's tuning */
    tuningSetId: z.uuid("Save the tuning as a tuning set first."),
    title: z.string().trim().min(1, "Give the record a title.").max(160, "Keep the title under 160 characters."),
    notes: z.string().trim().max(8000, "Keep the notes under 8000 characters.").default(""),
    /** the identified model the tuning was worked out on; a twin's own model is filled in by the server */
    model: recordModelSchema.nullable().default(null),
    powerCurve: powerCurveTestSchema.nullable().default(null),
    relay: relayTestSchema.nullable().default(null),
    proofTests: z.array(proofTestRequestSchema).max(MAX_PROOF_TESTS, `At most ${MAX_PROOF_TESTS} proof tests per record.`).default([]),
  })
  .strict();
export type RecordRequest = z.input<typeof recordRequestSchema>;
export type RecordRequestParsed = z.output<typeof recordRequestSchema>;

/** One window of a proof test's results, as the engine's results record reports it. */
export const proofWindowSchema = z.looseObject({
  label: z.string(),
  kind: z.string(),
  iae: finite.nullable(),
  overshootPct: finite.nullable(),
  settlingTimeS: finite.nullable(),
  riseTimeS: finite.nullable(),
});

/** A proof test as stored: the request plus the server's re-run. */
export const proofTestStoredSchema = proofTestRequestSchema.extend({
  traceFingerprint: z.string(),
  durationS: finite.positive(),
  windows: z.array(proofWindowSchema),
  wholeRun: z.looseObject({ iae: finite.nullable(), overshootPct: finite.nullable() }),
  safetyTrips: z.number().int().nonnegative(),
  heaterEnergyKWh: finite.nullable(),
  /** a decimated trend for the page and the PDF: [t s, SP °C, PV °C, OUT %] rows */
  trend: z.array(z.tuple([finite, finite, finite, finite])).max(2000),
});
export type ProofTestStored = z.infer<typeof proofTestStoredSchema>;

export const recordDocumentSchema = z
  .object({
    plant: z
      .object({
        ref: z.string(),
        name: z.string(),
        origin: z.enum(["physical", "twin", "preset"]),
        definition: plantDefinitionSchema,
        sourceUpload: z.object({ id: z.uuid(), fileName: z.string(), sha256: z.string(), byteSize: z.number().int() }).strict().nullable(),
      })
      .strict(),
    model: recordModelSchema.nullable(),
    /** where the model came from: the twin's identification, or a bump test reported by the flow */
    modelSource: z.enum(["twin", "reported", "none"]),
    tuningSetName: z.string(),
    controller: controllerConfigSchema,
    /** gain margin (ratio), phase margin (°), Ms and the verdict; null without a model */
    margins: z
      .object({
        gainMargin: finite.nullable(),
        phaseMarginDeg: finite.nullable(),
        ms: finite.nullable(),
        verdict: z.string(),
        /** extra dead time the loop tolerates before it oscillates, s (null: unlimited) */
        delayMarginS: finite.nullable().optional(),
        /** the toolkit's plain-language reading (sim/tuning/robustness/assessment.ts) */
        messages: z.array(z.string()).optional(),
        /** lags the margins include beyond the model: PV filter, sensor, ½ sample, ½ heater cycle */
        lags: z
          .object({ pvFilterTauS: finite, sensorLagS: finite, sampleTimeS: finite, cycleTimeS: finite })
          .strict()
          .optional(),
      })
      .strict()
      .nullable(),
    /** the final element the proof tests ran with (the first test's drive); null without proof tests */
    drive: driveConfigSchema.nullable().optional(),
    powerCurve: powerCurveTestSchema.nullable(),
    relay: relayTestSchema.nullable(),
    proofTests: z.array(proofTestStoredSchema),
    engineVersion: z.string(),
  })
  .strict();
export type RecordDocument = z.output<typeof recordDocumentSchema>;
