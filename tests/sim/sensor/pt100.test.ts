import { describe, expect, it } from "vitest";
import {
  pt100Resistance,
  pt100Sensitivity,
  pt100Temperature,
  toleranceHalfWidthC,
  toleranceOffsetC,
  leadResistanceSeenOhm,
} from "../../../sim/sensor/pt100";

// IEC 60751 (Callendar–Van Dusen, A = 3.9083e-3, B = −5.775e-7, C = −4.183e-12), table values from
// references.md §10 [CONFIRMED: coefficients; table computed from them].
const IEC_TABLE: [number, number, number][] = [
  // t °C, R Ω, dR/dt Ω/K
  [-50, 80.3063, 0.39713],
  [0, 100.0, 0.39083],
  [50, 119.3971, 0.38505],
  [100, 138.5055, 0.37928],
  [200, 175.856, 0.36773],
];

describe("Pt100 Callendar–Van Dusen (IEC 60751)", () => {
  it.each(IEC_TABLE)("R(%d °C) matches the IEC 60751 table within 1e-3 Ω", (t, r) => {
    expect(Math.abs(pt100Resistance(t) - r)).toBeLessThan(1e-3);
  });

  it.each(IEC_TABLE)("dR/dt at %d °C matches the table within 1e-5 Ω/K", (t, _r, s) => {
    expect(Math.abs(pt100Sensitivity(t) - s)).toBeLessThan(1e-5);
  });

  it("further IEC 60751 points: −200 °C 18.52 Ω, 850 °C 390.48 Ω (standard table; from memory, checked against the CVD formula to 1e-2)", () => {
    expect(pt100Resistance(-200)).toBeCloseTo(18.52, 2);
    expect(pt100Resistance(850)).toBeCloseTo(390.48, 2);
  });

  it("below 0 °C the C term applies: R(−100 °C) = 60.26 Ω (IEC 60751 table value from memory; CVD gives 60.2558)", () => {
    expect(pt100Resistance(-100)).toBeCloseTo(60.2558, 4);
    expect(Math.abs(pt100Resistance(-100) - 60.26)).toBeLessThan(0.005);
    // Without the C term the value would be 60.3395 Ω: the quartic term matters (0.08 Ω ≈ 0.2 °C).
    expect(100 * (1 - 0.39083 - 0.005775) - pt100Resistance(-100)).toBeCloseTo(0.08366, 5);
  });

  it("mean coefficient α = (R100 − R0)/(100 R0) ≈ 0.00385 /°C (IEC 60751; exactly A + 100B = 0.00385055)", () => {
    const alpha = (pt100Resistance(100) - 100) / (100 * 100);
    expect(Math.abs(alpha - 0.00385)).toBeLessThan(1e-6);
    expect(alpha).toBeCloseTo(0.00385055, 10);
  });

  it("inverse CVD round trip over −200…850 °C within 1e-9 °C", () => {
    let worst = 0;
    for (let t = -200; t <= 850; t += 0.37) worst = Math.max(worst, Math.abs(pt100Temperature(pt100Resistance(t)) - t));
    expect(worst).toBeLessThan(1e-9);
    expect(pt100Temperature(100)).toBe(0);
  });

  it("tolerance classes (IEC 60751; class C from memory): half-widths at 100 °C A 0.35, B 0.8, AA 0.27", () => {
    expect(toleranceHalfWidthC("A", 100)).toBeCloseTo(0.35, 12);
    expect(toleranceHalfWidthC("B", 100)).toBeCloseTo(0.8, 12);
    expect(toleranceHalfWidthC("AA", 100)).toBeCloseTo(0.27, 12);
    expect(toleranceHalfWidthC("C", 100)).toBeCloseTo(1.6, 12);
    expect(toleranceHalfWidthC("B", -50)).toBeCloseTo(0.55, 12);
    // The same bands in ohms (references §10: A ±0.133 Ω, B ±0.303 Ω at 100 °C).
    expect(toleranceHalfWidthC("A", 100) * pt100Sensitivity(100)).toBeCloseTo(0.133, 3);
    expect(toleranceHalfWidthC("B", 100) * pt100Sensitivity(100)).toBeCloseTo(0.303, 3);
    expect(toleranceOffsetC("B", -1, 200)).toBeCloseTo(-1.3, 12);
    expect(toleranceOffsetC("A", 0, 200)).toBe(0);
  });

  it("lead resistance seen by the transmitter: 2-wire both leads, 3-wire the mismatch only, 4-wire none", () => {
    expect(leadResistanceSeenOhm("2-wire", 0.5, 0.02)).toBe(1);
    expect(leadResistanceSeenOhm("3-wire", 0.5, 0.02)).toBe(0.02);
    expect(leadResistanceSeenOhm("3-wire", 0.5, 0)).toBe(0);
    expect(leadResistanceSeenOhm("4-wire", 0.5, 0.02)).toBe(0);
  });
});
