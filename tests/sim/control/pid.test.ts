import { describe, expect, it } from "vitest";
import { pidCoefficients, defaultTrackingTime, deadZone } from "../../../sim/control";
import { block, cfg } from "./helpers";

describe("discrete PID coefficients (Åström & Hägglund 1995, ch. 3)", () => {
  it("derivative coefficients for Kc = 2, Td = 1, N = 10, h = 0.1 are ad = 0.5 and bd = 10 (references §13; the discrete form is tagged MEMORY there, the check values are computed)", () => {
    const k = pidCoefficients(cfg({ kc: 2, ti: 10, td: 1, derivativeFilterN: 10, sampleTimeS: 0.1 }));
    expect(k.ad).toBeCloseTo(0.5, 15);
    expect(k.bd).toBeCloseTo(10, 13);
    expect(k.bi).toBeCloseTo((2 * 0.1) / 10, 15);
  });

  it("tracking time defaults to √(Ti·Td) for PID and Ti for PI (Åström & Hägglund, references §13)", () => {
    expect(defaultTrackingTime(100, 4)).toBe(20);
    expect(defaultTrackingTime(100, 0)).toBe(100);
    expect(pidCoefficients(cfg({ ti: 100, td: 4, sampleTimeS: 0.5 })).br).toBeCloseTo(0.5 / 20, 15);
    expect(pidCoefficients(cfg({ ti: 100, td: 4, trackingTimeS: 10, sampleTimeS: 0.5 })).br).toBeCloseTo(0.05, 15);
    expect(pidCoefficients(cfg({ ti: 0 })).br).toBe(0); // no integral: nothing to track
    expect(pidCoefficients(cfg({ ti: 100, antiWindup: "none" })).br).toBe(0);
  });

  it("dead zone is continuous and zero inside the band", () => {
    expect(deadZone(0.3, 0.5)).toBe(0);
    expect(deadZone(-0.5, 0.5)).toBe(0);
    expect(deadZone(2, 0.5)).toBe(1.5);
    expect(deadZone(-2, 0.5)).toBe(-1.5);
    expect(deadZone(-2, 0)).toBe(-2);
  });
});

describe("PID responses (textbook behaviour of u = Kc[e + (1/Ti)∫e + Td de/dt])", () => {
  it("P-only: a setpoint step of 5 °C with Kc = 2 %/°C moves OUT by exactly 10 %", () => {
    const b = block({ kc: 2, ti: 0, td: 0 }, { out: 30, sp: 50, pv: 50 });
    expect(b.update(50, false)).toBeCloseTo(30, 12);
    b.setSetpoint(55);
    expect(b.update(50, false)).toBeCloseTo(40, 12);
    expect(b.update(50, false)).toBeCloseTo(40, 12); // no integral: stays
    expect(b.update(52, false)).toBeCloseTo(36, 12); // PV rises 2 → OUT falls Kc·2 = 4 from 40
  });

  it("integral ramps at Kc·e/Ti per second for a constant error", () => {
    const kc = 2;
    const ti = 10;
    const e = 1.5;
    const b = block({ kc, ti, td: 0, sampleTimeS: 0.1, outMaxPct: 1000, outMinPct: -1000 }, { out: 20, sp: 60 + e, pv: 60 });
    const out0 = b.update(60, false);
    for (let k = 0; k < 99; k++) b.update(60, false);
    const out100 = b.update(60, false); // 100 samples = 10 s later
    expect((out100 - out0) / 10).toBeCloseTo((kc * e) / ti, 10);
  });

  it("derivative on PV gives no kick on a setpoint step; derivative on error kicks by bd·ΔSP", () => {
    const common = { kc: 2, ti: 100, td: 1, derivativeFilterN: 10, sampleTimeS: 0.1 } as const;
    const onPv = block({ ...common, derivativeOn: "pv" }, { out: 40, sp: 50, pv: 50 });
    const onErr = block({ ...common, derivativeOn: "error", setpointWeightC: 1 }, { out: 40, sp: 50, pv: 50 });
    onPv.update(50, false);
    onErr.update(50, false);
    onPv.setSetpoint(51);
    onErr.setSetpoint(51);
    const a = onPv.update(50, false);
    const b = onErr.update(50, false);
    expect(a - 40).toBeCloseTo(2, 10); // P only: Kc·b·ΔSP
    expect(onPv.state.d).toBe(0);
    expect(b - 40).toBeCloseTo(2 + 10, 10); // plus bd·ΔSP = 10 (the A&H check value)
    // The kick decays geometrically with ad = 0.5.
    onErr.update(50, false);
    expect(onErr.state.d).toBeCloseTo(5, 10);
  });

  it("derivative on PV responds to a PV ramp with −Kc·Td·slope in steady state", () => {
    const b = block({ kc: 2, ti: 0, td: 3, sampleTimeS: 0.1, outMinPct: -1000, outMaxPct: 1000 }, { out: 0, sp: 0, pv: 0 });
    let pv = 0;
    for (let k = 0; k < 400; k++) {
      pv += 0.1 * 0.5; // 0.5 °C/s
      b.update(pv, false);
    }
    expect(b.state.d).toBeCloseTo(-2 * 3 * 0.5, 6);
  });

  it("setpoint weight b scales the proportional kick: b = 0.25 gives Kc·0.25·ΔSP", () => {
    const b = block({ kc: 4, ti: 200, setpointWeightB: 0.25 }, { out: 10, sp: 20, pv: 20 });
    b.update(20, false);
    b.setSetpoint(30);
    expect(b.update(20, false) - 10).toBeCloseTo(4 * 0.25 * 10, 10);
  });

  it("direct action: OUT falls when PV is below SP", () => {
    const b = block({ kc: 2, ti: 0, action: "direct" }, { out: 50, sp: 50, pv: 50 });
    b.update(50, false);
    expect(b.update(48, false)).toBeCloseTo(46, 12);
  });
});
