/**
 * Transcendental functions built from + − × ÷ only, so every JavaScript engine gives the same
 * bits. IEEE 754 requires the basic operations (and √) to be correctly rounded, but leaves
 * Math.exp and friends to each engine: Node 20's V8 and a current Chromium's V8 differ in the
 * last bit of Math.exp for about one argument in seven, which is enough to make a browser trace
 * and a server replay drift apart. The engine uses these wherever a result feeds the simulation.
 *
 * exp: Cody–Waite range reduction x = k·ln2 + r with ln2 split into a 32-bit-exact high part and a
 * low part (Cody & Waite, "Software Manual for the Elementary Functions", 1980), |r| ≤ ln2/2, then
 * the Taylor series of e^r to degree 14 by Horner's rule (truncation < 4·10⁻¹⁸ relative), scaled by
 * 2^k assembled from its bits. Accuracy about 1 ulp; deterministic everywhere.
 */

const LN2_HI = 6.93147180369123816490e-1; // high bits of ln 2 (exact product with small k)
const LN2_LO = 1.90821492927058770002e-10; // ln 2 − LN2_HI
const INV_LN2 = 1.44269504088896338700;
const HALF_LN2 = 0.34657359027997264;

// 1/n! for n = 0…14
const INV_FACT = (() => {
  const c: number[] = [1];
  for (let n = 1; n <= 14; n++) c.push(c[n - 1] / n);
  return c;
})();

const scratch = new DataView(new ArrayBuffer(8));

/** 2^k for an integer k in [−1022, 1023], built from its exponent bits (exact). */
function pow2(k: number): number {
  scratch.setUint32(0, (k + 1023) << 20);
  scratch.setUint32(4, 0);
  return scratch.getFloat64(0);
}

/** e^r − 1 for |r| ≤ ln2/2 by its Taylor series (degree 14, Horner), keeping small r accurate. */
function expm1Reduced(r: number): number {
  let p = INV_FACT[14];
  for (let n = 13; n >= 1; n--) p = p * r + INV_FACT[n];
  return p * r;
}

/** Deterministic e^x. */
export function detExp(x: number): number {
  if (x !== x) return NaN;
  if (x > 709.782712893384) return Infinity;
  if (x < -745.1332191019412) return 0;
  if (x > -HALF_LN2 && x < HALF_LN2) return 1 + expm1Reduced(x);
  const k = Math.round(x * INV_LN2);
  const r = x - k * LN2_HI - k * LN2_LO;
  const er = 1 + expm1Reduced(r);
  // keep 2^k normal: split very negative k in two steps (subnormal results)
  if (k < -1021) return er * pow2(k + 600) * pow2(-600);
  if (k > 1023) return er * pow2(k - 1) * 2;
  return er * pow2(k);
}

/** Deterministic e^x − 1, accurate for small |x|. */
export function detExpm1(x: number): number {
  if (x > -HALF_LN2 && x < HALF_LN2) return expm1Reduced(x);
  return detExp(x) - 1;
}

/** Deterministic b^n for an integer n ≥ 0 (binary powering). */
export function detPowInt(b: number, n: number): number {
  let result = 1;
  let base = b;
  let e = Math.floor(n);
  while (e > 0) {
    if (e & 1) result *= base;
    base *= base;
    e >>>= 1;
  }
  return result;
}
