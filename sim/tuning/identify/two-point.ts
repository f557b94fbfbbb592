/**
 * Two-point FOPDT identification from a step response (Smith; Bequette 2003 §4.2, references §8):
 *   τ = 1.5 (t63.2 − t28.3),  θ = t63.2 − τ,
 * where t_x is the time after the step at which the PV has made x % of its total change. The
 * published percentages 28.3 % and 63.2 % round the exact FOPDT points 1 − e^{−1/3} and 1 − e^{−1}
 * (so even a perfect FOPDT gives τ 0.05 % high). With noise, each crossing
 * time is the mean of the first and last crossing of its level (a simple guard against jitter).
 */
import type { FopdtModel } from "../models";
import type { StepInfo } from "./step-detection";
import type { StepRecord } from "./step-record";

export const SMITH_LOW = 0.283;
export const SMITH_HIGH = 0.632;

export function smithTwoPoint(t28S: number, t63S: number): { timeConstantS: number; deadTimeS: number } {
  const tau = 1.5 * (t63S - t28S);
  return { timeConstantS: tau, deadTimeS: t63S - tau };
}

/** Time after the step at which PV crosses y0 + fraction·Δy (interpolated), or null. */
export function crossingTime(r: StepRecord, step: StepInfo, fraction: number): number | null {
  const dy = step.pvEnd - step.pvBefore;
  const level = step.pvBefore + fraction * dy;
  const s = Math.sign(dy) || 1;
  let first: number | null = null;
  let last: number | null = null;
  for (let i = Math.max(1, step.index); i < r.t.length; i++) {
    const a = s * (r.pv[i - 1] - level);
    const b = s * (r.pv[i] - level);
    if (a < 0 && b >= 0) {
      const tc = r.t[i - 1] + ((r.t[i] - r.t[i - 1]) * -a) / (b - a);
      if (first === null) first = tc;
      last = tc;
    }
  }
  if (first === null || last === null) return null;
  return 0.5 * (first + last) - step.timeS;
}

export function twoPointFromRecord(r: StepRecord, step: StepInfo): FopdtModel | null {
  const t28 = crossingTime(r, step, SMITH_LOW);
  const t63 = crossingTime(r, step, SMITH_HIGH);
  if (t28 === null || t63 === null || !(t63 > t28)) return null;
  const du = step.outAfter - step.outBefore;
  if (du === 0) return null;
  const { timeConstantS, deadTimeS } = smithTwoPoint(t28, t63);
  return { kind: "fopdt", gainCPerPercent: (step.pvEnd - step.pvBefore) / du, timeConstantS, deadTimeS: Math.max(0, deadTimeS) };
}
