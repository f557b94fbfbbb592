// The record's small trend: at most `maxRows` rows of [t s, SP °C, PV °C, OUT %] out of a full
// trace. Each bucket of samples keeps the rows where PV is lowest and highest (in time order), so
// a peak or a dip survives the reduction (min/max decimation, as the Bench trend does per pixel);
// the first and last rows are always kept, so the trend spans the whole run.
//
// Not components/trend/decimate.ts's decimateMinMax, on purpose: that one takes each series' own
// minimum and maximum per column and puts them at the column's first and last time, so its rows
// are not samples (SP, PV and OUT of one row may come from different instants). A record's row
// is stored and printed as one instant of the run, and only PV's extremes pick the rows here;
// changing that would change every new record's stored trend.
import type { Trace } from "@/sim/drill/trace";

export type TrendRow = [number, number, number, number];

export const MAX_TREND_ROWS = 600;

export function decimateTrend(trace: Trace, maxRows = MAX_TREND_ROWS): TrendRow[] {
  const n = trace.length;
  const row = (i: number): TrendRow => [trace.timeS[i], trace.setpointC[i], trace.pvRawC[i], trace.outPercent[i]];
  if (n <= maxRows) return Array.from({ length: n }, (_, i) => row(i));
  const inner = n - 2; // rows 1 … n−2 go into buckets
  const buckets = Math.floor((maxRows - 2) / 2);
  const out: TrendRow[] = [row(0)];
  for (let b = 0; b < buckets; b++) {
    const from = 1 + Math.floor((b * inner) / buckets);
    const to = 1 + Math.floor(((b + 1) * inner) / buckets);
    if (to <= from) continue;
    let lo = from;
    let hi = from;
    for (let i = from + 1; i < to; i++) {
      if (trace.pvRawC[i] < trace.pvRawC[lo]) lo = i;
      if (trace.pvRawC[i] > trace.pvRawC[hi]) hi = i;
    }
    if (lo === hi) out.push(row(lo));
    else for (const i of lo < hi ? [lo, hi] : [hi, lo]) out.push(row(i));
  }
  out.push(row(n - 1));
  return out;
}
