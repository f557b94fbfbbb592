/**
 * Pt100 platinum resistance element per IEC 60751 (Callendar–Van Dusen equation, ITS-90
 * coefficients):
 *   R(t) = R0 [1 + A t + B t² + C (t − 100) t³],  C = 0 for t ≥ 0 °C.
 */

export const PT100_R0_OHM = 100;
export const CVD_A = 3.9083e-3; // °C⁻¹
export const CVD_B = -5.775e-7; // °C⁻²
export const CVD_C = -4.183e-12; // °C⁻⁴ (t < 0 °C only)

export type ToleranceClass = "AA" | "A" | "B" | "C";
export type Wiring = "2-wire" | "3-wire" | "4-wire";

/** Element resistance (Ω) at t (°C): Callendar–Van Dusen, IEC 60751. */
export function pt100Resistance(tC: number, r0 = PT100_R0_OHM): number {
  const t2 = tC * tC;
  let f = 1 + CVD_A * tC + CVD_B * t2;
  if (tC < 0) f += CVD_C * (tC - 100) * t2 * tC;
  return r0 * f;
}

/** dR/dt (Ω/°C) at t: derivative of the CVD polynomial. */
export function pt100Sensitivity(tC: number, r0 = PT100_R0_OHM): number {
  let d = CVD_A + 2 * CVD_B * tC;
  if (tC < 0) d += CVD_C * (4 * tC * tC * tC - 300 * tC * tC);
  return r0 * d;
}

/**
 * Temperature (°C) from element resistance (Ω): inverse CVD.
 * For R ≥ R0 (t ≥ 0) the quadratic is solved in closed form, t = (−A + √(A² − 4B(1 − R/R0)))/(2B),
 * written in the cancellation-free form 2(R/R0 − 1)/(A + √…). Below 0 °C the quartic has no
 * convenient closed form, so Newton's method polishes the quadratic estimate (converges to
 * < 1e-10 °C in ≤ 4 steps over −200…0 °C).
 */
export function pt100Temperature(rOhm: number, r0 = PT100_R0_OHM): number {
  const x = rOhm / r0 - 1;
  const disc = CVD_A * CVD_A + 4 * CVD_B * x;
  // Beyond the quadratic's turning point (≈ 3383 °C) there is no real solution; clamp there.
  let t = disc > 0 ? (2 * x) / (CVD_A + Math.sqrt(disc)) : -CVD_A / (2 * CVD_B);
  if (x < 0) {
    for (let k = 0; k < 8; k++) {
      const dt = (pt100Resistance(t, r0) - rOhm) / pt100Sensitivity(t, r0);
      t -= dt;
      if (Math.abs(dt) < 1e-12) break;
    }
  }
  return t;
}

/**
 * IEC 60751 tolerance classes as ± (a0 + a1·|t|) °C: AA 0.1 + 0.0017|t|, A 0.15 + 0.002|t|,
 * B 0.3 + 0.005|t|, C 0.6 + 0.01|t| (class C as recalled, see references §10).
 */
export const TOLERANCE_CLASSES: Readonly<Record<ToleranceClass, { a0C: number; a1PerC: number }>> = {
  AA: { a0C: 0.1, a1PerC: 0.0017 },
  A: { a0C: 0.15, a1PerC: 0.002 },
  B: { a0C: 0.3, a1PerC: 0.005 },
  C: { a0C: 0.6, a1PerC: 0.01 },
};

/** Half-width (± °C) of an IEC 60751 tolerance class at t: a0 + a1·|t|. */
export function toleranceHalfWidthC(cls: ToleranceClass, tC: number): number {
  const c = TOLERANCE_CLASSES[cls];
  return c.a0C + c.a1PerC * Math.abs(tC);
}

/**
 * Temperature error of a particular element within its class: position ∈ [−1, 1] says where in
 * the band it sits (0 = ideal, +1 = reads high by the full class tolerance). Our model of
 * "an element of class X", not a formula of the standard.
 */
export function toleranceOffsetC(cls: ToleranceClass, position: number, tC: number): number {
  return position * toleranceHalfWidthC(cls, tC);
}

/**
 * Resistance the transmitter sees in series with the element, from the connection:
 * - 2-wire: both leads carry the measuring current and are measured with the element: + 2·R_lead.
 * - 3-wire: the transmitter measures the third lead and subtracts it, which cancels the lead
 *   resistance exactly when the two current-carrying leads are equal. The residual assumed here is
 *   their mismatch (R_lead1 − R_lead2), given as `leadMismatchOhm` (0 = ideal cancellation).
 * - 4-wire: sense leads carry no current; no lead effect.
 */
export function leadResistanceSeenOhm(wiring: Wiring, leadResistanceOhm: number, leadMismatchOhm: number): number {
  switch (wiring) {
    case "2-wire":
      return 2 * leadResistanceOhm;
    case "3-wire":
      return leadMismatchOhm;
    case "4-wire":
      return 0;
  }
}
