/**
 * 4–20 mA temperature transmitter with NAMUR NE 43 signal levels:
 * - measurement information 3.8…20.5 mA (4–20 mA nominal with linear under/over-range), so an
 *   out-of-range temperature clips at 3.8 or 20.5 mA;
 * - a failed element (open, shorted, broken lead) drives the failure current: ≤ 3.6 mA downscale
 *   or ≥ 21 mA upscale.
 */
import { pt100Temperature } from "./pt100";

export const NE43_MEASUREMENT_MIN_MA = 3.8;
export const NE43_MEASUREMENT_MAX_MA = 20.5;
export const NE43_FAILURE_LOW_MAX_MA = 3.6;
export const NE43_FAILURE_HIGH_MIN_MA = 21.0;

/**
 * Sensor diagnostics thresholds: a resistance below 10 Ω (a short; the element itself is
 * 18.5 Ω at −200 °C) or above 500 Ω (an open circuit; 390.5 Ω at 850 °C) cannot come from a
 * healthy Pt100. Common practice for RTD transmitters' burnout detection; the exact values are ours.
 */
export const SHORT_CIRCUIT_BELOW_OHM = 10;
export const OPEN_CIRCUIT_ABOVE_OHM = 500;

export interface TransmitterParams {
  rangeLowC: number;
  rangeHighC: number;
  failureDirection: "downscale" | "upscale";
  failureLowMa: number;
  failureHighMa: number;
}

/** Linear 4–20 mA scaling of a temperature over the range, clipped at the NE 43 measurement limits. */
export function temperatureToLoopCurrentMa(tC: number, rangeLowC: number, rangeHighC: number): number {
  return clipToMeasurementRange(4 + (16 * (tC - rangeLowC)) / (rangeHighC - rangeLowC));
}

/** Clip a loop current to the NE 43 measurement range 3.8…20.5 mA. */
export function clipToMeasurementRange(mA: number): number {
  return mA < 3.8 ? 3.8 : mA > 20.5 ? 20.5 : mA; // = NE43_MEASUREMENT_MIN_MA / _MAX_MA (literal for the hot path)
}

/** The configured failure current. */
export function failureCurrentMa(p: TransmitterParams): number {
  return p.failureDirection === "downscale" ? p.failureLowMa : p.failureHighMa;
}

/** True when the diagnostics would call this measured resistance a failed element. */
export function isElementFailed(rMeasuredOhm: number): boolean {
  return !(rMeasuredOhm >= SHORT_CIRCUIT_BELOW_OHM && rMeasuredOhm <= OPEN_CIRCUIT_ABOVE_OHM);
}

/**
 * Loop current for the resistance at the terminals. The transmitter linearises with the ideal
 * IEC 60751 curve (R0 = 100 Ω, no element offset) and knows nothing about lead resistance beyond
 * what its wiring cancels, so any remaining lead resistance reads as extra temperature.
 */
export function transmitterOutputMa(rMeasuredOhm: number, p: TransmitterParams): number {
  if (isElementFailed(rMeasuredOhm)) return failureCurrentMa(p);
  return temperatureToLoopCurrentMa(pt100Temperature(rMeasuredOhm), p.rangeLowC, p.rangeHighC);
}

/** Loop current → temperature over the range (the inverse linear scaling, no clipping). */
export function loopCurrentToTemperatureC(mA: number, rangeLowC: number, rangeHighC: number): number {
  return rangeLowC + ((mA - 4) / 16) * (rangeHighC - rangeLowC);
}

/** Percent of span for a loop current: (I − 4)/16 · 100 (NE 43 reading of the levels). */
export function loopCurrentToPercentOfSpan(mA: number): number {
  return ((mA - 4) / 16) * 100;
}
