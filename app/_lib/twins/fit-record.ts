/**
 * Long logs are fitted on a reduced record. The engine's fits simulate the model a few thousand
 * times over the whole record, so their cost grows with the row count: 1 400 rows take about 2 s,
 * 60 000 rows (a 2 MB log at 0.5 s) some 90 s on this machine — too long for a request or a
 * browser tab. Above MAX_FIT_POINTS rows, the rows just after the OUT step (dead time and early
 * rise, where θ is decided) are kept as logged and the rest become block means of k rows
 * (averaging before decimating: common practice against aliasing), with a block boundary exactly
 * at the step so it stays sharp. The fitted time constants and dead time are then carried back to
 * every row: K and the baseline are re-fitted by least squares on all rows, and the predicted PV,
 * fit quality, noise σ and step are computed on all rows, so every figure shown is about the log
 * as uploaded. The technician is told (blockFitNote).
 */
import type { Identification, StepRecord } from "@/sim/tuning/identify";
import { detectStep, fitGainAndBaseline, fitQuality, noiseSigmaFromSecondDifferences, unitModelResponse } from "@/sim/tuning/identify";
import type { FittedModel } from "@/sim/tuning/identify";
import type { FopdtModel, SopdtModel } from "@/sim/tuning/models";
import { timeConstantsOf } from "@/sim/tuning/model-definition";

export const MAX_FIT_POINTS = 1200;

function blockMeans(r: StepRecord, from: number, to: number, k: number, acc: { t: number[]; out: number[]; pv: number[] }) {
  for (let i = from; i < to; i += k) {
    const end = Math.min(to, i + k);
    let st = 0;
    let su = 0;
    let sy = 0;
    for (let j = i; j < end; j++) {
      st += r.t[j];
      su += r.out[j];
      sy += r.pv[j];
    }
    const m = end - i;
    acc.t.push(st / m);
    acc.out.push(su / m);
    acc.pv.push(sy / m);
  }
}

/**
 * The record to fit and the block size (1: the record itself). The rows right after the step —
 * the dead time and the start of the rise, where θ is decided — are kept as logged (up to a third
 * of the budget); the rest before and after becomes block means.
 */
export function reduceForFit(r: StepRecord, maxPoints = MAX_FIT_POINTS): { record: StepRecord; blockSize: number } {
  const n = r.t.length;
  if (n <= maxPoints) return { record: r, blockSize: 1 };
  const step = detectStep(r);
  const split = step ? step.index : 0;
  const raw = Math.min(n - split, Math.floor(maxPoints / 3));
  // two block-mean segments (before the step, after the raw rows): each may end in a partial block
  const k = Math.ceil((n - raw) / (maxPoints - raw - 2));
  const acc = { t: [] as number[], out: [] as number[], pv: [] as number[] };
  blockMeans(r, 0, split, k, acc);
  blockMeans(r, split, split + raw, 1, acc);
  blockMeans(r, split + raw, n, k, acc);
  return { record: acc, blockSize: k };
}

function refit<M extends FopdtModel | SopdtModel>(full: StepRecord, fit: FittedModel<M>): FittedModel<M> {
  const x = unitModelResponse(full, timeConstantsOf(fit.model), fit.model.deadTimeS);
  const g = fitGainAndBaseline(full.pv, x);
  const predicted = Array.from(x, (v) => g.baseline + g.gain * v);
  return { model: { ...fit.model, gainCPerPercent: g.gain }, baselineC: g.baseline, quality: fitQuality(full.pv, predicted), predicted };
}

/** An identification made on block means, restated on every row of the full record. */
export function onFullRecord(id: Identification, full: StepRecord, blockSize: number): Identification {
  if (blockSize <= 1) return id;
  const fopdt = refit(full, id.fopdt);
  const sopdt = id.sopdt ? refit(full, id.sopdt) : null;
  // the engine's rule for preferring SOPDT: it lowers the squared error by more than 20 %
  const preferred = sopdt && sopdt.quality.sse < 0.8 * fopdt.quality.sse ? "sopdt" : "fopdt";
  const best = preferred === "sopdt" && sopdt ? sopdt : fopdt;
  const n = full.t.length;
  const intervals = full.t.slice(1).map((t, i) => t - full.t[i]).sort((a, b) => a - b);
  const medianIntervalS = intervals.length ? (intervals[(intervals.length - 1) >> 1] + intervals[intervals.length >> 1]) / 2 : 0;
  return {
    ...id,
    step: detectStep(full) ?? id.step,
    fopdt,
    sopdt,
    preferred,
    noiseSigmaC: noiseSigmaFromSecondDifferences(full.pv),
    residualSigmaC: best.quality.rmse,
    samples: { count: n, medianIntervalS },
    // the engine's warnings stay as found on the record it fitted
  };
}

/** What the technician is told when the fit ran on block means. */
export function blockFitNote(rows: number, blockSize: number, medianIntervalS: number): string {
  return `the log has ${rows} rows: the time constants and dead time were fitted on the rows just after the step as logged and on means of ${blockSize} rows elsewhere (about ${+(blockSize * medianIntervalS).toPrecision(3)} s each); gain, fit quality, residuals and noise are computed on all rows`;
}
