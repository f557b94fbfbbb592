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
  const conv = p.convectionCoefficient * Math.sqrt(Math.sqrt(Math.abs(dt))) * dt; // ΔT^¼ by two correctly rounded square roots
  const tw = tWallC + ZERO_CELSIUS_K;
  const ta = tAmbC + ZERO_CELSIUS_K;
  const rad = p.emissivity * STEFAN_BOLTZMANN_W_PER_M2_K4 * (tw * tw * tw * tw - ta * ta * ta * ta);
  return p.areaM2 * (conv + rad);
}

/**
 * Loss from the inner wall node at tWallC through the insulation (resistance rInsKPerW) and the
 * nonlinear outer film: the massless skin temperature T_s solves (T_w − T_s)/R = Q_out(T_s).
 * Method: safeguarded Newton with the analytic derivative on that monotone scalar equation
 * (bisection fallback inside the bracket between T_amb and T_w).
 */
export function wallLossThroughInsulationW(p: NonlinearLossParams, rInsKPerW: number, tWallC: number, tAmbC: number, guessSkinC?: number): number {
  return skinSolve(p, rInsKPerW, tWallC, tAmbC, guessSkinC).lossW;
}

function skinSolve(p: NonlinearLossParams, rInsKPerW: number, tWallC: number, tAmbC: number, guessSkinC?: number): { lossW: number; skinC: number } {
  let lo = Math.min(tWallC, tAmbC);
  let hi = Math.max(tWallC, tAmbC);
  if (hi - lo < 1e-12) return { lossW: 0, skinC: tAmbC };
  const ta = tAmbC + ZERO_CELSIUS_K;
  const ta4 = ta * ta * ta * ta;
  const es = p.emissivity * STEFAN_BOLTZMANN_W_PER_M2_K4;
  let ts = guessSkinC !== undefined && guessSkinC > lo && guessSkinC < hi ? guessSkinC : tAmbC + (tWallC - tAmbC) * 0.2;
  for (let it = 0; it < 60; it++) {
    // f(T_s) = (T_w − T_s)/R − A[c|ΔT|^¼ΔT + εσ(T_s⁴ − T∞⁴)], f' = −1/R − A[(5/4)c|ΔT|^¼ + 4εσT_s³]
    const dt = ts - tAmbC;
    const q = Math.sqrt(Math.sqrt(Math.abs(dt)));
    const tk = ts + ZERO_CELSIUS_K;
    const tk3 = tk * tk * tk;
    const fv = (tWallC - ts) / rInsKPerW - p.areaM2 * (p.convectionCoefficient * q * dt + es * (tk3 * tk - ta4));
    const df = -1 / rInsKPerW - p.areaM2 * (1.25 * p.convectionCoefficient * q + 4 * es * tk3);
    if (fv > 0) lo = ts;
    else hi = ts;
    let next = ts - fv / df;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    const done = Math.abs(next - ts) < 1e-11 * Math.max(1, Math.abs(ts));
    ts = next;
    if (done) break;
  }
  return { lossW: (tWallC - ts) / rInsKPerW, skinC: ts };
}

/** The wall loss as a function of wall temperature, warm-starting Newton from the last skin
 * temperature (it changes little between calls, so one or two iterations suffice). */
export function wallLossFunction(p: NonlinearLossParams, rInsKPerW: number, tAmbC: number): (tWallC: number) => number {
  let last: number | undefined;
  return (tWallC) => {
    const r = skinSolve(p, rInsKPerW, tWallC, tAmbC, last);
    last = r.skinC;
    return r.lossW;
  };
}
