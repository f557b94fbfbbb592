/**
 * Fit quality: R² = 1 − SSE/SST (SST about the PV mean) and NRMSE = RMSE / (PV range), the
 * normalisation stated so the figure is comparable across records.
 */
export interface FitQuality {
  sse: number;
  rmse: number;
  r2: number;
  /** RMSE divided by (max PV − min PV) */
  nrmse: number;
}

export function fitQuality(y: readonly number[], yHat: ArrayLike<number>): FitQuality {
  const n = y.length;
  let mean = 0;
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of y) {
    mean += v / n;
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  let sse = 0;
  let sst = 0;
  for (let i = 0; i < n; i++) {
    sse += (y[i] - yHat[i]) ** 2;
    sst += (y[i] - mean) ** 2;
  }
  const rmse = Math.sqrt(sse / n);
  return { sse, rmse, r2: sst > 0 ? 1 - sse / sst : 0, nrmse: hi > lo ? rmse / (hi - lo) : 0 };
}
