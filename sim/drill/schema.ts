/**
 * The drill format (formatVersion 1): an instructor's scenario as one JSON document.
 * Defined here with zod; the JSON Schema (drill.schema.json) is generated from this file by
 * `npx tsx sim/drill/export-schema.ts` (also checked by a test). Documented in README.md.
 */
import { z } from "zod";
import { enclosureParamsSchema } from "../plant/enclosure-params";
import { transferFunctionParamsSchema } from "../plant/transfer-function-params";
import { sensorChainSchema } from "../sensor/config";
import { controllerConfigSchema } from "../control/config";
import { driveConfigSchema } from "../actuator/drive-config";
import { cutoutConfigSchema } from "../safety/cutout-config";

export const DRILL_FORMAT_VERSION = 1 as const;

const time = z.number().finite().nonnegative().describe("s from the start of the run");
const duration = z.number().finite().positive().describe("s; afterwards the condition returns to nominal");

export const presetPlantSchema = z
  .object({
    kind: z.literal("preset"),
    presetId: z.string().min(1).describe("id of a built-in plant preset (see sim/plant/presets.ts)"),
    lossModel: z.enum(["linear", "nonlinear"]).optional().describe("override the preset's loss model"),
  })
  .strict();

export const drillPlantSchema = z.discriminatedUnion("kind", [presetPlantSchema, enclosureParamsSchema, transferFunctionParamsSchema]);

export const initialTemperaturesSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("ambient") }).strict(),
  z.object({ kind: z.literal("steady"), outPercent: z.number().finite().min(0).max(100) }).strict(),
  z
    .object({
      kind: z.literal("temperatures"),
      airC: z.number().finite(),
      wallC: z.number().finite().optional(),
      heaterC: z.number().finite().optional(),
      contentsC: z.number().finite().optional(),
      sensorC: z.number().finite().optional(),
    })
    .strict(),
]);

export const initialStateSchema = z
  .object({
    temperatures: initialTemperaturesSchema.default({ kind: "ambient" }),
    mode: z.enum(["auto", "manual"]).default("auto"),
    setpointC: z.number().finite(),
    outPercent: z.number().finite().min(-100).max(200).optional().describe("initial OUT, %; default: the steady output if temperatures are 'steady', else 0"),
  })
  .strict();

export const drillEventSchema = z.discriminatedUnion("type", [
  z.object({ type: z.literal("setpoint"), timeS: time, setpointC: z.number().finite() }).strict(),
  z
    .object({
      type: z.literal("setpoint-ramp"),
      timeS: time,
      durationS: z.number().finite().positive().describe("s over which SP moves from fromC to toC"),
      fromC: z.number().finite(),
      toC: z.number().finite(),
    })
    .strict()
    .describe("a setpoint ramp, applied as a staircase at the controller's sample boundaries"),
  z.object({ type: z.literal("mode"), timeS: time, mode: z.enum(["auto", "manual"]) }).strict(),
  z.object({ type: z.literal("inlet-blockage"), timeS: time, percent: z.number().min(0).max(100), durationS: duration.optional() }).strict(),
  z
    .object({
      type: z.literal("door-open"),
      timeS: time,
      durationS: duration,
      extraAirflowM3PerH: z.number().finite().nonnegative().optional().describe("default: the plant's doorOpenAirflowM3PerH"),
    })
    .strict(),
  z.object({ type: z.literal("ambient"), timeS: time, temperatureC: z.number().finite(), durationS: duration.optional() }).strict(),
  z
    .object({ type: z.literal("supply-voltage"), timeS: time, percentOfNominal: z.number().min(0).max(150), durationS: duration.optional() })
    .strict(),
  z
    .object({
      type: z.literal("cold-load"),
      timeS: time,
      massKg: z.number().finite().positive(),
      specificHeatJPerKgK: z.number().finite().positive(),
      temperatureC: z.number().finite(),
      airCouplingWPerK: z.number().finite().positive(),
      durationS: duration.optional().describe("s until the load is taken out again (with its energy)"),
    })
    .strict(),
  z.object({ type: z.literal("sensor-noise"), timeS: time, extraNoiseSdMa: z.number().min(0).max(5), durationS: duration.optional() }).strict(),
  z
    .object({
      type: z.literal("sensor-fault"),
      timeS: time,
      fault: z.enum(["open", "shorted", "lead-break"]),
      target: z.enum(["control", "cutout"]).default("control").describe("the controller's sensor or the cutout's own sensor"),
      durationS: duration.optional(),
    })
    .strict(),
]);

export const scoringWindowSchema = z
  .object({
    id: z.string().min(1),
    label: z.string().optional(),
    kind: z.enum(["setpoint", "disturbance"]),
    startS: time,
    endS: time,
    weight: z.number().finite().positive().default(1),
    eventTimeS: time.optional().describe("instant of the step or disturbance; default startS"),
  })
  .strict()
  .refine((w) => w.endS > w.startS, { message: "endS must be after startS", path: ["endS"] });

export const metricWeightsSchema = z
  .object({
    iae: z.number().min(0).default(0.5),
    peak: z.number().min(0).default(0.25).describe("overshoot (setpoint windows) or peak deviation (disturbance windows)"),
    time: z.number().min(0).default(0.25).describe("settling time (setpoint) or recovery time (disturbance)"),
  })
  .strict()
  .refine((m) => m.iae + m.peak + m.time > 0, { message: "at least one metric weight must be positive" });

export const scoringSchema = z
  .object({
    windows: z.array(scoringWindowSchema).min(1),
    metricWeights: metricWeightsSchema.prefault({}),
    /** absolute floor of the settling band, °C */
    bandFloorC: z.number().finite().positive().default(0.5),
    /** the score is multiplied by this for every cutout trip */
    tripPenaltyFactor: z.number().min(0).max(1).default(0.5),
  })
  .strict();

export const traineeSchema = z
  .object({
    mayChange: z
      .object({
        tuning: z.literal(true).default(true).describe("gains, times, form, filter on D, weights, anti-windup: always"),
        pvFilter: z.boolean().default(true),
        sampleTime: z.boolean().default(false),
        /** operating the loop during the attempt: SP changes, auto/manual, manual OUT (free practice: yes; scored drills: usually no) */
        operation: z.boolean().default(false),
      })
      .strict()
      .prefault({}),
    relayTestAllowed: z.boolean().default(true),
    bumpTestAllowed: z.boolean().default(true),
  })
  .strict();

export const paceSchema = z
  .object({
    /** simulation speeds offered (× real time) */
    speeds: z.array(z.number().positive()).min(1).default([1, 10, 60, 600]),
    pauseAllowed: z.boolean().default(true),
  })
  .strict();

export const noiseSchema = z
  .object({
    /** "fixed": every attempt uses `seed` (a fair comparison); "per-attempt": the app draws a new seed per attempt */
    seedPolicy: z.enum(["fixed", "per-attempt"]).default("fixed"),
    seed: z.number().int().min(0).max(4294967295).default(1),
  })
  .strict();

export const drillSchema = z
  .object({
    formatVersion: z.literal(DRILL_FORMAT_VERSION),
    id: z.string().min(1),
    /** the instructor's revision of this drill (attempts record it; bump on every edit) */
    revision: z.number().int().positive().default(1),
    title: z.string().min(1),
    description: z.string().default(""),
    plant: drillPlantSchema,
    initialState: initialStateSchema,
    events: z.array(drillEventSchema).default([]),
    scoring: scoringSchema,
    referenceTuning: controllerConfigSchema,
    trainee: traineeSchema.prefault({}),
    pace: paceSchema.prefault({}),
    noise: noiseSchema.prefault({}),
    /** default: the preset's suggested chain, else the chain defaults */
    sensor: sensorChainSchema.optional(),
    drive: driveConfigSchema.default({ kind: "time-proportioning", cycleTimeS: 2, minOnTimeS: 0, minOffTimeS: 0 }),
    /** default: the preset's suggested trip point; required for a plant defined in full */
    cutout: cutoutConfigSchema.optional(),
    durationS: z.number().finite().positive().max(7 * 24 * 3600),
  })
  .strict()
  .superRefine((d, ctx) => {
    if (d.plant.kind !== "preset" && !d.cutout) {
      ctx.addIssue({ code: "custom", message: "cutout is required when the plant is defined in full", path: ["cutout"] });
    }
    d.events.forEach((e, i) => {
      if (e.timeS > d.durationS) ctx.addIssue({ code: "custom", message: "event after the end of the drill", path: ["events", i, "timeS"] });
    });
    d.scoring.windows.forEach((w, i) => {
      if (w.endS > d.durationS) ctx.addIssue({ code: "custom", message: "window ends after the drill", path: ["scoring", "windows", i, "endS"] });
    });
  });

export type Drill = z.output<typeof drillSchema>;
export type DrillInput = z.input<typeof drillSchema>;
export type DrillEvent = z.output<typeof drillEventSchema>;
export type ScoringWindow = z.output<typeof scoringWindowSchema>;

/** Parse a drill; on failure the error lists every bad field by its path. */
export function parseDrill(json: unknown): { ok: true; drill: Drill } | { ok: false; errors: string[] } {
  const r = drillSchema.safeParse(json);
  if (r.success) return { ok: true, drill: r.data };
  return { ok: false, errors: r.error.issues.map((i) => `${i.path.length ? i.path.join(".") : "(document)"}: ${i.message}`) };
}
