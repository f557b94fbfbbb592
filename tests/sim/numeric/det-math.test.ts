// Deterministic exp/expm1 from basic operations only (Cody & Waite range reduction, Taylor
// series). Checked against the platform's Math.exp/Math.expm1 within 2 ulp (the platform is
// itself only ~1 ulp, ECMA-262 §21.3.2 leaves the accuracy implementation-defined).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { detExp, detExpm1, detPowInt } from "@/sim/numeric/det-math";

const ulp = (x: number) => {
  const a = Math.abs(x);
  if (a === 0) return Number.MIN_VALUE;
  return 2 ** (Math.floor(Math.log2(a)) - 52);
};

describe("detExp and detExpm1", () => {
  it("agree with Math.exp within 2 ulp over the engine's range", () => {
    let worst = 0;
    for (let i = 0; i <= 200_000; i++) {
      const x = -60 + (i / 200_000) * 70 + Math.sin(i) * 1e-3;
      const e = detExp(x);
      const ref = Math.exp(x);
      worst = Math.max(worst, Math.abs(e - ref) / ulp(ref));
    }
    expect(worst).toBeLessThanOrEqual(2);
  });

  it("keeps small arguments accurate in expm1 and handles the edges", () => {
    for (const x of [1e-12, -3e-9, 1e-5, -0.2, 0.3, 2, -5]) expect(Math.abs(detExpm1(x) - Math.expm1(x))).toBeLessThanOrEqual(2 * ulp(Math.expm1(x)));
    expect(detExp(0)).toBe(1);
    expect(detExp(1)).toBeCloseTo(Math.E, 15);
    expect(detExp(800)).toBe(Infinity);
    expect(detExp(-800)).toBe(0);
    expect(detExp(-740)).toBeGreaterThan(0); // subnormal
    expect(Number.isNaN(detExp(NaN))).toBe(true);
  });

  it("integer powers by binary powering", () => {
    expect(detPowInt(0.5, 3)).toBe(0.125);
    expect(detPowInt(3, 0)).toBe(1);
    expect(detPowInt(1.1, 10)).toBeCloseTo(1.1 ** 10, 14);
  });

  it("uses no platform transcendental function", () => {
    const src = readFileSync("sim/numeric/det-math.ts", "utf8").replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, "");
    expect(src).not.toMatch(/Math\.(exp|expm1|log|log2|log10|pow|sin|cos|tan|atan|atan2|hypot|cbrt)\b|\*\*/);
  });
});
