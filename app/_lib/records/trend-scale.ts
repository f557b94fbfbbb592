import type { TrendRow } from "./trend-decimation";

/**
 * The axes of a stored proof-test trend, shared by the record page's SVG and the PDF: time from
 * the first row to the last; SP and PV on one temperature axis padded by 8 % of their span (at
 * least 0.5 °C); OUT on its own 0–100 % axis. Each maps a value to a fraction of the plot, 0 at
 * the left / bottom and 1 at the right / top; the caller places it in its own box.
 */
export interface TrendScale {
  t0: number;
  t1: number;
  /** bottom and top of the temperature axis, °C */
  lo: number;
  hi: number;
  xFraction: (s: number) => number;
  tempFraction: (c: number) => number;
  outFraction: (p: number) => number;
}

export function trendScale(rows: readonly TrendRow[]): TrendScale {
  const t0 = rows[0][0];
  const t1 = rows[rows.length - 1][0];
  let lo = Infinity;
  let hi = -Infinity;
  for (const r of rows) {
    lo = Math.min(lo, r[1], r[2]);
    hi = Math.max(hi, r[1], r[2]);
  }
  const pad = Math.max((hi - lo) * 0.08, 0.5);
  lo -= pad;
  hi += pad;
  const span = t1 - t0 || 1;
  return {
    t0,
    t1,
    lo,
    hi,
    xFraction: (s) => (s - t0) / span,
    tempFraction: (c) => (c - lo) / (hi - lo),
    outFraction: (p) => Math.min(Math.max(p, 0), 100) / 100,
  };
}
