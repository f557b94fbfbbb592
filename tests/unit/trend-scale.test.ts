import { describe, expect, it } from "vitest";
import { trendScale } from "@/app/_lib/records/trend-scale";

describe("a record trend's axes", () => {
  it("time from first to last row; SP and PV padded by 8 % (≥ 0.5 °C); OUT clamped to 0–100 %", () => {
    const s = trendScale([
      [0, 50, 40, 20],
      [100, 60, 70, 110],
    ]);
    expect([s.t0, s.t1]).toEqual([0, 100]);
    expect(s.lo).toBeCloseTo(40 - 2.4, 12);
    expect(s.hi).toBeCloseTo(70 + 2.4, 12);
    expect(s.xFraction(50)).toBe(0.5);
    expect(s.tempFraction(s.hi)).toBe(1);
    expect(s.outFraction(110)).toBe(1);
    expect(s.outFraction(-5)).toBe(0);
  });

  it("a flat, instant trend still has an axis", () => {
    const s = trendScale([
      [5, 50, 50, 0],
      [5, 50, 50, 0],
    ]);
    expect([s.lo, s.hi]).toEqual([49.5, 50.5]);
    expect(s.xFraction(5)).toBe(0);
  });
});
