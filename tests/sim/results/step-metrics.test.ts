import { describe, expect, it } from "vitest";
import { stepMetrics, bandHalfWidthC } from "../../../sim/results";
import { secondOrderStep, sampled } from "./analytic";

// Check values: references §9 (Ogata formulas; 10–90 % rise and 2 % settling simulated with scipy).
const OGATA: [number, number, number, number][] = [
  // ζ, Mp %, tr 10–90 % (sim), ts 2 % (sim), all with ωn = 1
  [0.3, 37.2326, 1.3213, 11.23],
  [0.5, 16.3034, 1.6376, 8.076],
  [0.7, 4.5988, 2.1262, 5.979],
];

describe("step metrics on an analytic underdamped second-order response (Ogata ch. 5, ωn = 1)", () => {
  it.each(OGATA)("ζ = %f: Mp, 10–90 %% rise time and 2 %% settling time", (zeta, mp, tr, ts) => {
    const h = 0.001;
    const { t, y } = sampled(40_001, h, (tt) => secondOrderStep(zeta, 1, tt));
    const m = stepMetrics(t, y, 0, t.length - 1, 0, 1, 1, 0, 0);
    expect(Math.abs(m.overshootPct - mp)).toBeLessThan(1e-3); // peak sampled at 1 ms: error ~ (ωd h)²
    expect(m.overshootC).toBeCloseTo(mp / 100, 5);
    expect(Math.abs(m.riseTimeS! - tr)).toBeLessThan(1e-3);
    // Settling: scipy's figure was read on its own (coarser) grid; 0.01 s tolerance.
    expect(Math.abs(m.settlingTimeS! - ts)).toBeLessThan(0.01);
    expect(m.peakTimeS!).toBeCloseTo(Math.PI / Math.sqrt(1 - zeta * zeta), 2); // tp = π/ωd
    expect(m.bandC).toBeCloseTo(0.02, 15);
  });

  it("settling time is the last exit from the band, not the first entry", () => {
    // ζ = 0.5 enters the 2 % band first near t ≈ 2.2 s, leaves again with the overshoot.
    const { t, y } = sampled(20_001, 0.001, (tt) => secondOrderStep(0.5, 1, tt));
    const m = stepMetrics(t, y, 0, t.length - 1, 0, 1, 1, 0, 0);
    expect(m.settlingTimeS!).toBeGreaterThan(8);
  });

  it("scales with step size and sign: a −20 °C step from 80 °C to 60 °C", () => {
    const { t, y } = sampled(30_001, 0.001, (tt) => 80 - 20 * secondOrderStep(0.5, 1, tt));
    const m = stepMetrics(t, y, 0, t.length - 1, 0, 60, -20, 0, 0);
    expect(m.overshootPct).toBeCloseTo(16.3034, 2);
    expect(m.overshootC).toBeCloseTo(20 * 0.163034, 3);
    expect(m.riseTimeS!).toBeCloseTo(1.6376, 2);
    expect(m.settlingTimeS!).toBeCloseTo(8.076, 1);
  });

  it("no overshoot for a first-order response; rise time 10–90 % = τ·ln 9 (analytic)", () => {
    const tau = 5;
    const { t, y } = sampled(60_001, 0.001, (tt) => 1 - Math.exp(-tt / tau));
    const m = stepMetrics(t, y, 0, t.length - 1, 0, 1, 1, 0, 0);
    expect(m.overshootPct).toBe(0);
    expect(m.riseTimeS!).toBeCloseTo(tau * Math.log(9), 4);
    expect(m.settlingTimeS!).toBeCloseTo(tau * Math.log(50), 3); // enters ±2 % at e^(−t/τ) = 0.02
  });

  it("band = max(2 % of the step, floor, 3σ noise); not settled → null; never reaching 90 % → null rise", () => {
    expect(bandHalfWidthC(10, 0.1, 0)).toBeCloseTo(0.2, 15);
    expect(bandHalfWidthC(10, 0.5, 0)).toBe(0.5);
    expect(bandHalfWidthC(10, 0.1, 0.3)).toBeCloseTo(0.9, 15);
    const { t, y } = sampled(1001, 0.01, (tt) => 0.5 * (1 - Math.exp(-tt)));
    const m = stepMetrics(t, y, 0, t.length - 1, 0, 1, 1, 0, 0);
    expect(m.settlingTimeS).toBeNull();
    expect(m.riseTimeS).toBeNull();
  });
});
