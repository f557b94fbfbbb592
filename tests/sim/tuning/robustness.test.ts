import { describe, expect, it } from "vitest";
import { assessMargins, computeMargins, controllerFromBlock, loopResponse, plantFromModel, type Loop } from "@/sim/tuning/robustness";
import { fopdt, sopdt } from "@/sim/tuning/models";
import { simcPi, zieglerNicholsUltimate, amigo, isRefusal, type RuleResult, type Tuning } from "@/sim/tuning/rules";

function ok(r: RuleResult): Tuning {
  if (isRefusal(r)) throw new Error(r.reason);
  return r;
}
const noD = { derivativeFilterN: Infinity };

describe("margins of L = e^{−s}/(2s) (references §15 and §4: GM = π, PM = 61.352°, Ms = 1.59049)", () => {
  // integrating plant with K = 1/2, θ = 1 under a unit P controller
  const direct: Loop = { plant: { gainCPerPercent: 0.5, timeConstantsS: [], deadTimeS: 1, integrating: true }, controller: { kc: 1, tiS: 0, tdS: 0, ...noD } };
  // the same loop from SIMC PI (τc = θ) on an FOPDT with τ1 ≤ 8θ: C·G = e^{−θs}/(2θs) (Skogestad 2003)
  const model = fopdt(1, 5, 1);
  const t = ok(simcPi(model));
  const viaSimc: Loop = { plant: plantFromModel(model), controller: { kc: t.kc, tiS: t.tiS, tdS: 0, ...noD } };

  it.each([
    ["integrator + delay", direct],
    ["SIMC PI on FOPDT", viaSimc],
  ])("%s", (_name, loop) => {
    const m = computeMargins(loop);
    expect(m.gainMargin).toBeCloseTo(Math.PI, 6);
    expect(m.phaseCrossoverRadPerS).toBeCloseTo(Math.PI / 2, 6); // ω180θ = π/2
    expect(m.phaseMarginDeg).toBeCloseTo(61.352, 3);
    expect(m.gainCrossoverRadPerS).toBeCloseTo(0.5, 8); // |L| = 1/(2ω)
    expect(m.maxSensitivity).toBeCloseTo(1.59049, 5);
    expect(m.delayMarginS).toBeCloseTo(((61.352 * Math.PI) / 180) / 0.5, 3);
    expect(m.bandwidthRadPerS).toBeGreaterThan(0.3);
    expect(assessMargins(m).msAbove2).toBe(false);
  });

  it("a PV filter adds lag and lowers the phase margin; so do sampling (h/2) and the heater cycle (Tc/2)", () => {
    const base = computeMargins(viaSimc).phaseMarginDeg;
    const filtered = computeMargins({ ...viaSimc, lags: { pvFilterTauS: 0.25 } }).phaseMarginDeg;
    expect(filtered).toBeLessThan(base - 5);
    // a pure extra delay d lowers PM by ωc·d exactly (ωc unchanged): 0.5 rad/s × 0.2 s
    const delayed = computeMargins({ ...viaSimc, lags: { sampleTimeS: 0.2, cycleTimeS: 0.2 } });
    expect(delayed.phaseMarginDeg).toBeCloseTo(61.352 - (0.5 * 0.2 * 180) / Math.PI, 3);
  });
});

describe("margins of other loops", () => {
  it("ZN PID on 1/((3s+1)(2s+1)(s+1)): PM 29.15°, Ms 2.169 (references §2/§15, computed), flagged Ms > 2", () => {
    const t = ok(zieglerNicholsUltimate({ ku: 10, puS: 2 * Math.PI }, "PID"));
    const loop: Loop = { plant: { gainCPerPercent: 1, timeConstantsS: [3, 2, 1], deadTimeS: 0 }, controller: { kc: t.kc, tiS: t.tiS, tdS: t.tdS, ...noD } };
    const m = computeMargins(loop);
    expect(m.phaseMarginDeg).toBeCloseTo(29.15, 1);
    expect(m.maxSensitivity).toBeCloseTo(2.169, 2);
    const a = assessMargins(m);
    expect(a.msAbove2).toBe(true);
    expect(a.verdict).toBe("fragile");
    expect(a.messages[0]).toMatch(/above 2.*close to its stability limit.*Lower Kc/);
  });

  it("AMIGO PI on K=1, τ=10, θ=2: GM 6.33, PM 67.5°, Ms 1.264 (references §7, computed)", () => {
    const t = ok(amigo(fopdt(1, 10, 2), "PI"));
    const m = computeMargins({ plant: plantFromModel(fopdt(1, 10, 2)), controller: { kc: t.kc, tiS: t.tiS, tdS: 0, ...noD } });
    expect(m.gainMargin).toBeCloseTo(6.33, 1);
    expect(m.phaseMarginDeg).toBeCloseTo(67.5, 0);
    expect(m.maxSensitivity).toBeCloseTo(1.264, 2);
    expect(assessMargins(m).verdict).toBe("robust");
  });

  it("gain margin is Infinity where the phase never reaches −180° (first-order plant under PI, no delay)", () => {
    const m = computeMargins({ plant: plantFromModel(fopdt(1, 10, 0)), controller: { kc: 2, tiS: 10, tdS: 0, ...noD } });
    expect(m.gainMargin).toBe(Infinity);
    expect(m.phaseCrossoverRadPerS).toBeNull();
    expect(Number.isFinite(m.phaseMarginDeg)).toBe(true);
  });

  it("Ms bounds GM ≥ Ms/(Ms − 1) and PM ≥ 2·arcsin(1/(2Ms)) hold (geometry, references §15)", () => {
    for (const kc of [0.5, 1, 2, 3, 4]) {
      const m = computeMargins({ plant: plantFromModel(sopdt(1, 10, 3, 1)), controller: { kc, tiS: 8, tdS: 1, derivativeFilterN: 10 } });
      expect(m.gainMargin).toBeGreaterThanOrEqual(m.maxSensitivity / (m.maxSensitivity - 1) - 1e-9);
      expect(m.phaseMarginDeg).toBeGreaterThanOrEqual((2 * Math.asin(1 / (2 * m.maxSensitivity)) * 180) / Math.PI - 1e-9);
    }
  });

  it("an unstable tuning is called unstable; phase stays continuous through many delay turns", () => {
    const m = computeMargins({ plant: plantFromModel(fopdt(1, 10, 2)), controller: { kc: 12, tiS: 5, tdS: 0, ...noD } });
    expect(m.gainMargin).toBeLessThan(1);
    expect(assessMargins(m).verdict).toBe("unstable");
    const loop: Loop = { plant: plantFromModel(fopdt(1, 10, 2)), controller: { kc: 1, tiS: 5, tdS: 0, ...noD } };
    let prev = loopResponse(loop, 0.01).phase;
    for (let w = 0.011; w < 200; w *= 1.1) {
      const p = loopResponse(loop, w).phase;
      expect(p).toBeLessThan(prev + 1e-12);
      prev = p;
    }
  });

  it("controller from the block's series and parallel forms gives the same loop as the standard form", () => {
    const std = controllerFromBlock({ form: "standard", kc: 2.4, ti: 12, td: 20 / 12 });
    const ser = controllerFromBlock({ form: "series", kc: 2, ti: 10, td: 2 });
    const par = controllerFromBlock({ form: "parallel", kc: 2.4, ti: 0, td: 0, ki: 0.2, kd: 4 });
    for (const c of [ser, par]) {
      expect(c.kc).toBeCloseTo(std.kc, 12);
      expect(c.tiS).toBeCloseTo(std.tiS, 12);
      expect(c.tdS).toBeCloseTo(std.tdS, 12);
    }
  });
});
