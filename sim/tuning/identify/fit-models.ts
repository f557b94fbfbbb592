/**
 * FOPDT and SOPDT fits by output error: the model is simulated with the recorded OUT
 * (model-response.ts) and the squared error to the recorded PV minimised.
 * - The dead time θ is the outer, one-dimensional search: a grid over [0, θmax] then golden
 *   section between the best grid point's neighbours.
 * - Inside it, K and the baseline come from linear least squares; the FOPDT time constant from a
 *   log-spaced grid plus golden section; the SOPDT pair from Nelder–Mead on (ln τ1, ln τ2),
 *   warm-started from the FOPDT fit.
 */
import type { FopdtModel, SopdtModel } from "../models";
import { gridThenGoldenMin } from "../numeric/one-dimensional-search";
import { nelderMead } from "../numeric/nelder-mead";
import { fitGainAndBaseline, type GainFit } from "./gain-and-baseline";
import { fitQuality, type FitQuality } from "./fit-quality";
import { unitModelResponse } from "./model-response";
import type { StepRecord } from "./step-record";

export interface FittedModel<M> {
  model: M;
  /** fitted PV at rest before the step, °C */
  baselineC: number;
  quality: FitQuality;
  /** the model's PV at the record's times, °C */
  predicted: number[];
}

export interface SearchRange {
  deadTimeMaxS: number;
  tauMinS: number;
  tauMaxS: number;
}

function evaluate(r: StepRecord, taus: number[], theta: number, buf: Float64Array): GainFit {
  return fitGainAndBaseline(r.pv, unitModelResponse(r, taus, theta, buf));
}

function finish<M>(r: StepRecord, model: M, taus: number[], theta: number): FittedModel<M> {
  const x = unitModelResponse(r, taus, theta);
  const g = fitGainAndBaseline(r.pv, x);
  const predicted = Array.from(x, (v) => g.baseline + g.gain * v);
  return { model, baselineC: g.baseline, quality: fitQuality(r.pv, predicted), predicted };
}

export function fitFopdt(r: StepRecord, range: SearchRange): FittedModel<FopdtModel> {
  const buf = new Float64Array(r.t.length);
  const bestTau = (theta: number) => gridThenGoldenMin((tau) => evaluate(r, [tau], theta, buf).sse, range.tauMinS, range.tauMaxS, 21, true);
  const outer = gridThenGoldenMin((theta) => bestTau(theta).f, 0, range.deadTimeMaxS, 31);
  const theta = outer.x;
  const tau = bestTau(theta).x;
  const g = evaluate(r, [tau], theta, buf);
  return finish(r, { kind: "fopdt", gainCPerPercent: g.gain, timeConstantS: tau, deadTimeS: theta }, [tau], theta);
}

export function fitSopdt(r: StepRecord, range: SearchRange, start: FopdtModel): FittedModel<SopdtModel> {
  const buf = new Float64Array(r.t.length);
  let warm = [Math.log(0.7 * start.timeConstantS), Math.log(0.25 * start.timeConstantS)];
  const lo = Math.log(range.tauMinS);
  const hi = Math.log(range.tauMaxS);
  const clampLog = (v: number) => Math.min(hi, Math.max(lo, v));
  const inner = (theta: number) => {
    const res = nelderMead((p) => evaluate(r, [Math.exp(clampLog(p[0])), Math.exp(clampLog(p[1]))], theta, buf).sse, warm, { step: 0.4, maxEvaluations: 160 });
    return res;
  };
  const outer = gridThenGoldenMin(
    (theta) => {
      const res = inner(theta);
      return res.f;
    },
    0,
    Math.max(start.deadTimeS * 1.2, range.deadTimeMaxS / 4),
    21,
  );
  const theta = outer.x;
  warm = [Math.log(0.7 * start.timeConstantS), Math.log(0.25 * start.timeConstantS)];
  const best = inner(theta);
  const ta = Math.exp(clampLog(best.x[0]));
  const tb = Math.exp(clampLog(best.x[1]));
  const g = evaluate(r, [ta, tb], theta, buf);
  const model: SopdtModel = { kind: "sopdt", gainCPerPercent: g.gain, timeConstant1S: Math.max(ta, tb), timeConstant2S: Math.min(ta, tb), deadTimeS: theta };
  return finish(r, model, [ta, tb], theta);
}
