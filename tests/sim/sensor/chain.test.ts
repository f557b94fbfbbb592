import { describe, expect, it } from "vitest";
import { SensorChain, sensorChainSchema, type SensorChainConfigInput } from "../../../sim/sensor";
import { pt100Sensitivity } from "../../../sim/sensor/pt100";
import { SeededRandom } from "../../../sim/random";

function chain(over: SensorChainConfigInput = {}, seed = 1): SensorChain {
  return new SensorChain(sensorChainSchema.parse(over), new SeededRandom(seed));
}
const quiet = { noise: { sdMa: 0 }, analogInput: { bits: 32 } } satisfies SensorChainConfigInput;

describe("sensor chain configuration", () => {
  it("parses {} with the documented defaults", () => {
    const c = sensorChainSchema.parse({});
    expect(c.element.wiring).toBe("3-wire");
    expect(c.element.toleranceClass).toBe("A");
    expect(c.transmitter.rangeLowC).toBe(0);
    expect(c.transmitter.rangeHighC).toBe(200);
    expect(c.analogInput.bits).toBe(16);
    expect(c.transmitter.failureDirection).toBe("upscale");
  });

  it("rejects failure currents outside NE 43 and inverted ranges", () => {
    expect(sensorChainSchema.safeParse({ transmitter: { failureLowMa: 3.7 } }).success).toBe(false);
    expect(sensorChainSchema.safeParse({ transmitter: { failureHighMa: 20.9 } }).success).toBe(false);
    expect(sensorChainSchema.safeParse({ transmitter: { rangeLowC: 100, rangeHighC: 50 } }).success).toBe(false);
    const bad = sensorChainSchema.safeParse({ analogInput: { bits: 0 } });
    expect(bad.success).toBe(false);
    if (!bad.success) expect(bad.error.issues[0].path).toEqual(["analogInput", "bits"]);
  });
});

describe("sensor chain measurement", () => {
  it("an ideal 4-wire element without noise reads the element temperature", () => {
    const c = chain({ ...quiet, element: { wiring: "4-wire" } });
    for (const t of [0, 23.4, 100, 187.5]) {
      const r = c.measure(t, "none", 0);
      expect(r.pv).toBeCloseTo(t, 6);
      expect(r.bad).toBe(false);
      expect(r.mA).toBeCloseTo(4 + (16 * t) / 200, 7);
    }
  });

  it("2-wire with 2 × 0.5 Ω leads reads ≈ +2.6 °C high near 100 °C (ΔR / (dR/dt), IEC 60751 slope)", () => {
    const c = chain({ ...quiet, element: { wiring: "2-wire", leadResistanceOhm: 0.5 } });
    const offset = c.measure(100, "none", 0).pv - 100;
    // 1 Ω / 0.37928 Ω/K (references §10) = 2.6366 K; the curve's slight bend over 2.6 K moves it by < 0.001 K.
    expect(offset).toBeCloseTo(1 / pt100Sensitivity(100), 2);
    expect(Math.abs(offset - 2.6366)).toBeLessThan(2e-3);
  });

  it("3-wire cancels the leads except their mismatch; 4-wire has no lead effect", () => {
    const three = chain({ ...quiet, element: { wiring: "3-wire", leadResistanceOhm: 5 } });
    expect(three.measure(100, "none", 0).pv).toBeCloseTo(100, 6);
    const mism = chain({ ...quiet, element: { wiring: "3-wire", leadResistanceOhm: 5, leadMismatchOhm: 0.1 } });
    expect(mism.measure(100, "none", 0).pv - 100).toBeCloseTo(0.1 / pt100Sensitivity(100), 3);
    const four = chain({ ...quiet, element: { wiring: "4-wire", leadResistanceOhm: 5 } });
    expect(four.measure(100, "none", 0).pv).toBeCloseTo(100, 6);
  });

  it("tolerance class offset: a class B element at the top of its band reads +0.8 °C at 100 °C (IEC 60751)", () => {
    const c = chain({ ...quiet, element: { wiring: "4-wire", toleranceClass: "B", tolerancePosition: 1 } });
    expect(c.measure(100, "none", 0).pv).toBeCloseTo(100.8, 6);
    const low = chain({ ...quiet, element: { wiring: "4-wire", toleranceClass: "A", tolerancePosition: -1 } });
    expect(low.measure(100, "none", 0).pv).toBeCloseTo(99.65, 6);
  });

  it("open, shorted and lead-break give the NE 43 failure current and the bad flag (downscale 3.6 / upscale 21 mA)", () => {
    for (const wiring of ["2-wire", "3-wire", "4-wire"] as const) {
      const down = chain({ ...quiet, element: { wiring }, transmitter: { failureDirection: "downscale" } });
      const up = chain({ ...quiet, element: { wiring }, transmitter: { failureDirection: "upscale" } });
      for (const fault of ["open", "shorted", "lead-break"] as const) {
        const d = down.measure(80, fault, 0);
        expect(d.mA).toBeCloseTo(3.6, 6);
        expect(d.bad).toBe(true);
        const u = up.measure(80, fault, 0);
        expect(u.mA).toBeCloseTo(21, 6);
        expect(u.bad).toBe(true);
      }
    }
  });

  it("out-of-range temperature clips at 3.8 / 20.5 mA and is not flagged bad", () => {
    const c = chain(quiet);
    const lo = c.measure(-30, "none", 0);
    expect(lo.mA).toBeCloseTo(3.8, 6);
    expect(lo.bad).toBe(false);
    expect(lo.pv).toBeCloseTo(-2.5, 5); // 3.8 mA on 0–200 °C
    const hi = c.measure(260, "none", 0);
    expect(hi.mA).toBeCloseTo(20.5, 6);
    expect(hi.bad).toBe(false);
    expect(hi.pv).toBeCloseTo(206.25, 5);
  });

  it("the chain's precomputed transmitter agrees with transmitterOutputMa() of transmitter.ts", async () => {
    const { transmitterOutputMa } = await import("../../../sim/sensor/transmitter");
    const cfg = sensorChainSchema.parse({ element: { wiring: "2-wire", toleranceClass: "B", tolerancePosition: 0.4 }, transmitter: { rangeLowC: -50, rangeHighC: 250 } });
    const c = new SensorChain(cfg, new SeededRandom(1));
    for (let t = -60; t <= 300; t += 3.3) {
      expect(c.transmitterMa(t, "none")).toBeCloseTo(transmitterOutputMa(c.terminalResistanceOhm(t, "none"), cfg.transmitter), 10);
    }
  });

  it("a range reaching below 0 °C: −50…150 °C reads −30 °C correctly (inverse CVD below R0)", () => {
    const c = chain({ ...quiet, element: { wiring: "4-wire" }, transmitter: { rangeLowC: -50, rangeHighC: 150 } });
    expect(c.measure(-30, "none", 0).pv).toBeCloseTo(-30, 6);
    expect(c.measure(-30, "none", 0).mA).toBeCloseTo(4 + (16 * 20) / 200, 7);
  });

  it("PV noise in °C is the mA noise times span/16 (0.004 mA on 0–200 °C → 0.05 °C)", () => {
    const c = chain({ noise: { sdMa: 0.004 }, analogInput: { bits: 24 }, element: { wiring: "4-wire" } }, 3);
    const n = 40_000;
    let s1 = 0;
    let s2 = 0;
    for (let k = 0; k < n; k++) {
      const pv = c.measure(120, "none", 0).pv - 120;
      s1 += pv;
      s2 += pv * pv;
    }
    const sd = Math.sqrt(s2 / n - (s1 / n) ** 2);
    expect(Math.abs(sd / 0.05 - 1)).toBeLessThan(0.03);
  });

  it("a 12-bit input quantises PV in steps of 24/4095 mA = 0.0733 °C on 0–200 °C", () => {
    const c = chain({ noise: { sdMa: 0 }, analogInput: { bits: 12 }, element: { wiring: "4-wire" } });
    const seen = new Set<number>();
    for (let t = 100; t < 101; t += 0.001) seen.add(c.measure(t, "none", 0).pv);
    const levels = [...seen].sort((a, b) => a - b);
    for (let k = 1; k < levels.length; k++) expect(levels[k] - levels[k - 1]).toBeCloseTo(((24 / 4095) * 200) / 16, 9);
    expect(levels.length).toBeGreaterThanOrEqual(13); // 1 °C / 0.0733 °C ≈ 13.6
    expect(levels.length).toBeLessThanOrEqual(15);
  });

  it("readings are quantised to the ADC step", () => {
    const c = chain({ noise: { sdMa: 0 }, analogInput: { bits: 8, rangeLowMa: 0, rangeHighMa: 24 }, element: { wiring: "4-wire" } });
    const step = 24 / 255;
    const r = c.measure(55.5, "none", 0);
    expect(Math.abs(r.mA / step - Math.round(r.mA / step))).toBeLessThan(1e-9);
    expect(Math.abs(r.mA - (4 + (16 * 55.5) / 200))).toBeLessThanOrEqual(step / 2);
  });

  it("Gaussian noise has the configured sd in mA, extra noise adds in quadrature, and is seeded", () => {
    const sd = 0.02;
    const c = chain({ noise: { sdMa: sd }, analogInput: { bits: 24 }, element: { wiring: "4-wire" } }, 77);
    const n = 40_000;
    const stats = (extra: number) => {
      let s = 0;
      let s2 = 0;
      for (let k = 0; k < n; k++) {
        const m = c.measure(100, "none", extra).mA - 12;
        s += m;
        s2 += m * m;
      }
      return { mean: s / n, sd: Math.sqrt(s2 / n - (s / n) ** 2) };
    };
    const a = stats(0);
    expect(Math.abs(a.mean)).toBeLessThan(5 * (sd / Math.sqrt(n)));
    expect(Math.abs(a.sd / sd - 1)).toBeLessThan(0.03);
    const b = stats(0.015);
    expect(Math.abs(b.sd / 0.025 - 1)).toBeLessThan(0.03); // √(0.02² + 0.015²) = 0.025
    const again = chain({ noise: { sdMa: sd } }, 77);
    const first = chain({ noise: { sdMa: sd } }, 77);
    for (let k = 0; k < 100; k++) expect(again.measure(90, "none", 0).mA).toBe(first.measure(90, "none", 0).mA);
    const other = chain({ noise: { sdMa: sd } }, 78);
    let differ = 0;
    for (let k = 0; k < 100; k++) if (other.measure(90, "none", 0).mA !== first.measure(90, "none", 0).mA) differ++;
    expect(differ).toBeGreaterThan(90);
  });

  it("spikes occur with the configured probability and amplitude, both signs", () => {
    const c = chain({ noise: { sdMa: 0, spikeProbability: 0.05, spikeAmplitudeMa: 2 }, analogInput: { bits: 24 }, element: { wiring: "4-wire" } }, 5);
    const n = 40_000;
    let up = 0;
    let down = 0;
    for (let k = 0; k < n; k++) {
      const d = c.measure(100, "none", 0).mA - 12;
      if (d > 1.9) up++;
      else if (d < -1.9) down++;
      else expect(Math.abs(d)).toBeLessThan(1e-5);
    }
    // Binomial: expected 2000 spikes, sd ≈ 44; each sign ≈ 1000 ± 32.
    expect(Math.abs(up + down - 2000)).toBeLessThan(220);
    expect(Math.abs(up - down)).toBeLessThan(300);
  });

  it("the noise draws do not depend on the noise level, so an extra-noise event does not shift later noise", () => {
    const cfg = { noise: { sdMa: 0.01 }, analogInput: { bits: 24 } };
    const a = chain(cfg, 9);
    const b = chain(cfg, 9);
    for (let k = 0; k < 50; k++) {
      a.measure(100, "none", 0);
      b.measure(100, "none", k > 10 && k < 20 ? 0.5 : 0);
    }
    for (let k = 0; k < 20; k++) expect(a.measure(100, "none", 0).mA).toBe(b.measure(100, "none", 0).mA);
  });

  it("measure() reuses one result object (allocation-free hot path; callers copy the fields)", () => {
    const c = chain({ noise: { sdMa: 0.01 } });
    const a = c.measure(80, "none", 0);
    const pv = a.pv;
    const b = c.measure(90, "none", 0);
    expect(b).toBe(a);
    expect(b.pv).not.toBe(pv);
  });
});
