/**
 * Given the unit-gain model response x, the gain K and baseline PV0 that minimise
 * Σ(PV − PV0 − K·x)² follow by ordinary linear least squares (closed form of the 2×2 normal
 * equations), so the searches only have to handle the time constants and the dead time.
 */
export interface GainFit {
  gain: number;
  baseline: number;
  sse: number;
}

export function fitGainAndBaseline(y: readonly number[], x: ArrayLike<number>): GainFit {
  const n = y.length;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    sx += x[i];
    sy += y[i];
  }
  const xm = sx / n;
  const ym = sy / n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - xm;
    sxx += dx * dx;
    sxy += dx * (y[i] - ym);
  }
  const gain = sxx > 0 ? sxy / sxx : 0;
  const baseline = ym - gain * xm;
  let sse = 0;
  for (let i = 0; i < n; i++) sse += (y[i] - baseline - gain * x[i]) ** 2;
  return { gain, baseline, sse };
}
