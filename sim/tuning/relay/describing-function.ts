/**
 * Describing-function relations of a relay (Åström & Hägglund 1984; Bequette 2003 §11.3,
 * Eqs. 11.3–11.5; references §1). The relay gives ±d around its bias, switches when the error
 * passes ±ε (hysteresis band of total width 2ε) and the PV oscillates with amplitude a:
 *   ideal relay:            N(a) = 4d/(πa),                Ku ≈ 4d/(πa)
 *   relay with hysteresis:  N(a) = (4d/(πa))[√(1 − (ε/a)²) − j ε/a]   (a ≥ ε)
 * Two conventions are in use for Ku with hysteresis. Loopwright uses
 *   Ku = 4d/(π√(a² − ε²)),
 * the reciprocal of the real-axis projection of −1/N(a) = −(π/(4d))(√(a² − ε²) + jε); it reduces
 * to 4d/(πa) when ε = 0. The plain 4d/(πa) is reported beside it.
 */
export interface ComplexNumber {
  re: number;
  im: number;
}

/** Ku ≈ 4d/(πa) for an ideal relay. */
export function idealRelayUltimateGain(d: number, a: number): number {
  return (4 * d) / (Math.PI * a);
}

/** Ku = 4d/(π√(a² − ε²)) (Loopwright's convention); falls back to 4d/(πa) when a ≤ ε. */
export function hysteresisRelayUltimateGain(d: number, a: number, eps: number): number {
  if (!(a > eps) || eps <= 0) return idealRelayUltimateGain(d, a);
  return (4 * d) / (Math.PI * Math.sqrt(a * a - eps * eps));
}

/** N(a) of a relay with hysteresis (references §1; python-control's relay_hysteresis_nonlinearity). */
export function relayDescribingFunction(d: number, a: number, eps: number): ComplexNumber {
  const k = (4 * d) / (Math.PI * a);
  const r = eps / a;
  return { re: k * Math.sqrt(Math.max(0, 1 - r * r)), im: -k * r };
}

/** −1/N(a): where the oscillation sits on the Nyquist plot. */
export function negativeInverseDescribingFunction(d: number, a: number, eps: number): ComplexNumber {
  const n = relayDescribingFunction(d, a, eps);
  const m = n.re * n.re + n.im * n.im;
  return { re: -n.re / m, im: n.im / m };
}
