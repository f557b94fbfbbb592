/**
 * Error integrals over a window, e = SP − y, time measured from the window start t0:
 *   IAE = ∫|e| dt,  ISE = ∫e² dt,  ITAE = ∫(t − t0)|e| dt.
 * Trapezoid rule on the samples (the integrand's sample values, so a sign change inside an
 * interval is smoothed; the error is O(h²) per unit time for smooth signals).
 */
export interface ErrorIntegrals {
  /** °C·s */
  iae: number;
  /** °C²·s */
  ise: number;
  /** °C·s² */
  itae: number;
}

export function errorIntegrals(
  t: ArrayLike<number>,
  y: ArrayLike<number>,
  sp: ArrayLike<number>,
  first: number,
  last: number,
  windowStartS: number,
): ErrorIntegrals {
  let iae = 0;
  let ise = 0;
  let itae = 0;
  if (last <= first) return { iae, ise, itae };
  let ePrev = Math.abs(sp[first] - y[first]);
  let tPrev = t[first];
  for (let k = first + 1; k <= last; k++) {
    const e = Math.abs(sp[k] - y[k]);
    const tk = t[k];
    const h = tk - tPrev;
    iae += 0.5 * h * (ePrev + e);
    ise += 0.5 * h * (ePrev * ePrev + e * e);
    itae += 0.5 * h * ((tPrev - windowStartS) * ePrev + (tk - windowStartS) * e);
    ePrev = e;
    tPrev = tk;
  }
  return { iae, ise, itae };
}
