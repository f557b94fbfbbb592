/**
 * The series the twin charts draw, reduced for the screen with the trend's min/max decimation
 * (every spike of a long log still shows). Pure: the detail page computes them on the server and
 * sends only these few thousand points, the new-twin page in the browser.
 */
import { decimateMinMax } from "@/components/trend/decimate";

export interface FitSeries {
  t: number[];
  pv: number[];
  model: number[];
  /** data − model, °C */
  residual: number[];
}

export interface LogSeries {
  t: number[];
  pv: number[];
  sp: (number | null)[] | null;
  out: number[];
}

const whole = (t: ArrayLike<number>) => ({ fromX: t[0], toX: t[t.length - 1] });

export function fitSeries(t: readonly number[], pv: readonly number[], predicted: readonly number[], columns = 800): FitSeries {
  const residual = pv.map((y, i) => y - predicted[i]);
  if (t.length === 0) return { t: [], pv: [], model: [], residual: [] };
  const d = decimateMinMax(t, [pv, predicted, residual], t.length, whole(t), columns);
  return { t: d.x, pv: d.series[0], model: d.series[1], residual: d.series[2] };
}

export function logSeries(log: { t: readonly number[]; pv: readonly number[]; sp: readonly number[] | null; out: readonly number[] }, columns = 800): LogSeries {
  if (log.t.length === 0) return { t: [], pv: [], sp: null, out: [] };
  const sp = log.sp?.map((v) => (Number.isFinite(v) ? v : NaN)) ?? null;
  const d = decimateMinMax(log.t, sp ? [log.pv, log.out, sp] : [log.pv, log.out], log.t.length, whole(log.t), columns);
  return { t: d.x, pv: d.series[0], out: d.series[1], sp: sp ? d.series[2].map((v) => (Number.isFinite(v) ? v : null)) : null };
}
