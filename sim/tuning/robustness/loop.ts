/**
 * The loop whose robustness is assessed: plant model, controller (standard form) and every lag the
 * loop adds between the process and the controller's output. Approximations (stated):
 * - sampling at h: a zero-order hold behaves like a delay of about h/2 (Åström & Wittenmark,
 *   Computer-Controlled Systems, from memory);
 * - time-proportioning with cycle time Tc: the duty is latched once per cycle, so the heater
 *   power lags the requested output by about Tc/2 on average (treated as a delay; common practice);
 * - PV filter and sensor element: first-order lags; derivative filter: Td/N on the D term.
 */
import { toIdeal } from "../../control/forms";
import type { ProcessModel } from "../models";

export interface LoopPlant {
  /** |K|, °C per %: the loop is normalised to a reverse-acting (negative-feedback) one */
  gainCPerPercent: number;
  timeConstantsS: number[];
  deadTimeS: number;
  /** an integrating process K e^{−θs}/(s·∏(τs+1)) (K then in °C per %·s) */
  integrating?: boolean;
}

/** Standard-form controller, C(s) = Kc(1 + 1/(Ti s) + Td s/(1 + Td s/N)). tiS = 0: no I; tdS = 0: no D. */
export interface LoopController {
  kc: number;
  tiS: number;
  tdS: number;
  /** derivative filter N; Infinity for an unfiltered derivative (textbook checks) */
  derivativeFilterN: number;
}

export interface LoopLags {
  pvFilterTauS?: number;
  sensorLagS?: number;
  /** controller sample time: adds ≈ h/2 of delay */
  sampleTimeS?: number;
  /** heater cycle time (time-proportioning): adds ≈ Tc/2 of delay */
  cycleTimeS?: number;
}

export interface Loop {
  plant: LoopPlant;
  controller: LoopController;
  lags?: LoopLags;
}

export function plantFromModel(m: ProcessModel): LoopPlant {
  return m.kind === "fopdt"
    ? { gainCPerPercent: Math.abs(m.gainCPerPercent), timeConstantsS: [m.timeConstantS], deadTimeS: m.deadTimeS }
    : { gainCPerPercent: Math.abs(m.gainCPerPercent), timeConstantsS: [m.timeConstant1S, m.timeConstant2S], deadTimeS: m.deadTimeS };
}

/** From the block's configuration fields (any form) to the standard-form loop controller. */
export function controllerFromBlock(cfg: {
  form: "standard" | "parallel" | "series";
  kc: number;
  ti: number;
  td: number;
  ki?: number;
  kd?: number;
  derivativeFilterN?: number;
}): LoopController {
  const ideal = toIdeal(cfg.form, { kc: cfg.kc, ti: cfg.ti, td: cfg.td, ki: cfg.ki ?? 0, kd: cfg.kd ?? 0 });
  return { kc: ideal.kc, tiS: ideal.ti, tdS: ideal.td, derivativeFilterN: cfg.derivativeFilterN ?? 10 };
}

/** Delay the loop adds besides the plant's: half a sample plus half a heater cycle. */
export function addedDelayS(l: LoopLags = {}): number {
  return (l.sampleTimeS ?? 0) / 2 + (l.cycleTimeS ?? 0) / 2;
}

/** Every time scale in the loop (for choosing the frequency range). */
export function loopTimeScales(loop: Loop): number[] {
  const c = loop.controller;
  const l = loop.lags ?? {};
  const ts = [
    ...loop.plant.timeConstantsS,
    loop.plant.deadTimeS + addedDelayS(l),
    c.tiS,
    c.tdS,
    Number.isFinite(c.derivativeFilterN) ? c.tdS / c.derivativeFilterN : 0,
    l.pvFilterTauS ?? 0,
    l.sensorLagS ?? 0,
  ];
  return ts.filter((t) => Number.isFinite(t) && t > 0);
}
