/** One-dimensional root bracketing and maximisation used for crossovers and peaks. */

/** Bisection for f(x) = 0 on [a, b] with a sign change; returns the midpoint of the final bracket. */
export function bisect(f: (x: number) => number, a: number, b: number, iterations = 80): number {
  let fa = f(a);
  for (let i = 0; i < iterations; i++) {
    const m = 0.5 * (a + b);
    const fm = f(m);
    if (fm === 0) return m;
    if ((fm < 0) === (fa < 0)) {
      a = m;
      fa = fm;
    } else b = m;
  }
  return 0.5 * (a + b);
}

const INV_PHI = (Math.sqrt(5) - 1) / 2;

/** Golden-section search for the maximum of a unimodal f on [a, b]. */
export function goldenMax(f: (x: number) => number, a: number, b: number, iterations = 100): { x: number; f: number } {
  let c = b - INV_PHI * (b - a);
  let d = a + INV_PHI * (b - a);
  let fc = f(c);
  let fd = f(d);
  for (let i = 0; i < iterations && Math.abs(b - a) > 1e-14 * (Math.abs(a) + Math.abs(b)); i++) {
    if (fc > fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - INV_PHI * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + INV_PHI * (b - a);
      fd = f(d);
    }
  }
  return fc > fd ? { x: c, f: fc } : { x: d, f: fd };
}

/** Golden-section search for the minimum. */
export function goldenMin(f: (x: number) => number, a: number, b: number, iterations = 100): { x: number; f: number } {
  const r = goldenMax((x) => -f(x), a, b, iterations);
  return { x: r.x, f: -r.f };
}

/**
 * Global-then-local minimisation on [a, b]: a grid of n points (linear, or logarithmic when
 * a > 0 and `log`), then golden-section search between the best point's neighbours. Safer than
 * golden section alone when f may have more than one dip.
 */
export function gridThenGoldenMin(f: (x: number) => number, a: number, b: number, n = 25, log = false): { x: number; f: number } {
  const useLog = log && a > 0 && b > 0;
  const map = (s: number) => (useLog ? Math.exp(s) : s);
  const lo = useLog ? Math.log(a) : a;
  const hi = useLog ? Math.log(b) : b;
  const g = (s: number) => {
    const v = f(map(s));
    return Number.isFinite(v) ? v : Infinity;
  };
  let iBest = 0;
  let fBest = Infinity;
  const s = (i: number) => lo + ((hi - lo) * i) / (n - 1);
  for (let i = 0; i < n; i++) {
    const v = g(s(i));
    if (v < fBest) {
      fBest = v;
      iBest = i;
    }
  }
  const r = goldenMin(g, s(Math.max(0, iBest - 1)), s(Math.min(n - 1, iBest + 1)), 40);
  return r.f <= fBest ? { x: map(r.x), f: r.f } : { x: map(s(iBest)), f: fBest };
}
