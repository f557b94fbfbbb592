/**
 * Eigen-decomposition of a real symmetric matrix, S = Q·diag(d)·Qᵀ.
 * Method: cyclic Jacobi rotations (Golub & Van Loan, Matrix Computations, 4th ed., §8.5,
 * Algorithm 8.5.3 with the stable rotation of §8.5.2; numbers from memory). Slow for large n but unconditionally
 * convergent and accurate for the 4–6-node networks here; eigenvectors are orthonormal even for
 * repeated eigenvalues, which the modal stepper relies on.
 */
export interface SymmetricEigen {
  /** eigenvalues, ascending */
  values: Float64Array;
  /** column-major-by-mode: vectors[i*n + k] is component i of eigenvector k */
  vectors: Float64Array;
  n: number;
}

/** `s` is row-major n×n and symmetric; it is not modified. */
export function symmetricEigen(s: ArrayLike<number>, n: number): SymmetricEigen {
  const a = Float64Array.from(s as ArrayLike<number>);
  const v = new Float64Array(n * n);
  for (let i = 0; i < n; i++) v[i * n + i] = 1;
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0;
    let diag = 0;
    for (let p = 0; p < n; p++) {
      diag += a[p * n + p] * a[p * n + p];
      for (let q = p + 1; q < n; q++) off += a[p * n + q] * a[p * n + q];
    }
    if (off <= 1e-30 * diag || off === 0) break;
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = a[p * n + q];
        if (apq === 0) continue;
        // Stable rotation (G&VL §8.5.2): t = sign(τ)/(|τ| + √(1+τ²)), τ = (a_qq − a_pp)/(2 a_pq)
        const tau = (a[q * n + q] - a[p * n + p]) / (2 * apq);
        const t = (tau >= 0 ? 1 : -1) / (Math.abs(tau) + Math.sqrt(1 + tau * tau));
        const c = 1 / Math.sqrt(1 + t * t);
        const sn = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k * n + p];
          const akq = a[k * n + q];
          a[k * n + p] = c * akp - sn * akq;
          a[k * n + q] = sn * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p * n + k];
          const aqk = a[q * n + k];
          a[p * n + k] = c * apk - sn * aqk;
          a[q * n + k] = sn * apk + c * aqk;
        }
        for (let k = 0; k < n; k++) {
          const vkp = v[k * n + p];
          const vkq = v[k * n + q];
          v[k * n + p] = c * vkp - sn * vkq;
          v[k * n + q] = sn * vkp + c * vkq;
        }
      }
    }
  }
  // sort ascending
  const order = Array.from({ length: n }, (_, i) => i).sort((i, j) => a[i * n + i] - a[j * n + j]);
  const values = new Float64Array(n);
  const vectors = new Float64Array(n * n);
  order.forEach((src, k) => {
    values[k] = a[src * n + src];
    for (let i = 0; i < n; i++) vectors[i * n + k] = v[i * n + src];
  });
  return { values, vectors, n };
}
