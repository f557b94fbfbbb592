/**
 * Nelder–Mead simplex minimisation (J. A. Nelder, R. Mead, "A simplex method for function
 * minimization", Computer Journal 7, 1965), with the standard coefficients reflection 1,
 * expansion 2, contraction 1/2, shrink 1/2. Unconstrained: callers map bounded parameters
 * (e.g. work in log τ). Non-finite objective values count as +Infinity.
 */
export interface NelderMeadResult {
  x: number[];
  f: number;
  evaluations: number;
}

export function nelderMead(
  f: (x: number[]) => number,
  start: number[],
  opts: { step?: number | number[]; maxEvaluations?: number; tolerance?: number } = {},
): NelderMeadResult {
  const n = start.length;
  const maxEval = opts.maxEvaluations ?? 200 * n;
  const tol = opts.tolerance ?? 1e-10;
  let evals = 0;
  const fx = (x: number[]) => {
    evals++;
    const v = f(x);
    return Number.isFinite(v) ? v : Infinity;
  };
  const steps = Array.isArray(opts.step) ? opts.step : new Array(n).fill(opts.step ?? 0.1);
  const simplex: { x: number[]; f: number }[] = [{ x: start.slice(), f: fx(start) }];
  for (let i = 0; i < n; i++) {
    const x = start.slice();
    x[i] += steps[i];
    simplex.push({ x, f: fx(x) });
  }
  const combine = (a: number[], b: number[], t: number) => a.map((ai, i) => ai + t * (b[i] - ai));
  while (evals < maxEval) {
    simplex.sort((a, b) => a.f - b.f);
    const best = simplex[0];
    const worst = simplex[n];
    if (Math.abs(worst.f - best.f) <= tol * (Math.abs(best.f) + tol)) {
      let spread = 0;
      for (const s of simplex) for (let i = 0; i < n; i++) spread = Math.max(spread, Math.abs(s.x[i] - best.x[i]));
      if (spread < 1e-9) break;
    }
    const centroid = new Array(n).fill(0);
    for (let k = 0; k < n; k++) for (let i = 0; i < n; i++) centroid[i] += simplex[k].x[i] / n;
    const xr = combine(centroid, worst.x, -1);
    const fr = fx(xr);
    if (fr < best.f) {
      const xe = combine(centroid, worst.x, -2);
      const fe = fx(xe);
      simplex[n] = fe < fr ? { x: xe, f: fe } : { x: xr, f: fr };
    } else if (fr < simplex[n - 1].f) {
      simplex[n] = { x: xr, f: fr };
    } else {
      const outside = fr < worst.f;
      const xc = outside ? combine(centroid, xr, 0.5) : combine(centroid, worst.x, 0.5);
      const fc = fx(xc);
      if (fc < (outside ? fr : worst.f)) simplex[n] = { x: xc, f: fc };
      else
        for (let k = 1; k <= n; k++) {
          const xs = combine(best.x, simplex[k].x, 0.5);
          simplex[k] = { x: xs, f: fx(xs) };
        }
    }
  }
  simplex.sort((a, b) => a.f - b.f);
  return { x: simplex[0].x, f: simplex[0].f, evaluations: evals };
}
