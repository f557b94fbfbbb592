/**
 * Setpoint-step measures on a sampled response: rise time 10–90 %, overshoot (% of the step and
 * °C), settling time (last exit from the band). Crossing instants are interpolated linearly
 * between samples.
 * Definitions as in Ogata, Modern Control Engineering, 5th ed., ch. 5 (with the 10–90 % rise time
 * used for overdamped and process responses, and the settling band widened as in band.ts).
 */
import { bandHalfWidthC, lastEntryIntoBand } from "./band";

export interface StepMetrics {
  /** 10–90 % rise time, s; null when 90 % is never reached. */
  riseTimeS: number | null;
  /** Peak beyond the final setpoint, in % of |step| (0 if none). */
  overshootPct: number;
  /** Peak beyond the final setpoint, °C (0 if none). */
  overshootC: number;
  /** Time of the peak (largest excursion in the step's direction), s from the step. */
  peakTimeS: number | null;
  /** Settling time from the step, s; null when the response ends outside the band. */
  settlingTimeS: number | null;
  /** Band half-width used, °C. */
  bandC: number;
}

/** First time y crosses `level` going in direction `dir` (+1 up, −1 down), interpolated; null if never. */
export function firstCrossing(
  t: ArrayLike<number>,
  y: ArrayLike<number>,
  level: number,
  dir: number,
  first: number,
  last: number,
): number | null {
  if (dir * (y[first] - level) >= 0) return t[first];
  for (let k = first + 1; k <= last; k++) {
    if (dir * (y[k] - level) >= 0) {
      const frac = (level - y[k - 1]) / (y[k] - y[k - 1]);
      return t[k - 1] + frac * (t[k] - t[k - 1]);
    }
  }
  return null;
}

/**
 * Step measures for a step of `stepSizeC` at `stepTimeS` to the final setpoint `targetC`
 * (base = target − step), over samples first..last.
 */
export function stepMetrics(
  t: ArrayLike<number>,
  y: ArrayLike<number>,
  first: number,
  last: number,
  stepTimeS: number,
  targetC: number,
  stepSizeC: number,
  bandFloorC: number,
  noiseSigmaC: number,
): StepMetrics {
  const bandC = bandHalfWidthC(stepSizeC, bandFloorC, noiseSigmaC);
  if (last < first || stepSizeC === 0) {
    return { riseTimeS: null, overshootPct: 0, overshootC: 0, peakTimeS: null, settlingTimeS: null, bandC };
  }
  const dir = stepSizeC > 0 ? 1 : -1;
  const base = targetC - stepSizeC;
  const t10 = firstCrossing(t, y, base + 0.1 * stepSizeC, dir, first, last);
  const t90 = firstCrossing(t, y, base + 0.9 * stepSizeC, dir, first, last);
  const riseTimeS = t10 !== null && t90 !== null ? t90 - t10 : null;

  let peakDev = -Infinity;
  let peakK = first;
  for (let k = first; k <= last; k++) {
    const dev = dir * (y[k] - targetC);
    if (dev > peakDev) {
      peakDev = dev;
      peakK = k;
    }
  }
  const overshootC = Math.max(0, peakDev);
  const overshootPct = (100 * overshootC) / Math.abs(stepSizeC);
  const entry = lastEntryIntoBand(t, y, targetC, bandC, first, last);
  return {
    riseTimeS,
    overshootPct,
    overshootC,
    peakTimeS: t[peakK] - stepTimeS,
    settlingTimeS: entry === null ? null : Math.max(0, entry - stepTimeS),
    bandC,
  };
}
