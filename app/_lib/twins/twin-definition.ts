/**
 * A fitted bump-test model as a twin's plant definition (sim/plant/transfer-function-params.ts).
 * Pure: no database, no Next; the server builds the stored definition with it and the new-twin
 * page shows the same numbers before anything is saved.
 *
 * - operating point: OUT and PV before the step, i.e. where the process sat when it was stepped
 *   (the model is a deviation model around that point);
 * - ambient: the technician's figure when given; otherwise the PV before the step. A log carries
 *   no ambient, and the TF plant only uses ambientC as the reference for later ambient changes,
 *   so taking the operating point keeps "no ambient change" meaning "as logged".
 * - heater rating and voltage stay at the schema's defaults: a log does not know them; they only
 *   scale energy figures.
 */
import type { FopdtModel, SopdtModel } from "@/sim/tuning/models";
import { timeConstantsOf } from "@/sim/tuning/model-definition";
import { transferFunctionParamsSchema, type TransferFunctionParams } from "@/sim/plant/transfer-function-params";

export type CandidateKind = "fopdt" | "sopdt";

export interface StepLevels {
  outBeforePercent: number;
  pvBeforeC: number;
}

export function twinDefinition(model: FopdtModel | SopdtModel, step: StepLevels, opts: { name: string; ambientC?: number | null }): TransferFunctionParams {
  // OUT before a real step can be logged a hair outside 0–100 % (e.g. −0.1 % from a transmitter): clamp to the schema's range
  const outPercent = Math.min(100, Math.max(0, step.outBeforePercent));
  return transferFunctionParamsSchema.parse({
    kind: "transfer-function",
    name: opts.name,
    gainCPerPercent: model.gainCPerPercent,
    timeConstantsS: timeConstantsOf(model),
    deadTimeS: Math.max(0, model.deadTimeS),
    operatingPoint: { outPercent, temperatureC: step.pvBeforeC },
    ambientC: opts.ambientC ?? step.pvBeforeC,
  });
}
