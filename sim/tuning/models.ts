/**
 * Process models the toolkit works with, in the engine's units: gain in °C per % output, times in s.
 *   FOPDT  G(s) = K e^{−θs} / (τs + 1)
 *   SOPDT  G(s) = K e^{−θs} / ((τ1 s + 1)(τ2 s + 1)),  τ1 ≥ τ2
 */
export interface FopdtModel {
  kind: "fopdt";
  gainCPerPercent: number;
  timeConstantS: number;
  deadTimeS: number;
}

export interface SopdtModel {
  kind: "sopdt";
  gainCPerPercent: number;
  /** the larger time constant τ1, s */
  timeConstant1S: number;
  /** the smaller time constant τ2, s */
  timeConstant2S: number;
  deadTimeS: number;
}

export type ProcessModel = FopdtModel | SopdtModel;

export function fopdt(gainCPerPercent: number, timeConstantS: number, deadTimeS: number): FopdtModel {
  return { kind: "fopdt", gainCPerPercent, timeConstantS, deadTimeS };
}

/** SOPDT with the time constants sorted so that τ1 ≥ τ2. */
export function sopdt(gainCPerPercent: number, tauA: number, tauB: number, deadTimeS: number): SopdtModel {
  return { kind: "sopdt", gainCPerPercent, timeConstant1S: Math.max(tauA, tauB), timeConstant2S: Math.min(tauA, tauB), deadTimeS };
}
