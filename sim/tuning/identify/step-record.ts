/**
 * A bump-test record: time (s), OUT (%) and PV (°C) columns, sampled at any (irregular) times.
 * Results and refusals of identification are plain data, never exceptions.
 */
export interface StepRecord {
  t: readonly number[];
  out: readonly number[];
  pv: readonly number[];
}

export type RefusalCode = "not-arrays" | "length-mismatch" | "too-few-points" | "not-finite" | "time-not-increasing" | "no-step" | "step-at-end" | "pv-flat" | "no-response";

export interface IdentifyRefusal {
  ok: false;
  code: RefusalCode;
  message: string;
}

export function refusal(code: RefusalCode, message: string): IdentifyRefusal {
  return { ok: false, code, message };
}

/** Fewest points accepted: the fits have four free parameters (baseline, gain, τ, θ) and more. */
export const MIN_POINTS = 10;
