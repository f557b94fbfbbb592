/**
 * Recommended controller sample time and PV filter time constant from a process model and the
 * measured PV noise. These are rules of thumb (COMMON PRACTICE, no single published source):
 * - sample time h ≤ θ/5, so the ≈ h/2 delay that sampling adds stays within 10 % of the dead time,
 *   and h ≤ τ/10 (ten or more samples per time constant); rounded down to a 1-2-5 value.
 * - PV filter: a first-order filter on white noise sampled every h reduces its standard deviation
 *   by √(α/(2 − α)), α = 1 − e^{−h/τf} (≈ √(h/(2τf)) for τf ≫ h): the τf that brings σ to the
 *   target. It is capped at θ/4, because the filter's lag adds to the loop's dead time, and at a
 *   quarter of the sensor lag when that is known (a filter of about a quarter of the sensor's
 *   response time removes fast noise without noticeable lag: references §16, common practice).
 */
import type { ProcessModel } from "../models";

export interface SampleTimeAndFilterInput {
  model: ProcessModel;
  /** standard deviation of the raw PV noise, °C */
  noiseSigmaC: number;
  /** noise you will accept on the PV the controller sees, °C; default 0.05 */
  targetSigmaC?: number;
  /** sensor element time constant, s, if known */
  sensorLagS?: number;
  /** a sample time already fixed by the hardware, s */
  sampleTimeS?: number;
}

export interface SampleTimeAndFilter {
  sampleTimeS: number;
  pvFilterTauS: number;
  /** expected noise σ after the filter, °C */
  filteredSigmaC: number;
  notes: string[];
}

function roundDown125(x: number): number {
  const e = Math.floor(Math.log10(x));
  const m = x / 10 ** e;
  const f = m >= 5 ? 5 : m >= 2 ? 2 : 1;
  return f * 10 ** e;
}

/** σ reduction factor of a first-order filter (ZOH-exact, α = 1 − e^{−h/τ}) on white noise. */
export function filterNoiseFactor(tauS: number, sampleTimeS: number): number {
  if (tauS <= 0) return 1;
  const a = 1 - Math.exp(-sampleTimeS / tauS);
  return Math.sqrt(a / (2 - a));
}

export function recommendSampleTimeAndFilter(inp: SampleTimeAndFilterInput): SampleTimeAndFilter {
  const m = inp.model;
  const tau = m.kind === "fopdt" ? m.timeConstantS : m.timeConstant1S;
  const theta = m.deadTimeS + (m.kind === "sopdt" ? m.timeConstant2S : 0); // SOPDT: the second lag acts like extra delay
  const notes: string[] = [];
  let h: number;
  if (inp.sampleTimeS !== undefined && inp.sampleTimeS > 0) {
    h = inp.sampleTimeS;
    if (theta > 0 && h > theta / 5) notes.push(`the fixed sample time ${h} s exceeds θ/5 = ${+(theta / 5).toPrecision(3)} s: sampling adds noticeable delay`);
  } else {
    const limit = Math.min(theta > 0 ? theta / 5 : Infinity, tau / 10);
    h = Number.isFinite(limit) && limit > 0 ? roundDown125(limit) : 1;
    notes.push(`sample time ≤ θ/5 and ≤ τ/10 (common practice): ${h} s`);
  }
  const target = inp.targetSigmaC ?? 0.05;
  const sigma = Math.max(0, inp.noiseSigmaC);
  let tf = 0;
  if (sigma > target) {
    // invert σ_f = σ √(α/(2 − α)) for α, then α = 1 − e^{−h/τf}
    const r2 = (target / sigma) ** 2;
    const alpha = (2 * r2) / (1 + r2);
    tf = -h / Math.log(1 - alpha);
    const caps: { v: number; why: string }[] = [];
    if (theta > 0) caps.push({ v: theta / 4, why: "θ/4 (the filter's lag adds to the dead time)" });
    if (inp.sensorLagS !== undefined && inp.sensorLagS > 0) caps.push({ v: inp.sensorLagS / 4, why: "a quarter of the sensor lag (common practice)" });
    for (const c of caps)
      if (tf > c.v) {
        tf = c.v;
        notes.push(`PV filter capped at ${c.why}`);
      }
    notes.push(`PV filter ${+tf.toPrecision(3)} s brings the noise from ${+sigma.toPrecision(3)} °C towards the ${target} °C target`);
  } else {
    notes.push(`noise ${+sigma.toPrecision(3)} °C is within the ${target} °C target: no PV filter needed`);
  }
  tf = tf > 0 ? +tf.toPrecision(2) : 0;
  return { sampleTimeS: h, pvFilterTauS: tf, filteredSigmaC: sigma * filterNoiseFactor(tf, h), notes };
}
