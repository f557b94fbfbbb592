/**
 * What a twin keeps of its identification (plants.identification): both candidates with their
 * parameters and fit quality, the chosen one, the noise and quantization found in the data, the
 * warnings, the step, and a summary of the log as it was read. Pure: built by acceptTwin, read
 * back by the twin pages (through the lenient schema below, so an older record still shows).
 */
import { z } from "zod";
import type { LogMapping, LogSummary } from "@/sim/import";
import type { Identification } from "@/sim/tuning/identify";
import type { FittedModel } from "@/sim/tuning/identify";
import type { FopdtModel, SopdtModel } from "@/sim/tuning/models";
import { ENGINE_VERSION } from "@/sim/version";
import type { LogEncoding } from "./decode-log";
import { timeConstantsOf } from "@/sim/tuning/model-definition";
import type { CandidateKind } from "./twin-definition";

export interface CandidateRecord {
  kind: CandidateKind;
  gainCPerPercent: number;
  /** τ (FOPDT) or τ1 ≥ τ2 (SOPDT), s */
  timeConstantsS: number[];
  deadTimeS: number;
  /** fitted PV at rest before the step, °C */
  baselineC: number;
  quality: { r2: number; nrmse: number; rmseC: number };
}

export interface IdentificationRecord {
  engineVersion: string;
  chosen: CandidateKind;
  preferred: CandidateKind;
  candidates: { fopdt: CandidateRecord; sopdt: CandidateRecord | null };
  /** PV noise σ from second differences (model-free), °C */
  noiseSigmaC: number;
  /** PV resolution step found in the data, °C; null when continuous */
  quantizationStepC: number | null;
  warnings: { code: string; message: string }[];
  step: { timeS: number; outBeforePercent: number; outAfterPercent: number; pvBeforeC: number; pvEndC: number };
  /** the ambient the definition uses and where it came from */
  ambient: { valueC: number; source: "given" | "pv-before-step" };
  log: {
    encoding: LogEncoding;
    rows: number;
    spanS: number;
    medianIntervalS: number;
    irregular: boolean;
    gaps: number;
    columns: LogSummary["columns"];
    timeFormat: LogMapping["timeFormat"];
    temperatureUnit: LogMapping["temperatureUnit"];
    decimalMark: LogMapping["decimalMark"];
  };
}

export function candidateRecord(fit: FittedModel<FopdtModel | SopdtModel>): CandidateRecord {
  return {
    kind: fit.model.kind,
    gainCPerPercent: fit.model.gainCPerPercent,
    timeConstantsS: timeConstantsOf(fit.model),
    deadTimeS: fit.model.deadTimeS,
    baselineC: fit.baselineC,
    quality: { r2: fit.quality.r2, nrmse: fit.quality.nrmse, rmseC: fit.quality.rmse },
  };
}

export function identificationRecord(
  id: Identification,
  summary: LogSummary,
  mapping: LogMapping,
  opts: { chosen: CandidateKind; encoding: LogEncoding; ambientC: number | null; fitNote?: string | null },
): IdentificationRecord {
  return {
    engineVersion: ENGINE_VERSION,
    chosen: opts.chosen,
    preferred: id.preferred,
    candidates: { fopdt: candidateRecord(id.fopdt), sopdt: id.sopdt ? candidateRecord(id.sopdt) : null },
    noiseSigmaC: id.noiseSigmaC,
    quantizationStepC: summary.quantizationStepC,
    warnings: [...id.warnings.map((w) => ({ code: w.code as string, message: w.message })), ...(opts.fitNote ? [{ code: "fitted-on-block-means", message: opts.fitNote }] : [])],
    step: { timeS: id.step.timeS, outBeforePercent: id.step.outBefore, outAfterPercent: id.step.outAfter, pvBeforeC: id.step.pvBefore, pvEndC: id.step.pvEnd },
    ambient: opts.ambientC === null ? { valueC: id.step.pvBefore, source: "pv-before-step" } : { valueC: opts.ambientC, source: "given" },
    log: {
      encoding: opts.encoding,
      rows: summary.rows,
      spanS: summary.spanS,
      medianIntervalS: summary.medianIntervalS,
      irregular: summary.irregular,
      gaps: summary.gaps.length,
      columns: summary.columns,
      timeFormat: mapping.timeFormat,
      temperatureUnit: mapping.temperatureUnit,
      decimalMark: mapping.decimalMark,
    },
  };
}

// ---- reading back (pages): lenient, a missing figure shows as a dash rather than hiding the twin ----

const num = z.number().finite();
const candidateSchema = z.looseObject({
  kind: z.enum(["fopdt", "sopdt"]),
  gainCPerPercent: num,
  timeConstantsS: z.array(num).min(1).max(2),
  deadTimeS: num,
  baselineC: num.optional(),
  quality: z.looseObject({ r2: num, nrmse: num, rmseC: num }),
});
export const storedIdentificationSchema = z.looseObject({
  chosen: z.enum(["fopdt", "sopdt"]),
  preferred: z.enum(["fopdt", "sopdt"]).optional(),
  candidates: z.looseObject({ fopdt: candidateSchema, sopdt: candidateSchema.nullable() }),
  noiseSigmaC: num.nullable().optional(),
  quantizationStepC: num.nullable().optional(),
  warnings: z.array(z.looseObject({ code: z.string(), message: z.string() })).default([]),
  step: z.looseObject({ timeS: num, outBeforePercent: num, outAfterPercent: num, pvBeforeC: num, pvEndC: num }).optional(),
  ambient: z.looseObject({ valueC: num, source: z.enum(["given", "pv-before-step"]) }).optional(),
  log: z.looseObject({ encoding: z.string().optional(), rows: num.optional(), spanS: num.optional(), medianIntervalS: num.optional(), irregular: z.boolean().optional(), gaps: num.optional() }).optional(),
});
export type StoredIdentification = z.output<typeof storedIdentificationSchema>;
export type StoredCandidate = z.output<typeof candidateSchema>;

export function readIdentification(value: unknown): StoredIdentification | null {
  const r = storedIdentificationSchema.safeParse(value);
  return r.success ? r.data : null;
}
