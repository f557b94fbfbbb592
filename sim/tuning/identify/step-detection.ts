/**
 * Where the step is in a record: the first sample at which OUT has left its initial value by
 * more than 2 % of its largest excursion (so a ramped or two-stage step is found at its start),
 * the OUT and PV levels before it and at the end of the record.
 */
import type { StepRecord } from "./step-record";

/** OUT excursions below this are not a step, % (a logger's rounding is usually 0.1 %). */
export const MIN_STEP_PERCENT = 0.5;

export interface StepInfo {
  /** index of the first sample with the new OUT */
  index: number;
  timeS: number;
  outBefore: number;
  /** mean OUT over the last 10 % of the record */
  outAfter: number;
  /** largest |OUT − OUT before| in the record */
  maxExcursion: number;
  /** mean PV before the step (first sample if the step is at the start) */
  pvBefore: number;
  /** mean PV over the last 10 % of the record (at least 3 samples) */
  pvEnd: number;
}

function tailMean(y: readonly number[]): number {
  const n = Math.max(3, Math.ceil(0.1 * y.length));
  let s = 0;
  for (let i = y.length - n; i < y.length; i++) s += y[i];
  return s / n;
}

export function detectStep(r: StepRecord): StepInfo | null {
  const u0 = r.out[0];
  let maxEx = 0;
  for (const u of r.out) maxEx = Math.max(maxEx, Math.abs(u - u0));
  if (maxEx < MIN_STEP_PERCENT) return null;
  let index = 1;
  while (index < r.out.length && Math.abs(r.out[index] - u0) <= 0.02 * maxEx) index++;
  let pvBefore = 0;
  for (let i = 0; i < index; i++) pvBefore += r.pv[i];
  pvBefore /= index;
  return { index, timeS: r.t[index], outBefore: u0, outAfter: tailMean(r.out), maxExcursion: maxEx, pvBefore, pvEnd: tailMean(r.pv) };
}
