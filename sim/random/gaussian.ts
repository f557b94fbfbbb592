/**
 * Standard-normal deviates from uniform integers using + − × ÷ only (no log, exp or
 * trigonometry, so the noise path has no transcendental function whose last bit may differ
 * between JavaScript engines).
 *
 * Method: Irwin–Hall. The sum of n independent U(0,1) has mean n/2 and variance n/12
 * (J. O. Irwin, Biometrika 19, 1927; P. Hall, Biometrika 19, 1927; citations from memory). With n = 12 the variance is
 * exactly 1, so  z = Σ₁¹² Uᵢ − 6  needs no variance correction (for other n the correction
 * would be the factor √(12/n)).
 *
 * To halve the generator calls, each 32-bit draw supplies two 16-bit uniforms (its high and low
 * halves), so one deviate costs 6 draws. A 16-bit uniform kᵢ/2¹⁶, kᵢ ∈ {0…65535}, has mean
 * ½ − 2⁻¹⁷ and variance (1 − 2⁻³²)/12. The mean offset is corrected exactly:
 *   z = (Σ₁¹² kᵢ + 6) / 2¹⁶ − 6,
 * and the variance is 1 − 2⁻³² (a relative error of 2·10⁻¹⁰, left uncorrected). All sums are
 * integers below 2⁵³, so z is computed exactly.
 *
 * Known limits of this classic generator: z is confined to [−6, 6] (a true normal exceeds 6σ
 * with probability ≈ 2·10⁻⁹), its excess kurtosis is −6/(5n) = −0.1, and its resolution is 2⁻¹⁶.
 * All are immaterial for sensor noise.
 */

/** Number of uniforms summed; 12 makes the variance n/12 = 1. */
export const IRWIN_HALL_TERMS = 12;

/** Excess kurtosis of the Irwin–Hall(12) deviate: −6/(5n) (the uniform's −6/5, divided by n). */
export const IRWIN_HALL_EXCESS_KURTOSIS = -6 / (5 * IRWIN_HALL_TERMS);

/** Anything that supplies uniformly distributed unsigned 32-bit integers. */
export interface Uint32Source {
  nextUint32(): number;
}

// Module-local constants (not imported bindings) so the loop stays fast when compiled to CommonJS.
const DRAWS = 6; // 12 sixteen-bit halves
const INV_2_POW_16 = 1 / 65536;

/** z = (Σ₁¹² kᵢ + 6)/2¹⁶ − 6 from six 32-bit draws split into 16-bit halves: mean 0, sd 1 (Irwin–Hall, n = 12). */
export function irwinHallGaussian(src: Uint32Source): number {
  let sum = 6;
  for (let k = 0; k < DRAWS; k++) {
    const x = src.nextUint32();
    sum += (x >>> 16) + (x & 0xffff);
  }
  return sum * INV_2_POW_16 - 6;
}
