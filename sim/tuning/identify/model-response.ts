/**
 * Response of a unit-gain FOPDT or SOPDT model to the recorded OUT, at the record's own times.
 * The input is held between samples (zero-order hold: OUT[i] from t[i] to t[i+1]) and the dead
 * time shifts that piecewise-constant history, so the delayed input changes at t[j] + θ; the
 * model is stepped exactly across every piece (closed-form exponentials), so irregular sampling
 * and any dead time are handled without discretisation error. Before t[0] the process is at rest
 * with OUT = OUT[0].
 *
 * Returned: x[i] such that PV[i] ≈ PV0 + K·x[i], with x in % (deviation of OUT from OUT[0]).
 */
import type { StepRecord } from "./step-record";

/** expm1(z)/z, continuous at 0. */
function expm1OverZ(z: number): number {
  return Math.abs(z) < 1e-8 ? 1 + z / 2 : Math.expm1(z) / z;
}

export function unitModelResponse(r: StepRecord, timeConstantsS: readonly number[], deadTimeS: number, out: Float64Array = new Float64Array(r.t.length)): Float64Array {
  const t = r.t;
  const u = r.out;
  const n = t.length;
  const u0 = u[0];
  const tau1 = timeConstantsS[0];
  const tau2 = timeConstantsS.length > 1 ? timeConstantsS[1] : 0;
  const second = tau2 > 0;
  let x1 = 0;
  let x2 = 0;
  // one exact step of length h with constant input v (deviation): see the SOPDT solution
  //   e1(h) = e1 a1,  e2(h) = e2 a2 + e1 · a2 · (h/τ2) · expm1(hδ)/(hδ),  δ = 1/τ2 − 1/τ1
  const advance = (h: number, v: number) => {
    const a1 = Math.exp(-h / tau1);
    const e1 = x1 - v;
    if (second) {
      const a2 = Math.exp(-h / tau2);
      const delta = 1 / tau2 - 1 / tau1;
      const e2 = x2 - v;
      x2 = v + e2 * a2 + e1 * a2 * (h / tau2) * expm1OverZ(h * delta);
    }
    x1 = v + e1 * a1;
  };
  // j: the latest input sample whose delayed change has already happened (−1: the rest state)
  let j = -1;
  while (j + 1 < n && t[j + 1] + deadTimeS <= t[0]) j++;
  out[0] = 0;
  for (let i = 1; i < n; i++) {
    let s = t[i - 1];
    const end = t[i];
    while (s < end) {
      const next = j + 1 < n ? t[j + 1] + deadTimeS : Infinity;
      const e = next < end ? next : end;
      const v = (j < 0 ? u0 : u[j]) - u0;
      if (e > s) advance(e - s, v);
      s = e;
      if (e === next) j++;
    }
    out[i] = second ? x2 : x1;
  }
  return out;
}
