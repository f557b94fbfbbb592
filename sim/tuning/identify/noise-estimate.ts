/**
 * Model-free estimate of the PV noise standard deviation from second differences:
 * for white noise e, e[i+1] − 2e[i] + e[i−1] has variance 6σ², and the smooth process contributes
 * little when it is sampled densely. A median absolute deviation (× 1.4826 for a Gaussian) keeps
 * steps and spikes from inflating it (robust statistics; standard, e.g. Hampel 1974, from memory).
 */
export function median(xs: readonly number[]): number {
  if (!xs.length) return NaN;
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : 0.5 * (s[m - 1] + s[m]);
}

export function noiseSigmaFromSecondDifferences(y: readonly number[]): number {
  if (y.length < 3) return 0;
  const d: number[] = [];
  for (let i = 1; i + 1 < y.length; i++) d.push(y[i + 1] - 2 * y[i] + y[i - 1]);
  const m = median(d);
  const mad = median(d.map((v) => Math.abs(v - m)));
  return (1.4826 * mad) / Math.sqrt(6);
}

/** Residual standard deviation about a straight-line fit (for a quiet window or a pre-step baseline). */
export function detrendedSigma(t: readonly number[], y: readonly number[]): { sigma: number; slope: number; slopeStdError: number; mean: number } {
  const n = y.length;
  if (n < 2) return { sigma: 0, slope: 0, slopeStdError: Infinity, mean: n ? y[0] : 0 };
  let st = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    st += t[i];
    sy += y[i];
  }
  const tm = st / n;
  const ym = sy / n;
  let stt = 0;
  let sty = 0;
  for (let i = 0; i < n; i++) {
    stt += (t[i] - tm) ** 2;
    sty += (t[i] - tm) * (y[i] - ym);
  }
  const slope = stt > 0 ? sty / stt : 0;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (y[i] - ym - slope * (t[i] - tm)) ** 2;
  const sigma = Math.sqrt(ss / Math.max(1, n - 2));
  // standard error of a least-squares slope: σ/√Σ(t − t̄)²
  return { sigma, slope, slopeStdError: stt > 0 && n > 2 ? sigma / Math.sqrt(stt) : Infinity, mean: ym };
}
