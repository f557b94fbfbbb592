import { describe, expect, it } from "vitest";
import { computeWindowResults, windowIndices } from "../../../sim/results";
import { constant, sampled, secondOrderStep } from "./analytic";

function setpointTrace() {
  // SP steps from 40 to 60 °C at t = 100 s; response: ζ = 0.5, ωn = 0.1 rad/s (time-scaled Ogata).
  const h = 0.1;
  const n = 4001;
  const { t, y } = sampled(n, h, (tt) => (tt < 100 ? 40 : 40 + 20 * secondOrderStep(0.5, 0.1, tt - 100)));
  const sp = Float64Array.from(t, (tt) => (tt < 100 ? 40 : 60));
  const out = Float64Array.from(t, (tt) => (tt < 100 ? 20 : 60));
  const heaterPowerW = Float64Array.from(out, (o) => o * 20); // 2 kW heater
  return { t, y, sp, out, heaterPowerW };
}

describe("computeWindowResults", () => {
  it("setpoint window: Ogata measures scaled by 1/ωn, integrals, effort; plain serialisable object", () => {
    const tr = setpointTrace();
    const r = computeWindowResults({ ...tr, windowStartS: 100, windowEndS: 400, kind: "setpoint", stepSizeC: 20, bandFloorC: 0.1, noiseSigmaC: 0.05, cutoutPointC: 62 });
    expect(r.kind).toBe("setpoint");
    expect(r.samples).toBe(3001);
    expect(r.bandC).toBeCloseTo(0.4, 12); // 2 % of 20 °C beats the floor and 3σ = 0.15
    expect(r.overshootPct!).toBeCloseTo(16.3034, 1);
    expect(r.overshootC!).toBeCloseTo(3.26, 1);
    expect(Math.abs(r.riseTimeS! - 16.376)).toBeLessThan(0.02); // 1.6376 s / ωn
    expect(Math.abs(r.settlingTimeS! - 80.76)).toBeLessThan(0.15); // 8.076 s / ωn
    expect(r.peakTimeS!).toBeCloseTo(36.276, 1); // π/ωd
    expect(r.peakDeviationC).toBeNull();
    expect(r.outputTravelPct).toBe(0); // OUT constant inside the window
    expect(r.heaterEnergyKWh).toBeCloseTo((1200 * 300) / 3.6e6, 9);
    expect(r.timeAboveCutoutS).toBeGreaterThan(0);
    expect(r.iae).toBeGreaterThan(0);
    const json = JSON.parse(JSON.stringify(r));
    expect(json).toEqual(r); // no NaN / Infinity / typed arrays
  });

  it("the step defaults to SP at the end minus y at the window start", () => {
    const tr = setpointTrace();
    const r = computeWindowResults({ ...tr, windowStartS: 100, windowEndS: 400, kind: "setpoint", bandFloorC: 0, noiseSigmaC: 0 });
    expect(r.stepSizeC).toBeCloseTo(20, 12);
  });

  it("disturbance window: measures from the event, band without a step is max(floor, 3σ)", () => {
    const h = 0.1;
    const n = 6001;
    const t0 = 200;
    const { t, y } = sampled(n, h, (tt) => (tt < t0 ? 70 : 70 + 3 * ((tt - t0) / 20) * Math.exp(-(tt - t0) / 20))); // blocked inlet: PV rises
    const sp = constant(n, 70);
    const out = constant(n, 30);
    const heaterPowerW = constant(n, 600);
    const r = computeWindowResults({ t, y, sp, out, heaterPowerW, windowStartS: 150, windowEndS: 600, kind: "disturbance", eventTimeS: t0, bandFloorC: 0.2, noiseSigmaC: 0.1 });
    expect(r.bandC).toBeCloseTo(0.3, 12);
    expect(r.peakDeviationC!).toBeCloseTo(3 / Math.E, 3);
    expect(r.peakDeviationTimeS!).toBeCloseTo(20, 1);
    expect(r.recoveryTimeS!).toBeGreaterThan(20);
    expect(r.riseTimeS).toBeNull();
    expect(r.overshootPct).toBeNull();
    expect(r.heaterEnergyKWh).toBeCloseTo((600 * 450) / 3.6e6, 9);
  });

  it("an empty window and mismatched lengths", () => {
    const tr = setpointTrace();
    const r = computeWindowResults({ ...tr, windowStartS: 1000, windowEndS: 2000, kind: "setpoint", stepSizeC: 5, bandFloorC: 0.2, noiseSigmaC: 0 });
    expect(r.samples).toBe(0);
    expect(r.iae).toBe(0);
    expect(r.settlingTimeS).toBeNull();
    expect(() => computeWindowResults({ ...tr, y: tr.y.subarray(1), windowStartS: 0, windowEndS: 1, kind: "setpoint", bandFloorC: 0, noiseSigmaC: 0 })).toThrow(RangeError);
  });

  it("windowIndices picks samples with start ≤ t ≤ end", () => {
    const t = Float64Array.from([0, 0.5, 1, 1.5, 2, 2.5]);
    expect(windowIndices(t, 0.5, 2)).toEqual({ first: 1, last: 4 });
    expect(windowIndices(t, 0.6, 2.4)).toEqual({ first: 2, last: 4 });
    expect(windowIndices(t, 3, 4)).toEqual({ first: 6, last: 5 });
  });
});

describe("band with PV noise", () => {
  it("3σ of the noise widens the band for a small step, so a noisy filtered PV can settle", async () => {
    const { SeededRandom } = await import("../../../sim/random");
    const rng = new SeededRandom(12);
    const h = 0.1;
    const n = 4001;
    const sigma = 0.03;
    // A 2 °C step, ζ = 0.7, ωn = 0.1; noise σ = 0.03 °C, filtered so that 3σ is rarely exceeded.
    const { t, y } = sampled(n, h, (tt) => 50 + 2 * secondOrderStep(0.7, 0.1, tt));
    let f = 0;
    for (let k = 0; k < n; k++) {
      f += 0.5 * (sigma * rng.gaussian() - f);
      y[k] += f; // low-pass noise of sd ≈ σ·√(0.5/1.5) ≈ 0.017
    }
    const sp = constant(n, 52);
    const base = { t, y, sp, out: constant(n, 0), heaterPowerW: constant(n, 0), windowStartS: 0, windowEndS: 400, kind: "setpoint" as const, stepSizeC: 2 };
    const noisy = computeWindowResults({ ...base, bandFloorC: 0.01, noiseSigmaC: sigma });
    expect(noisy.bandC).toBeCloseTo(0.09, 12); // 3σ beats 2 % of 2 °C (0.04) and the floor
    expect(noisy.settlingTimeS).not.toBeNull();
    // The wider band is entered earlier than the noise-free ±0.04 band would be (≈ 59.8 s for ζ = 0.7 / ωn).
    expect(noisy.settlingTimeS!).toBeLessThan(59.8);
    const tight = computeWindowResults({ ...base, bandFloorC: 0.01, noiseSigmaC: 0 });
    expect(tight.bandC).toBeCloseTo(0.04, 12);
    expect(tight.settlingTimeS === null || tight.settlingTimeS > noisy.settlingTimeS!).toBe(true);
  });
});
