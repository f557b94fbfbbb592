/**
 * Optional nonlinear outer losses: the wall skin loses heat by natural convection with a film
 * coefficient rising as ΔT^(1/4) (laminar free convection, h ∝ (ΔT/L)^(1/4); e.g. Çengel & Ghajar
 * ch. 9, simplified air correlations — coefficient from memory) plus grey-body radiation
 * εσ(T⁴ − T∞⁴) (Stefan–Boltzmann). With these the power curve really bends.
 */
import { ZERO_CELSIUS_K } from "./air";

export const STEFAN_BOLTZMANN_W_PER_M2_K4 = 5.670374419e-8;

export interface NonlinearLossParams {
  convectionCoefficient: number;
  emissivity: number;
  areaM2: number;
}

/** Heat flow from the wall skin at tWallC to surroundings at tAmbC, W. */
export function outerLossW(p: NonlinearLossParams, tWallC: number, tAmbC: number): number {
  const dt = tWallC - tAmbC;
  const conv = p.convectionCoefficient * Math.pow(Math.abs(dt), 0.25) * dt;
  const tw = tWallC + ZERO_CELSIUS_K;
  const ta = tAmbC + ZERO_CELSIUS_K;
  const rad = p.emissivity * STEFAN_BOLTZMANN_W_PER_M2_K4 * (tw * tw * tw * tw - ta * ta * ta * ta);
  return p.areaM2 * (conv + rad);
}
