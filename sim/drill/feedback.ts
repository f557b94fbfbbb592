/**
 * Automatic feedback per scoring window: the attempt's measures beside the reference tuning's, the
 * window's score (score.ts), a verdict, one finding and one hint.
 * Method: the measures are the score's own (score.ts: IAE, overshoot / peak deviation, settling /
 * recovery time on the true temperature); the verdict bands sit around the reference's 50; the
 * hints are the trade's rules of thumb for PID tuning (common practice), in our own words, picked
 * by the dominating symptom.
 */
import type { Drill } from "./schema";
import type { RunResults, WindowResultPair } from "./results";
import { scoreAttempt, type AttemptScore, type WindowScore } from "./score";
import { runDrill } from "./run-drill";
import type { ControllerConfig, ControllerConfigInput } from "../control/config";
import type { StampedAction } from "./actions";

/** Automatic feedback on one scoring window (sim/drill/feedback.ts makes it). */
export interface WindowFeedback {
  windowId: string;
  label: string;
  kind: "setpoint" | "disturbance";
  weight: number;
  /** the attempt's measures: IAE °C·s, peak °C (overshoot or peak deviation), time s (settling or recovery; null = never) */
  measured: { iae: number; peak: number; time: number | null };
  /** the reference tuning's measures on the same drill and seed */
  reference: { iae: number; peak: number; time: number | null };
  ratios: { iae: number; peak: number; time: number };
  score: number;
  verdict: "better" | "close" | "worse";
  /** one sentence: what stands out */
  finding: string;
  /** one concrete suggestion */
  hint: string;
}

/** Verdict bands around the reference's 50 (score.ts: the reference tuning scores 50 exactly). */
export const VERDICT_BANDS = { betterFrom: 55, worseBelow: 45 } as const;

/** A ratio above this counts as clearly worse than the reference (our own threshold: 20 %). */
const WORSE_RATIO = 1.2;
/**
 * "Close to oscillating": overshoot of at least a quarter of the step (the quarter-decay response is
 * the classic aggressive limit, common practice) and settling more than twice the reference's.
 */
const OSCILLATING_OVERSHOOT_PCT = 25;
const OSCILLATING_TIME_RATIO = 2;
/** Output travel this many times the reference's (and at least NOISY_MIN_TRAVEL_PCT more) reads as a noisy OUT (our own threshold). */
const NOISY_TRAVEL_RATIO = 3;
const NOISY_MIN_TRAVEL_PCT = 50;
/** A trip this close before the window still counts for it, s (our own choice). */
const TRIP_NEAR_S = 60;

/** The trade's rules of thumb (common practice), one per symptom, in our own words. */
export const HINTS = {
  trip: "the safety cutout tripped: keep the temperature well below the trip point (less overshoot: a smaller gain, or a setpoint weight b < 1) and reset the cutout only once it has cooled",
  overshoot: "consider a smaller gain or some derivative action (or a setpoint weight b < 1)",
  oscillating: "the loop is close to oscillating: reduce the gain or lengthen the integral time",
  sluggish: "consider a larger gain or a shorter integral time",
  disturbancePeak: "a larger gain or shorter integral time rejects the disturbance faster",
  recovery: "shorten the integral time so the output moves further to cancel the load",
  noisy: "filter the PV or the derivative (larger N → smaller; or a longer PV filter)",
} as const;

function fmt(x: number, digits = 1): string {
  return x.toFixed(digits);
}

function timeText(t: number | null): string {
  return t === null ? "never" : `${fmt(t, 0)} s`;
}

function measures(w: WindowResultPair): { iae: number; peak: number; time: number | null } {
  const r = w.trueTemperature;
  if (w.kind === "setpoint") return { iae: r.iae, peak: Math.max(0, r.overshootC ?? 0), time: r.settlingTimeS };
  return { iae: r.iae, peak: Math.abs(r.peakDeviationC ?? 0), time: r.recoveryTimeS };
}

/** Verdict from the window score: better ≥ 55, close 45–55, worse < 45 (reference = 50). */
export function verdictOf(score: number): WindowFeedback["verdict"] {
  if (score >= VERDICT_BANDS.betterFrom) return "better";
  if (score >= VERDICT_BANDS.worseBelow) return "close";
  return "worse";
}

type Metric = "iae" | "peak" | "time";

function finding(kind: "setpoint" | "disturbance", m: Metric, a: WindowFeedback["measured"], r: WindowFeedback["reference"]): string {
  if (m === "iae") return `IAE ${fmt(a.iae, 0)} °C·s against the reference's ${fmt(r.iae, 0)} °C·s.`;
  if (m === "peak") {
    const name = kind === "setpoint" ? "Overshoot" : "Peak deviation";
    return `${name} ${fmt(a.peak)} °C against the reference's ${fmt(r.peak)} °C.`;
  }
  const name = kind === "setpoint" ? "Settling time" : "Recovery time";
  return `${name} ${timeText(a.time)} against the reference's ${timeText(r.time)}.`;
}

/** One window's feedback (see windowFeedback). */
function oneWindow(drill: Drill, aw: WindowResultPair, rw: WindowResultPair, ws: WindowScore, attempt: RunResults): WindowFeedback {
  const a = measures(aw);
  const r = measures(rw);
  const verdict = verdictOf(ws.score);
  const ratios = ws.ratios;
  const metricsOrder: Metric[] = ["iae", "peak", "time"];
  // the worst metric against the reference (largest ratio) and the best (smallest)
  const byRatio = [...metricsOrder].sort((x, y) => ratios[y] - ratios[x]);
  const worst = byRatio[0];
  const best = byRatio[byRatio.length - 1];

  const tripNear = attempt.safetyTrips.some((t) => t.timeS >= aw.trueTemperature.windowStartS - TRIP_NEAR_S && t.timeS <= aw.trueTemperature.windowEndS);
  const travelA = aw.trueTemperature.outputTravelPct;
  const travelR = rw.trueTemperature.outputTravelPct;
  const noisy = travelA > NOISY_TRAVEL_RATIO * travelR && travelA - travelR > NOISY_MIN_TRAVEL_PCT;
  const peakHigh = ratios.peak > WORSE_RATIO;
  const timeHigh = ratios.time > WORSE_RATIO;
  const iaeHigh = ratios.iae > WORSE_RATIO;
  const slowMetric: Metric = ratios.time >= ratios.iae ? "time" : "iae";

  // the dominating symptom, in this order: a trip, the loop's own response, a noisy OUT, none
  let hint: string;
  let text: string;
  if (tripNear) {
    hint = HINTS.trip;
    text = `The safety cutout tripped during or just before this window; ${lowerFirst(finding(aw.kind, worst, a, r))}`;
  } else if (aw.kind === "setpoint" && peakHigh && ratios.time > OSCILLATING_TIME_RATIO && (aw.trueTemperature.overshootPct ?? 0) >= OSCILLATING_OVERSHOOT_PCT) {
    hint = HINTS.oscillating;
    text = finding(aw.kind, "peak", a, r);
  } else if (aw.kind === "setpoint" && peakHigh) {
    hint = HINTS.overshoot;
    text = finding(aw.kind, "peak", a, r);
  } else if (aw.kind === "setpoint" && (timeHigh || iaeHigh)) {
    hint = HINTS.sluggish;
    text = finding(aw.kind, slowMetric, a, r);
  } else if (aw.kind === "disturbance" && peakHigh) {
    hint = HINTS.disturbancePeak;
    text = finding(aw.kind, "peak", a, r);
  } else if (aw.kind === "disturbance" && (timeHigh || iaeHigh)) {
    hint = HINTS.recovery;
    text = finding(aw.kind, slowMetric, a, r);
  } else if (noisy) {
    hint = HINTS.noisy;
    text = `The output moved ${fmt(travelA, 0)} % in total against the reference's ${fmt(travelR, 0)} %: a noisy OUT.`;
  } else if (verdict === "better") {
    hint = `well done: ${wellDone(aw.kind, best)} than the reference`;
    text = `Better than the reference: ${lowerFirst(finding(aw.kind, best, a, r))}`;
  } else if (verdict === "worse") {
    // worse overall although no single metric stands out: the general rule for a slow loop
    hint = aw.kind === "setpoint" ? HINTS.sluggish : HINTS.recovery;
    text = finding(aw.kind, worst, a, r);
  } else {
    hint = "on a par with the reference: change the gain or the integral time a little at a time and watch which way the score moves";
    text = `On a par with the reference: ${lowerFirst(finding(aw.kind, worst, a, r))}`;
  }

  return { windowId: aw.id, label: aw.label, kind: aw.kind, weight: aw.weight, measured: a, reference: r, ratios: { ...ratios }, score: ws.score, verdict, finding: text, hint };
}

function lowerFirst(x: string): string {
  // keep acronyms (IAE) as they are
  return /^[A-Z][a-z]/.test(x) ? x[0].toLowerCase() + x.slice(1) : x;
}

function wellDone(kind: "setpoint" | "disturbance", m: Metric): string {
  if (m === "iae") return "smaller error area (IAE)";
  if (m === "peak") return kind === "setpoint" ? "less overshoot" : "a smaller peak deviation";
  return kind === "setpoint" ? "faster settling" : "faster recovery";
}

/**
 * Feedback for every scoring window of an attempt, from its results, the reference tuning's
 * results on the same drill and seed, and the attempt's score (score.ts).
 */
export function windowFeedback(drill: Drill, attempt: RunResults, reference: RunResults, score: AttemptScore): WindowFeedback[] {
  return attempt.windows.map((aw, i) => {
    const ws = score.windows.find((w) => w.id === aw.id) ?? score.windows[i];
    return oneWindow(drill, aw, reference.windows[i], ws, attempt);
  });
}

/**
 * Convenience: runs the attempt and the reference tuning (runDrill, same seed), scores the attempt
 * and returns its feedback with the score.
 */
export function feedbackFromRuns(drill: Drill, controller: ControllerConfig | ControllerConfigInput | null, actions: readonly StampedAction[] = [], seed?: number) {
  const run = runDrill(drill, controller, actions, seed);
  const ref = runDrill(drill, drill.referenceTuning, [], run.seed);
  const score = scoreAttempt(drill, run.results, ref.results);
  return { score, results: run.results, reference: ref.results, feedback: windowFeedback(drill, run.results, ref.results, score) };
}
