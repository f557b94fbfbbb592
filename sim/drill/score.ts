/**
 * The attempt score, defined once here and shown to users (SCORE_FORMULA).
 *
 * For every scoring window w, on the true temperature, with the attempt (a) and the drill's
 * reference tuning (r) run on the same drill, seed and timeline:
 *   metrics m: IAE; peak = overshoot °C (setpoint window) or peak deviation °C (disturbance);
 *              time = settling time (setpoint) or recovery time (disturbance); a time that is
 *              never reached counts as the whole window after the event.
 *   ratio    c_m = (a_m + ε_m) / (r_m + ε_m),  ε = 1 °C·s, 0.1 °C, 1 s (keeps ratios finite)
 *   cost     C_w = Σ α_m c_m / Σ α_m          (α from scoring.metricWeights; C = 1 ≡ reference)
 *   score    S_w = 100 / (1 + C_w)             (reference → 50; perfect → 100; → 0 when much worse)
 * Total = Σ weight_w·S_w / Σ weight_w × tripPenaltyFactor^(cutout trips in the attempt),
 * rounded to 0.1. 0–100, higher is better.
 */
import type { WindowResults } from "../results/window";
import type { Drill } from "./schema";
import type { RunResults } from "./results";
import { detPowInt } from "../numeric/det-math";

export const SCORE_FORMULA =
  "Per window: c = (attempt + ε)/(reference + ε) for IAE, overshoot or peak deviation, and settling or recovery time; " +
  "C = weighted mean of c; window score = 100/(1 + C) (reference = 50, perfect = 100). " +
  "Total = window scores weighted by window weight, × penalty^trips, 0–100, higher is better.";

export const SCORE_EPSILON = { iae: 1, peak: 0.1, time: 1 } as const;

export interface WindowScore {
  id: string;
  weight: number;
  ratios: { iae: number; peak: number; time: number };
  cost: number;
  score: number;
}

export interface AttemptScore {
  engineVersion: string;
  score: number;
  windows: WindowScore[];
  safetyTrips: number;
  formula: string;
}

function metrics(w: WindowResults) {
  const horizon = w.windowEndS - w.windowStartS;
  if (w.kind === "setpoint") {
    return { iae: w.iae, peak: Math.max(0, w.overshootC ?? 0), time: w.settlingTimeS ?? horizon };
  }
  return { iae: w.iae, peak: Math.abs(w.peakDeviationC ?? 0), time: w.recoveryTimeS ?? horizon };
}

export function scoreAttempt(drill: Drill, attempt: RunResults, reference: RunResults): AttemptScore {
  const alpha = drill.scoring.metricWeights;
  const alphaSum = alpha.iae + alpha.peak + alpha.time;
  const windows: WindowScore[] = attempt.windows.map((aw, i) => {
    const a = metrics(aw.trueTemperature);
    const r = metrics(reference.windows[i].trueTemperature);
    const ratios = {
      iae: (a.iae + SCORE_EPSILON.iae) / (r.iae + SCORE_EPSILON.iae),
      peak: (a.peak + SCORE_EPSILON.peak) / (r.peak + SCORE_EPSILON.peak),
      time: (a.time + SCORE_EPSILON.time) / (r.time + SCORE_EPSILON.time),
    };
    const cost = (alpha.iae * ratios.iae + alpha.peak * ratios.peak + alpha.time * ratios.time) / alphaSum;
    return { id: aw.id, weight: aw.weight, ratios, cost, score: 100 / (1 + cost) };
  });
  const wSum = windows.reduce((s, w) => s + w.weight, 0);
  const mean = windows.reduce((s, w) => s + w.weight * w.score, 0) / wSum;
  const trips = attempt.safetyTrips.length;
  const total = mean * detPowInt(drill.scoring.tripPenaltyFactor, trips);
  return {
    engineVersion: attempt.engineVersion,
    score: Math.round(Math.min(100, Math.max(0, total)) * 10) / 10,
    windows,
    safetyTrips: trips,
    formula: SCORE_FORMULA,
  };
}
