import { describe, expect, it } from "vitest";
import { filterNoiseFactor, recommendSampleTimeAndFilter } from "@/sim/tuning/rules";
import { fopdt } from "@/sim/tuning/models";

describe("sample time and PV filter (rules of thumb: common practice)", () => {
  it("sample time ≤ θ/5 and ≤ τ/10, rounded down to 1-2-5 (common practice)", () => {
    expect(recommendSampleTimeAndFilter({ model: fopdt(1, 600, 40), noiseSigmaC: 0 }).sampleTimeS).toBe(5);
    expect(recommendSampleTimeAndFilter({ model: fopdt(1, 10, 60), noiseSigmaC: 0 }).sampleTimeS).toBe(1);
  });

  it("first-order filter on white noise: σ factor √(α/(2−α)), α = 1 − e^{−h/τ} (variance of an AR(1) process, derived)", () => {
    const a = 1 - Math.exp(-0.1 / 1);
    expect(filterNoiseFactor(1, 0.1)).toBeCloseTo(Math.sqrt(a / (2 - a)), 14);
    expect(filterNoiseFactor(0, 0.1)).toBe(1);
  });

  it("filter sized to the noise target, capped at θ/4 and at a quarter of the sensor lag (references §16, common practice)", () => {
    const r = recommendSampleTimeAndFilter({ model: fopdt(1, 600, 40), noiseSigmaC: 0.3, sampleTimeS: 0.5, targetSigmaC: 0.05 });
    expect(r.pvFilterTauS).toBeGreaterThan(0);
    expect(r.filteredSigmaC).toBeLessThan(0.06);
    const capped = recommendSampleTimeAndFilter({ model: fopdt(1, 600, 40), noiseSigmaC: 0.3, sampleTimeS: 0.5, sensorLagS: 4 });
    expect(capped.pvFilterTauS).toBe(1);
    expect(recommendSampleTimeAndFilter({ model: fopdt(1, 600, 40), noiseSigmaC: 0.01 }).pvFilterTauS).toBe(0);
  });
});
