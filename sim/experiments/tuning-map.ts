/**
 * A tuning map: one result (IAE, overshoot, settling time, score-like cost) over a grid of Kc × Ti,
 * for a heatmap with the current tuning marked. Grid values are spaced geometrically around the
 * current tuning, as tuning sensitivity is roughly logarithmic (common practice).
 */
import type { ControllerConfigInput } from "../control/config";
import type { RunResults } from "../drill/results";
import type { Variant } from "./variants";

export type MapMetric = "iae" | "overshootPct" | "settlingTimeS";

export const MAP_METRICS: Record<MapMetric, { label: string; unit: string }> = {
  iae: { label: "IAE", unit: "°C·s" },
  overshootPct: { label: "overshoot", unit: "%" },
  settlingTimeS: { label: "settling time", unit: "s" },
};

/** n values from center/spread to center·spread, geometric, rounded to 3 significant digits. */
export function geometricAxis(center: number, spread: number, n: number): number[] {
  if (!(center > 0) || !(spread > 1) || n < 2) throw new RangeError("geometricAxis needs center > 0, spread > 1 and n ≥ 2");
  const lo = Math.log(center / spread);
  const hi = Math.log(center * spread);
  return Array.from({ length: n }, (_, i) => Number(Math.exp(lo + ((hi - lo) * i) / (n - 1)).toPrecision(3)));
}

export function mapVariants(base: ControllerConfigInput, kcAxis: readonly number[], tiAxis: readonly number[]): Variant[] {
  const out: Variant[] = [];
  for (const ti of tiAxis) for (const kc of kcAxis) out.push({ label: `Kc ${kc}, Ti ${ti}`, controller: { ...base, kc, ti } });
  return out;
}

/** The metric of the first scoring window on the true temperature; null when not reached. */
export function mapValue(results: RunResults, metric: MapMetric): number | null {
  const w = results.windows[0]?.trueTemperature;
  if (!w) return null;
  const v = w[metric];
  return typeof v === "number" && Number.isFinite(v) ? v : null;
}
