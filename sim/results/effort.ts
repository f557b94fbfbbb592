/**
 * Control effort and exposure over a window:
 * - output travel Σ|ΔOUT| over consecutive samples (%), a measure of actuator wear and noise
 *   amplification (common practice, e.g. "total variation" of the control signal);
 * - heater energy: ∫P dt with P[k] taken as the mean power over [t_k, t_{k+1}) (rectangle rule,
 *   which is exact when the runner reports per-sample mean power of the time-proportioned heater), kWh;
 * - time with y above a cutout point, with crossing instants interpolated linearly, s.
 */

export function outputTravel(out: ArrayLike<number>, first: number, last: number): number {
  let s = 0;
  for (let k = first + 1; k <= last; k++) s += Math.abs(out[k] - out[k - 1]);
  return s;
}

/** Heater energy in kWh (rectangle rule on intervals [t_k, t_k+1) inside the window). */
export function heaterEnergyKWh(t: ArrayLike<number>, powerW: ArrayLike<number>, first: number, last: number): number {
  let j = 0;
  for (let k = first; k < last; k++) j += powerW[k] * (t[k + 1] - t[k]);
  return j / 3.6e6;
}

/** Total time with y > limit, s (piecewise-linear y between samples). */
export function timeAbove(t: ArrayLike<number>, y: ArrayLike<number>, limit: number, first: number, last: number): number {
  let s = 0;
  for (let k = first; k < last; k++) {
    const a = y[k] - limit;
    const b = y[k + 1] - limit;
    const h = t[k + 1] - t[k];
    if (a > 0 && b > 0) s += h;
    else if (a > 0 || b > 0) s += (h * Math.max(a, b)) / Math.abs(a - b); // the part above, by similar triangles
  }
  return s;
}
