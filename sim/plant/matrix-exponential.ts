/**
 * Matrix exponential e^{A}.
 * Method: scaling and squaring with the diagonal (q,q) Padé approximant, q = 6
 * (Golub & Van Loan, Matrix Computations, 4th ed., Algorithm 9.3.1; Moler & Van Loan,
 * "Nineteen dubious ways to compute the exponential of a matrix, twenty-five years later",
 * SIAM Review 45(1), 2003; algorithm and theorem numbers from memory). A is scaled by 2^-s so
 * that ‖A/2^s‖∞ ≤ 1/2; the (p,q) = (6,6) approximant then has a backward error below
 * 2^{3−(p+q)} p! q! / ((p+q)! (p+q+1)!) ≈ 3.4e-16 (Moler & Van Loan's bound); then it is squared
 * s times. Row-major n×n arrays.
 */

export function matMul(a: Float64Array, b: Float64Array, n: number, out = new Float64Array(n * n)): Float64Array {
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += a[i * n + k] * b[k * n + j];
      out[i * n + j] = s;
    }
  }
  return out;
}

/** Solves A·X = B (n×n, row-major) by Gaussian elimination with partial pivoting (G&VL Alg. 3.4.1). */
export function solveLinear(aIn: Float64Array, bIn: Float64Array, n: number, m: number): Float64Array {
  const a = Float64Array.from(aIn);
  const b = Float64Array.from(bIn); // n×m
  for (let k = 0; k < n; k++) {
    let piv = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(a[i * n + k]) > Math.abs(a[piv * n + k])) piv = i;
    if (a[piv * n + k] === 0) throw new Error("solveLinear: singular matrix");
    if (piv !== k) {
      for (let j = 0; j < n; j++) [a[k * n + j], a[piv * n + j]] = [a[piv * n + j], a[k * n + j]];
      for (let j = 0; j < m; j++) [b[k * m + j], b[piv * m + j]] = [b[piv * m + j], b[k * m + j]];
    }
    for (let i = k + 1; i < n; i++) {
      const f = a[i * n + k] / a[k * n + k];
      if (f === 0) continue;
      for (let j = k; j < n; j++) a[i * n + j] -= f * a[k * n + j];
      for (let j = 0; j < m; j++) b[i * m + j] -= f * b[k * m + j];
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    for (let j = 0; j < m; j++) {
      let s = b[i * m + j];
      for (let k = i + 1; k < n; k++) s -= a[i * n + k] * b[k * m + j];
      b[i * m + j] = s / a[i * n + i];
    }
  }
  return b;
}

/** e^{A·h} for row-major n×n A. */
export function matrixExponential(a: ArrayLike<number>, n: number, h = 1): Float64Array {
  const q = 6;
  let norm = 0;
  for (let i = 0; i < n; i++) {
    let row = 0;
    for (let j = 0; j < n; j++) row += Math.abs(a[i * n + j] * h);
    norm = Math.max(norm, row);
  }
  // s = max(1, ⌈log2(norm)⌉ + 1) found by halving (exact), so every engine picks the same s
  let s = 1;
  let scale = h / 2;
  for (let m = norm; m > 1; m /= 2) {
    s++;
    scale /= 2;
  }
  const as = new Float64Array(n * n);
  for (let i = 0; i < n * n; i++) as[i] = a[i] * scale;
  const ident = new Float64Array(n * n);
  for (let i = 0; i < n; i++) ident[i * n + i] = 1;
  let x: Float64Array = Float64Array.from(ident);
  const nn = Float64Array.from(ident);
  const dd = Float64Array.from(ident);
  let c = 1;
  let sign = 1;
  for (let k = 1; k <= q; k++) {
    c = (c * (q - k + 1)) / (k * (2 * q - k + 1));
    x = matMul(as, x, n);
    sign = -sign;
    for (let i = 0; i < n * n; i++) {
      nn[i] += c * x[i];
      dd[i] += sign * c * x[i];
    }
  }
  let f: Float64Array = solveLinear(dd, nn, n, n);
  for (let k = 0; k < s; k++) f = matMul(f, f, n);
  return f;
}
