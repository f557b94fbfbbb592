/**
 * IMC (lambda) rules for an FOPDT model: D. E. Rivera, M. Morari, S. Skogestad, "Internal model
 * control. 4. PID controller design", Ind. Eng. Chem. Process Des. Dev. 25(1), 1986; the rows as
 * in Bequette 2003, Table 9-2 (standard form; λ = closed-loop time constant; Bequette adds λ > 0.2τ):
 *   "pid-lag"  Kc·K = (τ + θ/2)/(λ + θ),   Ti = τ + θ/2, Td = τθ/(2τ + θ), τF = λθ/(2(λ + θ)); λ ≥ 0.25θ
 *   "pid"      Kc·K = (τ + θ/2)/(λ + θ/2), Ti = τ + θ/2, Td = τθ/(2τ + θ);                     λ ≥ 0.8θ
 *   "pi"       Kc·K = τ/λ,                 Ti = τ   (delay neglected);                         λ ≥ 1.7θ
 *   "pi-improved" Kc·K = (τ + θ/2)/λ,      Ti = τ + θ/2;                                       λ ≥ 1.7θ
 */
import type { FopdtModel } from "../models";
import { notDefined, refuse, tuning, type ControllerType, type RuleResult } from "./tuning";
import { checkFopdt } from "./validate";

export const IMC_LAMBDA = "imc-lambda";
const SOURCE = "Rivera, Morari & Skogestad 1986 (IMC), rows of Bequette 2003, Table 9-2";

export type ImcRow = "pid-lag" | "pid" | "pi" | "pi-improved";

/** Bequette's smallest recommended λ for each row, as a multiple of θ. */
export const IMC_MIN_LAMBDA_PER_THETA: Record<ImcRow, number> = { "pid-lag": 0.25, pid: 0.8, pi: 1.7, "pi-improved": 1.7 };

export interface ImcOptions {
  /** λ, s; default the larger of θ, the row's minimum and 0.2τ */
  lambdaS?: number;
}

export function defaultLambdaS(m: FopdtModel, row: ImcRow): number {
  return Math.max(m.deadTimeS, IMC_MIN_LAMBDA_PER_THETA[row] * m.deadTimeS, 0.2 * m.timeConstantS);
}

export function imcLambdaRow(m: FopdtModel, row: ImcRow, o: ImcOptions = {}): RuleResult {
  const bad = checkFopdt(IMC_LAMBDA, m, false);
  if (bad) return bad;
  const { gainCPerPercent: k, timeConstantS: tau, deadTimeS: theta } = m;
  const lambda = o.lambdaS ?? defaultLambdaS(m, row);
  if (!(Number.isFinite(lambda) && lambda > 0)) return refuse(IMC_LAMBDA, `λ must be a positive number of seconds (got ${lambda})`);
  const notes = [`λ = ${+lambda.toPrecision(6)} s`];
  const minLambda = Math.max(IMC_MIN_LAMBDA_PER_THETA[row] * theta, 0.2 * tau);
  if (lambda < minLambda) notes.push(`λ is below Bequette's recommended minimum of ${+minLambda.toPrecision(4)} s for this row: expect poor robustness`);
  const tiPade = tau + theta / 2;
  const tdPade = (tau * theta) / (2 * tau + theta);
  switch (row) {
    case "pid-lag": {
      const t = tuning(IMC_LAMBDA, "PID", "standard", tiPade / (k * (lambda + theta)), tiPade, tdPade, SOURCE, [...notes, "PID with a lag: set the PV filter to τF"]);
      t.filterTauS = (lambda * theta) / (2 * (lambda + theta));
      return t;
    }
    case "pid":
      return tuning(IMC_LAMBDA, "PID", "standard", tiPade / (k * (lambda + theta / 2)), tiPade, tdPade, SOURCE, notes);
    case "pi":
      return tuning(IMC_LAMBDA, "PI", "standard", tau / (k * lambda), tau, 0, SOURCE, [...notes, "delay neglected in the design"]);
    case "pi-improved":
      return tuning(IMC_LAMBDA, "PI", "standard", tiPade / (k * lambda), tiPade, 0, SOURCE, notes);
  }
}

/** IMC by controller type: PI → the "τ + θ/2" row, PID → the filtered row (realisable). */
export function imcLambda(m: FopdtModel, controller: ControllerType, o: ImcOptions = {}): RuleResult {
  if (controller === "P") return notDefined(IMC_LAMBDA, "the IMC table defines PI and PID settings only");
  return imcLambdaRow(m, controller === "PI" ? "pi-improved" : "pid-lag", o);
}
