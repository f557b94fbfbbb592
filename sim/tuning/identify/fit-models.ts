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
  // the second lag may be far shorter than the FOPDT's time constant: a wider lower bound
  const lo = Math.log(Math.max(1e-6, Math.min(range.tauMinS, start.timeConstantS / 1000)));
  const hi = Math.log(range.tauMaxS);
  const clampLog = (v: number) => Math.min(hi, Math.max(lo, v));
  const taus = (p: number[]) => [Math.exp(clampLog(p[0])), Math.exp(clampLog(p[1]))];
  // two starts: nearly the FOPDT (a tiny second lag, so the fit can only improve on it) and a
  // genuine two-lag split of the FOPDT time constant
  const starts = [
    [Math.log(start.timeConstantS), Math.log(start.timeConstantS / 300)],
    [Math.log(0.7 * start.timeConstantS), Math.log(0.25 * start.timeConstantS)],
  ];
  const inner = (theta: number) => {
    let best = { x: starts[0], f: Infinity };
    for (const s0 of starts) {
      const res = nelderMead((p) => evaluate(r, taus(p), theta, buf).sse, s0, { step: 0.4, maxEvaluations: 120 });
      if (res.f < best.f) best = res;
    }
    return best;
  };
  const outer = gridThenGoldenMin((theta) => inner(theta).f, 0, Math.max(start.deadTimeS * 1.2, range.deadTimeMaxS / 4), 17);
  const theta = outer.x;
  const [ta, tb] = taus(inner(theta).x);
  const g = evaluate(r, [ta, tb], theta, buf);
  const model: SopdtModel = { kind: "sopdt", gainCPerPercent: g.gain, timeConstant1S: Math.max(ta, tb), timeConstant2S: Math.min(ta, tb), deadTimeS: theta };
  return finish(r, model, [ta, tb], theta);
}
