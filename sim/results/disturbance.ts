/**
 * Disturbance measures from the event on: peak deviation |y − SP| (signed at its largest
 * magnitude) and recovery time = the last entry into the same band used for settling, measured
 * from the event (band.ts).
 */
import { lastEntryIntoBand } from "./band";

export interface DisturbanceMetrics {
  /** Deviation y − SP of largest magnitude after the event, °C (signed). */
  peakDeviationC: number;
  /** When it occurred, s from the event. */
  peakDeviationTimeS: number | null;
  /** Recovery time from the event into the band (and staying), s; 0 if it never left; null if not recovered. */
  recoveryTimeS: number | null;
}

export function disturbanceMetrics(
  t: ArrayLike<number>,
  y: ArrayLike<number>,
  sp: ArrayLike<number>,
  first: number,
  last: number,
  eventTimeS: number,
  bandC: number,
): DisturbanceMetrics {
  if (last < first) return { peakDeviationC: 0, peakDeviationTimeS: null, recoveryTimeS: null };
  let peak = 0;
  let peakK = first;
  for (let k = first; k <= last; k++) {
    const dev = y[k] - sp[k];
    if (Math.abs(dev) > Math.abs(peak)) {
      peak = dev;
      peakK = k;
    }
  }
  const entry = lastEntryIntoBand(t, y, sp, bandC, first, last);
  return {
    peakDeviationC: peak,
    peakDeviationTimeS: t[peakK] - eventTimeS,
    recoveryTimeS: entry === null ? null : Math.max(0, entry - eventTimeS),
  };
}
