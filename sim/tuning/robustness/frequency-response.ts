/**
 * L(jω) = C(jω)·G(jω)·(lags)·e^{−jω(θ + added delay)}, as magnitude and phase.
 * The phase is summed factor by factor: each lag contributes −atan(ωτ), the delay −ωθ, an
 * integrator −π/2 and the controller its own phase, which lies in (−π/2, π/2) because Re C > 0
 * for Kc > 0. Every term is continuous in ω, so the total is already unwrapped: no ±2π ambiguity
 * from atan2 can creep in however many times the delay turns the phase.
 */
import { addedDelayS, type Loop, type LoopController } from "./loop";

export interface Complex {
  re: number;
  im: number;
}

export interface LoopPoint {
  omega: number;
  /** |L(jω)| */
  mag: number;
  /** arg L(jω), rad, continuous (unwrapped) */
  phase: number;
}

/** C(jω) as a complex number (standard form with derivative filter). */
export function controllerResponse(c: LoopController, w: number): Complex {
  let re = 1;
  let im = 0;
  if (c.tiS > 0) im -= 1 / (w * c.tiS);
  if (c.tdS > 0) {
    const a = w * c.tdS; // jωTd / (1 + jωTd/N)
    const n = c.derivativeFilterN;
    if (Number.isFinite(n)) {
      const b = a / n;
      const den = 1 + b * b;
      re += (a * b) / den;
      im += a / den;
    } else {
      im += a;
    }
  }
  return { re: c.kc * re, im: c.kc * im };
}

export function loopResponse(loop: Loop, w: number): LoopPoint {
  const p = loop.plant;
  const l = loop.lags ?? {};
  let mag = p.gainCPerPercent;
  let phase = -w * (p.deadTimeS + addedDelayS(l));
  const lag = (tau: number | undefined) => {
    if (!tau || tau <= 0) return;
    mag /= Math.hypot(1, w * tau);
    phase -= Math.atan(w * tau);
  };
  for (const tau of p.timeConstantsS) lag(tau);
  lag(l.pvFilterTauS);
  lag(l.sensorLagS);
  if (p.integrating) {
    mag /= w;
    phase -= Math.PI / 2;
  }
  const c = controllerResponse(loop.controller, w);
  mag *= Math.hypot(c.re, c.im);
  phase += Math.atan2(c.im, c.re);
  return { omega: w, mag, phase };
}

export function toComplex(pt: LoopPoint): Complex {
  return { re: pt.mag * Math.cos(pt.phase), im: pt.mag * Math.sin(pt.phase) };
}

/** |S| = 1/|1 + L| and |T| = |L|/|1 + L| at one frequency. */
export function sensitivities(pt: LoopPoint): { s: number; t: number } {
  const z = toComplex(pt);
  const d = Math.hypot(1 + z.re, z.im);
  return { s: 1 / d, t: pt.mag / d };
}
