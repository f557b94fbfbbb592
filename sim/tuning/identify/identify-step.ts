/**
 * Bump-test identification, end to end: validate → find the step → two-point start (Smith) →
 * FOPDT and SOPDT output-error fits → fit quality, noise level and warnings. Never throws: bad
 * input gives a refusal with a message a technician can act on.
 *
 * Warning thresholds (common practice, no published source):
 * - step too small: PV change under 10× the noise σ;
 * - record too short: less than θ + 4τ after the step (98 % of the response for an FOPDT);
 * - dead time under ten sampling intervals (median interval): θ is then coarsely resolved;
 * - not steady before the step: the pre-step trend, projected over the response, exceeds 5 % of
 *   the PV change and 3σ; or fewer than five samples before the step to judge it.
 */
import type { FopdtModel, SopdtModel } from "../models";
import { fitFopdt, fitSopdt, type FittedModel, type SearchRange } from "./fit-models";
import { detrendedSigma, median, noiseSigmaFromSecondDifferences } from "./noise-estimate";
import { detectStep, MIN_STEP_PERCENT, type StepInfo } from "./step-detection";
import { refusal, type IdentifyRefusal, type StepRecord } from "./step-record";
import { twoPointFromRecord } from "./two-point";
import { validateRecord } from "./validate-record";

export type IdentifyWarningCode = "step-too-small" | "record-too-short" | "dead-time-few-samples" | "not-steady-before-step" | "poor-fit";

export interface IdentifyWarning {
  code: IdentifyWarningCode;
  message: string;
}

export interface Identification {
  ok: true;
  step: StepInfo;
  /** Smith 28.3 %/63.2 % estimate (the start of the search), null if the PV never crossed both levels */
  twoPoint: FopdtModel | null;
  fopdt: FittedModel<FopdtModel>;
  sopdt: FittedModel<SopdtModel> | null;
  /** SOPDT when it lowers the squared error by more than 20 %, else FOPDT */
  preferred: "fopdt" | "sopdt";
  /** PV noise σ from second differences (model-free), °C */
  noiseSigmaC: number;
  /** residual σ of the preferred fit, °C */
  residualSigmaC: number;
  samples: { count: number; medianIntervalS: number };
  warnings: IdentifyWarning[];
}

export interface IdentifyOptions {
  /** skip the SOPDT fit (faster) */
  fopdtOnly?: boolean;
}

function r3(x: number): string {
  return String(+x.toPrecision(3));
}

function identifyChecked(record: StepRecord, opts: IdentifyOptions): Identification | IdentifyRefusal {
  const n = record.t.length;
  const step = detectStep(record);
  if (!step) {
    let lo = Infinity;
    let hi = -Infinity;
    for (const u of record.out) {
      lo = Math.min(lo, u);
      hi = Math.max(hi, u);
    }
    return refusal("no-step", `no step in OUT: it only varies by ${r3(hi - lo)} % (a bump test needs a step of at least ${MIN_STEP_PERCENT} %, better 5–20 %)`);
  }
  if (n - step.index < 5) return refusal("step-at-end", "the OUT step is at the very end of the record: there is no response to fit");
  let pvLo = Infinity;
  let pvHi = -Infinity;
  for (const y of record.pv) {
    pvLo = Math.min(pvLo, y);
    pvHi = Math.max(pvHi, y);
  }
  if (pvHi === pvLo) return refusal("pv-flat", "PV is flat: it does not change at all during the record (check the PV column and the sensor)");
  const noise = noiseSigmaFromSecondDifferences(record.pv);
  const dPv = step.pvEnd - step.pvBefore;
  if (Math.abs(dPv) <= 2 * noise)
    return refusal("no-response", `PV shows no response to the step: its change ${r3(dPv)} °C is within the noise (σ ≈ ${r3(noise)} °C)`);

  const intervals: number[] = [];
  for (let i = 1; i < n; i++) intervals.push(record.t[i] - record.t[i - 1]);
  const dtMed = median(intervals);
  const after = record.t[n - 1] - step.timeS;
  const twoPoint = twoPointFromRecord(record, step);
  const tauGuess = twoPoint && twoPoint.timeConstantS > 0 ? twoPoint.timeConstantS : after / 4;
  const range: SearchRange = {
    deadTimeMaxS: Math.min(0.6 * after, Math.max(3 * (twoPoint?.deadTimeS ?? 0), 0.5 * tauGuess, 20 * dtMed)),
    tauMinS: Math.max(dtMed / 10, tauGuess / 30),
    tauMaxS: Math.max(tauGuess * 30, dtMed),
  };
  const shifted: StepRecord = { t: record.t.map((t) => t - record.t[0]), out: record.out, pv: record.pv };
  const fo = fitFopdt(shifted, range);
  const so = opts.fopdtOnly ? null : fitSopdt(shifted, range, fo.model);
  const preferred = so && so.quality.sse < 0.8 * fo.quality.sse ? "sopdt" : "fopdt";
  const best = preferred === "sopdt" && so ? so : fo;

  const warnings: IdentifyWarning[] = [];
  const change = fo.model.gainCPerPercent * (step.outAfter - step.outBefore);
  if (Math.abs(change) < 10 * noise)
    warnings.push({
      code: "step-too-small",
      message: `the step moved PV by ${r3(change)} °C, only ${r3(Math.abs(change) / noise)}× the noise (σ ≈ ${r3(noise)} °C): make the OUT step larger (aim for at least 10× the noise)`,
    });
  const needed = fo.model.deadTimeS + 4 * fo.model.timeConstantS;
  if (after < needed)
    warnings.push({
      code: "record-too-short",
      message: `the record ends ${r3(after)} s after the step, before the process settles (θ + 4τ ≈ ${r3(needed)} s): the gain and time constant are extrapolated; record longer`,
    });
  // samples inside the dead time, counted where they are (the spacing may vary along the record)
  const tDead = step.timeS + fo.model.deadTimeS;
  let thetaSamples = 0;
  for (let i = step.index; i < n && record.t[i] <= tDead; i++) thetaSamples++;
  if (thetaSamples < 10)
    warnings.push({
      code: "dead-time-few-samples",
      message:
        fo.model.deadTimeS > 0
          ? `the dead time (${r3(fo.model.deadTimeS)} s) spans only ${thetaSamples} sample(s): it is coarsely resolved; log faster (at least ten samples within the dead time)`
          : "no dead time was found: either the process responds at once or the logging is too slow to see it (log faster around the step)",
    });
  const pre = step.index;
  if (pre < 5) {
    warnings.push({ code: "not-steady-before-step", message: `only ${pre} sample(s) before the step: cannot confirm the process was steady; log a minute or more of steady state first` });
  } else {
    const d = detrendedSigma(record.t.slice(0, pre), record.pv.slice(0, pre));
    const drift = Math.abs(d.slope) * after;
    // a trend that is real (slope beyond 3 standard errors) and matters (over 5 % of the change)
    if (drift > 0.05 * Math.abs(change) && Math.abs(d.slope) > 3 * d.slopeStdError)
      warnings.push({
        code: "not-steady-before-step",
        message: `PV was drifting before the step (${r3(d.slope * 60)} °C/min, ≈ ${r3(drift)} °C over the response): the fit mixes that drift into the model; wait for steady state before stepping`,
      });
  }
  if (best.quality.r2 < 0.9) warnings.push({ code: "poor-fit", message: `the model explains only ${r3(100 * best.quality.r2)} % of the PV variation (R²): check the record for disturbances or a nonlinear response` });

  return {
    ok: true,
    step,
    twoPoint,
    fopdt: fo,
    sopdt: so,
    preferred,
    noiseSigmaC: noise,
    residualSigmaC: best.quality.rmse,
    samples: { count: n, medianIntervalS: dtMed },
    warnings,
  };
}

/** Identify FOPDT and SOPDT models from a bump-test record; a refusal for unusable input. */
export function identifyStepResponse(raw: unknown, opts: IdentifyOptions = {}): Identification | IdentifyRefusal {
  try {
    const v = validateRecord(raw);
    if (!v.ok) return v;
    return identifyChecked(v.record, opts);
  } catch (e) {
    // last line of defence: the checks above should leave nothing to throw
    return refusal("not-finite", `the record could not be processed: ${e instanceof Error ? e.message : String(e)}`);
  }
}
