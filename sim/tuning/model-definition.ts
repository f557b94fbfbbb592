/**
 * A process model ↔ a transfer-function plant's definition (sim/plant/transfer-function-params.ts).
 * The definition lists its time constants, one for FOPDT or two for SOPDT; the model names them
 * (models.ts: τ1 ≥ τ2 for SOPDT). Going from a definition to a model sorts the pair through
 * sopdt(), so a definition written in either order gives the same model.
 *   FOPDT  G(s) = K e^{−θs} / (τs + 1)                 ↔  timeConstantsS = [τ]
 *   SOPDT  G(s) = K e^{−θs} / ((τ1 s + 1)(τ2 s + 1))   ↔  timeConstantsS = [τ1, τ2]
 * Pure: used by twins (definition from a fit), tuning records (margins on the twin's model) and the
 * demo seed (SIMC on the twin).
 */
import { fopdt, sopdt, type ProcessModel } from "./models";
import type { TransferFunctionParams } from "../plant/transfer-function-params";

/** The figures of a transfer-function definition the model needs. */
export type TransferFunctionFigures = Pick<TransferFunctionParams, "gainCPerPercent" | "timeConstantsS" | "deadTimeS">;

/** FOPDT for one time constant, SOPDT (τ1 ≥ τ2) for two. */
export function modelOfTransferFunction(def: TransferFunctionFigures): ProcessModel {
  const [a, b] = def.timeConstantsS;
  return b === undefined ? fopdt(def.gainCPerPercent, a, def.deadTimeS) : sopdt(def.gainCPerPercent, a, b, def.deadTimeS);
}

/** A model's time constants in a definition's order: [τ] or [τ1, τ2]. */
export function timeConstantsOf(model: ProcessModel): number[] {
  return model.kind === "fopdt" ? [model.timeConstantS] : [model.timeConstant1S, model.timeConstant2S];
}
