/**
 * The measures standings rank on, taken from an attempt's official (replayed) results and score.
 * Method: plain extraction and worst-case aggregation over the scoring windows (longest settling
 * or recovery time, largest overshoot), no new measure is computed here.
 */
import type { RunResults } from "./results";
import type { AttemptScore } from "./score";

/** The measures standings rank on, from the official (replayed) results. */
export interface AttemptSummary {
  /** 0–100, higher is better, after the late rule */
  score: number;
  /** the engine's score before any late penalty */
  rawScore: number;
  /** longest settling time over the setpoint windows, s (null: a window never settled, or none) */
  settlingTimeS: number | null;
  /** largest overshoot over the setpoint windows, °C */
  overshootC: number | null;
  /** IAE of the whole run on the true temperature, °C·s */
  iae: number;
  /** longest recovery time over the disturbance windows, s (null: never recovered, or none) */
  recoveryTimeS: number | null;
  energyKWh: number;
  safetyTrips: number;
}

/** Rounded to 0.1 (the score's own rounding, score.ts). */
function round1(x: number): number {
  return Math.round(x * 10) / 10;
}

/** Longest of the values; null when there are none or any is null ("never" beats every time). */
function longestOrNull(values: (number | null)[]): number | null {
  if (values.length === 0 || values.some((v) => v === null)) return null;
  return Math.max(...(values as number[]));
}

/**
 * Summary of one attempt: score × late factor (rounded to 0.1), the raw score, worst settling
 * time / overshoot over setpoint windows and worst recovery over disturbance windows (true
 * temperature), whole-run IAE, heater energy and the number of cutout trips.
 */
export function attemptSummary(results: RunResults, score: AttemptScore, latePenaltyFactor = 1): AttemptSummary {
  const sp = results.windows.filter((w) => w.kind === "setpoint").map((w) => w.trueTemperature);
  const dist = results.windows.filter((w) => w.kind === "disturbance").map((w) => w.trueTemperature);
  const overshoots = sp.map((w) => w.overshootC).filter((v): v is number => v !== null);
  return {
    score: round1(score.score * latePenaltyFactor),
    rawScore: score.score,
    settlingTimeS: longestOrNull(sp.map((w) => w.settlingTimeS)),
    overshootC: overshoots.length ? Math.max(...overshoots) : null,
    iae: results.wholeRun.trueTemperature.iae,
    recoveryTimeS: longestOrNull(dist.map((w) => w.recoveryTimeS)),
    energyKWh: results.heaterEnergyKWh,
    safetyTrips: results.safetyTrips.length,
  };
}
