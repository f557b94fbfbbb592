/** Underdamped second-order unit step (Ogata, Modern Control Engineering, 5th ed., ch. 5). */
export function secondOrderStep(zeta: number, wn: number, t: number): number {
  const wd = wn * Math.sqrt(1 - zeta * zeta);
  const beta = Math.acos(zeta);
  return 1 - (Math.exp(-zeta * wn * t) / Math.sqrt(1 - zeta * zeta)) * Math.sin(wd * t + beta);
}

export function sampled(n: number, h: number, f: (t: number) => number) {
  const t = new Float64Array(n);
  const y = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    t[k] = k * h;
    y[k] = f(k * h);
  }
  return { t, y };
}

export function constant(n: number, v: number): Float64Array {
  return new Float64Array(n).fill(v);
}
