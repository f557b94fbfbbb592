import { describe, expect, it } from "vitest";
import { seriesToIdeal, idealToSeries, parallelToIdeal, idealToParallel, controllerConfigSchema } from "../../../sim/control";
import { block } from "./helpers";

describe("PID forms (Åström & Hägglund 1995, ch. 3)", () => {
  it("series → ideal: Kc' = Kc(1 + Td/Ti), Ti' = Ti + Td, Td' = TiTd/(Ti + Td)", () => {
    const p = seriesToIdeal(2, 10, 2);
    expect(p.kc).toBeCloseTo(2.4, 14);
    expect(p.ti).toBeCloseTo(12, 14);
    expect(p.td).toBeCloseTo(20 / 12, 14);
    expect(seriesToIdeal(3, 0, 2)).toEqual({ kc: 3, ti: 0, td: 2 });
  });

  it("ideal → series inverts it where real zeros exist (Ti ≥ 4Td), else null", () => {
    const s = idealToSeries(2.4, 12, 20 / 12)!;
    expect(s.kc).toBeCloseTo(2, 12);
    expect(s.ti).toBeCloseTo(10, 12);
    expect(s.td).toBeCloseTo(2, 12);
    expect(idealToSeries(1, 10, 3)).toBeNull();
  });

  it("parallel ↔ ideal: Ki = Kc/Ti, Kd = Kc·Td (references conventions)", () => {
    expect(idealToParallel(2, 50, 5)).toEqual({ kp: 2, ki: 0.04, kd: 10 });
    const p = parallelToIdeal(2, 0.04, 10);
    expect(p.kc).toBe(2);
    expect(p.ti).toBeCloseTo(50, 12);
    expect(p.td).toBe(5);
    expect(parallelToIdeal(2, 0, 0)).toEqual({ kc: 2, ti: 0, td: 0 });
  });

  it("a series-form block gives the same OUT sequence as the standard-form block with converted parameters", () => {
    const seriesBlock = block({ form: "series", kc: 2, ti: 10, td: 2, sampleTimeS: 0.1, outMinPct: -500, outMaxPct: 500 }, { out: 5, sp: 40, pv: 40 });
    const ideal = seriesToIdeal(2, 10, 2);
    const idealBlock = block({ form: "standard", ...ideal, sampleTimeS: 0.1, outMinPct: -500, outMaxPct: 500 }, { out: 5, sp: 40, pv: 40 });
    const parallel = idealToParallel(ideal.kc, ideal.ti, ideal.td);
    const parBlock = block({ form: "parallel", kc: parallel.kp, ki: parallel.ki, kd: parallel.kd, sampleTimeS: 0.1, outMinPct: -500, outMaxPct: 500 }, { out: 5, sp: 40, pv: 40 });
    for (const blk of [seriesBlock, idealBlock, parBlock]) blk.setSetpoint(45);
    for (let k = 0; k < 300; k++) {
      const pv = 40 + 5 * (1 - Math.exp(-k / 80)) + 0.3 * Math.sin(k / 7);
      const a = seriesBlock.update(pv, false);
      const b = idealBlock.update(pv, false);
      const c = parBlock.update(pv, false);
      expect(a).toBeCloseTo(b, 9);
      expect(c).toBeCloseTo(b, 9);
    }
  });

  it("schema: ti = 0 means no integral; parallel with Kp = 0 and Ki > 0 is rejected; limits must be ordered", () => {
    expect(controllerConfigSchema.parse({ ti: 0 }).ti).toBe(0);
    expect(controllerConfigSchema.safeParse({ form: "parallel", kc: 0, ki: 1 }).success).toBe(false);
    expect(controllerConfigSchema.safeParse({ outMinPct: 50, outMaxPct: 20 }).success).toBe(false);
    expect(controllerConfigSchema.safeParse({ ti: Infinity }).success).toBe(false); // JSON-safe: use 0
    expect(controllerConfigSchema.safeParse({ badPvPolicy: "safe-output", safeOutputPct: 120 }).success).toBe(false);
    expect(controllerConfigSchema.safeParse({ badPvPolicy: "hold", outMinPct: 5 }).success).toBe(true); // safe output unused
    const d = controllerConfigSchema.parse({});
    expect(d.derivativeFilterN).toBe(10); // common default (references §13: Modelica LimPID Nd = 10)
    expect(d.derivativeOn).toBe("pv");
    expect(d.antiWindup).toBe("back-calculation");
  });
});
