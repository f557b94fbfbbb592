/**
 * The three PID forms, each converted to one internal representation: the standard (ISA ideal)
 * form u = Kc[e + (1/Ti)∫e dt + Td de/dt], with Ti = 0 meaning no integral action.
 *
 * Conversions (Åström & Hägglund, PID Controllers: Theory, Design, and Tuning, 2nd ed., ISA 1995, ch. 3):
 * - series (interacting) Kc(1 + 1/(Ti s))(1 + Td s) → ideal:
 *     Kc' = Kc(1 + Td/Ti),  Ti' = Ti + Td,  Td' = Ti·Td/(Ti + Td).
 *   Without integral action (Ti = 0) the series PD Kc(1 + Td s) is already ideal.
 *   Every ideal controller with real zeros (Ti ≥ 4Td) has a series equivalent; the reverse always exists.
 * - parallel Kp + Ki/s + Kd s → ideal:  Kc = Kp,  Ti = Kp/Ki,  Td = Kd/Kp.
 * The derivative filter Td'/N is applied after conversion, so for the series form it filters the
 * equivalent ideal derivative (a simplification: series controllers often filter inside the PD factor).
 */

export interface IdealPidParams {
  /** Gain, % per °C. */
  kc: number;
  /** Integral time, s; 0 = no integral action. */
  ti: number;
  /** Derivative time, s; 0 = no derivative action. */
  td: number;
}

/** Series (interacting) → ideal (Åström & Hägglund 1995, ch. 3). */
export function seriesToIdeal(kc: number, ti: number, td: number): IdealPidParams {
  if (ti === 0) return { kc, ti: 0, td };
  return { kc: kc * (1 + td / ti), ti: ti + td, td: (ti * td) / (ti + td) };
}

/**
 * Ideal → series, when it exists (Ti ≥ 4Td, real zeros); else null.
 * Inverse of seriesToIdeal: Ti_s, Td_s are the roots of x² − Ti·x + Ti·Td = 0, Kc_s = Kc·Ti_s/Ti.
 */
export function idealToSeries(kc: number, ti: number, td: number): IdealPidParams | null {
  if (ti === 0) return { kc, ti: 0, td };
  const disc = ti * ti - 4 * ti * td;
  if (disc < 0) return null;
  const tiS = (ti + Math.sqrt(disc)) / 2;
  const tdS = ti - tiS;
  return { kc: (kc * tiS) / ti, ti: tiS, td: tdS };
}

/** Parallel (Kp, Ki, Kd) → ideal. Requires Kp > 0 unless Ki = Kd = 0. */
export function parallelToIdeal(kp: number, ki: number, kd: number): IdealPidParams {
  if (kp === 0) return { kc: 0, ti: 0, td: 0 };
  return { kc: kp, ti: ki === 0 ? 0 : kp / ki, td: kd / kp };
}

/** Ideal → parallel gains: Ki = Kc/Ti, Kd = Kc·Td (references §0 conventions). */
export function idealToParallel(kc: number, ti: number, td: number): { kp: number; ki: number; kd: number } {
  return { kp: kc, ki: ti === 0 ? 0 : kc / ti, kd: kc * td };
}

/** The ideal parameters for a configured form. */
export function toIdeal(form: "standard" | "parallel" | "series", p: { kc: number; ti: number; td: number; ki: number; kd: number }): IdealPidParams {
  switch (form) {
    case "standard":
      return { kc: p.kc, ti: p.ti, td: p.td };
    case "series":
      return seriesToIdeal(p.kc, p.ti, p.td);
    case "parallel":
      return parallelToIdeal(p.kc, p.ki, p.kd);
  }
}
