/**
 * Standard-normal deviates from uniforms using + − × ÷ only (no log, exp or trigonometry, so the
 * noise path has no transcendental functions whose last bit may differ between JS engines).
 *
 * Method: Irwin–Hall. The sum of n independent U(0,1) has mean n/2 and variance n/12
 * (J. O. Irwin, Biometrika 19, 1927; P. Hall, Biometrika 19, 1927). With n = 12 the variance is
 * exactly 1, so  z = Σ₁¹² Uᵢ − 6  needs no variance correction (the general correction would be
 * the factor √(12/n)). Known limits of this classic generator: z is confined to [−6, 6]
 * (tails beyond 6σ are lost, probability ≈ 2·10⁻⁹ for a true normal) and its excess kurtosis is
 * −6/(5n) = −0.1. Both are immaterial for sensor-noise simulation.
 */

/** Number of uniforms summed; 12 makes the variance exactly n/12 = 1. */
export const IRWIN_HALL_TERMS = 12;

/** Excess kurtosis of the Irwin–Hall(12) deviate: −6/(5n) (the uniform's −6/5, divided by n). */
export const IRWIN_HALL_EXCESS_KURTOSIS = -6 / (5 * IRWIN_HALL_TERMS);

/** Anything that supplies U[0,1) deviates. */
export interface UniformSource {
  uniform(): number;
}

/** z = Σ₁¹² Uᵢ − 6: mean 0, variance 1, support [−6, 6] (Irwin–Hall, n = 12). */
export function irwinHallGaussian(src: UniformSource): number {
  let sum = 0;
  for (let k = 0; k < IRWIN_HALL_TERMS; k++) sum += src.uniform();
  return sum - IRWIN_HALL_TERMS / 2;
}
