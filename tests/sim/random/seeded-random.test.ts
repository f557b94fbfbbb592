import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { SeededRandom, IRWIN_HALL_EXCESS_KURTOSIS } from "../../../sim/random";

const simRandomDir = fileURLToPath(new URL("../../../sim/random/", import.meta.url));

describe("xoshiro128** generator", () => {
  it("reproduces the reference test vector for state (1, 2, 3, 4)", () => {
    // Blackman & Vigna reference xoshiro128** 1.1, vector as in the rand_xoshiro crate's tests
    // [CONFIRMED-2nd: quoted in a public test suite citing rand_xoshiro; first value also checked by
    // hand: rotl(2·5, 7)·9 = 1280·9 = 11520].
    const r = SeededRandom.fromState(1, 2, 3, 4);
    const got = Array.from({ length: 6 }, () => r.nextUint32());
    expect(got).toEqual([11520, 0, 5927040, 70819200, 2031721883, 1637235492]);
  });

  it("is deterministic: same seed → same sequence", () => {
    const a = new SeededRandom(42);
    const b = new SeededRandom(42);
    for (let k = 0; k < 1000; k++) expect(a.nextUint32()).toBe(b.nextUint32());
  });

  it("different seeds → different sequences", () => {
    const a = new SeededRandom(1);
    const b = new SeededRandom(2);
    let same = 0;
    for (let k = 0; k < 1000; k++) if (a.nextUint32() === b.nextUint32()) same++;
    expect(same).toBeLessThan(3);
  });

  it("uniform() lies in [0, 1) with mean 1/2 and variance 1/12", () => {
    const r = new SeededRandom(7);
    const n = 200_000;
    let s = 0;
    let s2 = 0;
    let min = 1;
    let max = 0;
    for (let k = 0; k < n; k++) {
      const u = r.uniform();
      s += u;
      s2 += u * u;
      if (u < min) min = u;
      if (u > max) max = u;
    }
    const mean = s / n;
    const v = s2 / n - mean * mean;
    expect(min).toBeGreaterThanOrEqual(0);
    expect(max).toBeLessThan(1);
    // Standard error of the mean √(1/12/n) ≈ 6.5e-4; 5 SE.
    expect(Math.abs(mean - 0.5)).toBeLessThan(3.3e-3);
    expect(Math.abs(v - 1 / 12)).toBeLessThan(1.5e-3);
  });

  it("seed is reduced modulo 2³² and must be finite", () => {
    const a = new SeededRandom(5);
    const b = new SeededRandom(5 + 2 ** 32);
    expect(a.nextUint32()).toBe(b.nextUint32());
    expect(() => new SeededRandom(NaN)).toThrow(RangeError);
    expect(() => SeededRandom.fromState(0, 0, 0, 0)).toThrow(RangeError);
  });
});

describe("fork: independent, reproducible sub-streams", () => {
  it("depends only on seed and stream, not on draws made from the parent", () => {
    const p1 = new SeededRandom(99);
    const p2 = new SeededRandom(99);
    for (let k = 0; k < 123; k++) p2.nextUint32();
    const f1 = p1.fork(3);
    const f2 = p2.fork(3);
    for (let k = 0; k < 100; k++) expect(f1.nextUint32()).toBe(f2.nextUint32());
  });

  it("drawing from one fork never shifts another", () => {
    const p = new SeededRandom(11);
    const a1 = p.fork(1);
    const b1 = p.fork(2);
    const ref = Array.from({ length: 50 }, () => b1.nextUint32());
    const a2 = p.fork(1);
    for (let k = 0; k < 777; k++) a2.gaussian(); // heavy use of stream 1
    const b2 = p.fork(2);
    expect(Array.from({ length: 50 }, () => b2.nextUint32())).toEqual(ref);
    expect(a1.nextUint32()).not.toBe(b1.nextUint32());
  });

  it("different streams and the parent give different sequences (low correlation)", () => {
    const p = new SeededRandom(2024);
    const a = p.fork(0);
    const b = p.fork(1);
    const n = 50_000;
    let sab = 0;
    let spa = 0;
    for (let k = 0; k < n; k++) {
      const x = a.uniform() - 0.5;
      const y = b.uniform() - 0.5;
      const z = p.uniform() - 0.5;
      sab += x * y;
      spa += x * z;
    }
    // Correlation coefficient = 12·mean(xy); SE ≈ 1/√n = 4.5e-3; allow 5 SE.
    expect(Math.abs((12 * sab) / n)).toBeLessThan(0.023);
    expect(Math.abs((12 * spa) / n)).toBeLessThan(0.023);
  });
});

describe("gaussian() (Irwin–Hall, n = 12)", () => {
  it("has mean 0, variance 1, excess kurtosis −0.1 and support [−6, 6] over many samples", () => {
    // Irwin (1927), Hall (1927): Σ12 U − 6 has mean 0, variance 12/12 = 1, excess kurtosis −6/(5·12).
    const r = new SeededRandom(123456);
    const n = 400_000;
    let s = 0;
    let s2 = 0;
    let s4 = 0;
    let maxAbs = 0;
    let within1 = 0;
    for (let k = 0; k < n; k++) {
      const z = r.gaussian();
      s += z;
      s2 += z * z;
      s4 += z * z * z * z;
      if (Math.abs(z) > maxAbs) maxAbs = Math.abs(z);
      if (Math.abs(z) <= 1) within1++;
    }
    const mean = s / n;
    const variance = s2 / n - mean * mean;
    const kurt = s4 / n / (variance * variance) - 3;
    // SE(mean) = 1/√n ≈ 1.6e-3; SE(var) ≈ √(2/n) ≈ 2.2e-3; SE(kurtosis) ≈ √(24/n) ≈ 7.7e-3.
    expect(Math.abs(mean)).toBeLessThan(8e-3);
    expect(Math.abs(variance - 1)).toBeLessThan(1.1e-2);
    expect(Math.abs(kurt - IRWIN_HALL_EXCESS_KURTOSIS)).toBeLessThan(0.04);
    expect(maxAbs).toBeLessThanOrEqual(6);
    // P(|Z| ≤ 1) = 0.682689 for a true normal (standard normal table); Irwin–Hall(12) is close to it (tolerance covers both the approximation and sampling).
    expect(Math.abs(within1 / n - 0.682689)).toBeLessThan(4e-3);
  });

  it("the noise path uses no Math.log, Math.exp or trigonometry (source text check)", () => {
    for (const f of ["gaussian.ts", "seeded-random.ts", "seed-mix.ts"]) {
      const src = readFileSync(simRandomDir + f, "utf8");
      expect(src, f).not.toMatch(/Math\.(log|log2|log10|log1p|exp|expm1|sin|cos|tan|asin|acos|atan|atan2|sinh|cosh|tanh|pow)\b/);
      expect(src, f).not.toMatch(/Math\.random/);
    }
    const chain = readFileSync(fileURLToPath(new URL("../../../sim/sensor/chain.ts", import.meta.url)), "utf8");
    expect(chain).not.toMatch(/Math\.(log|exp|sin|cos|tan|pow|random)\b/);
  });
});

describe("gaussian() construction", () => {
  it("equals (Σ of the 12 sixteen-bit halves of 6 draws + 6)/2¹⁶ − 6, computed here independently", () => {
    const a = new SeededRandom(31337);
    const b = new SeededRandom(31337);
    for (let k = 0; k < 10_000; k++) {
      let sum = 0;
      for (let j = 0; j < 6; j++) {
        const x = b.nextUint32();
        sum += Math.floor(x / 65536) + (x % 65536);
      }
      expect(a.gaussian()).toBe((sum + 6) / 65536 - 6);
    }
  });

  it("the mean correction is exact: the all-zero and all-max halves give −6 + 6/2¹⁶ and +6 − 6/2¹⁶ (symmetric)", async () => {
    const { irwinHallGaussian } = await import("../../../sim/random");
    expect(irwinHallGaussian({ nextUint32: () => 0 })).toBe(-6 + 6 / 65536);
    expect(irwinHallGaussian({ nextUint32: () => 0xffffffff })).toBe(6 - 6 / 65536);
    expect(irwinHallGaussian({ nextUint32: () => 0x7fff8000 })).toBe(0); // halves 32767 and 32768 sum to 65535 each
  });
});

describe("uniformity (Pearson χ² goodness of fit, a standard statistical test)", () => {
  it("64 equal bins over 256 000 draws: χ² within the 99.9 % range of χ²(63)", () => {
    const r = new SeededRandom(8675309);
    const bins = new Float64Array(64);
    const n = 256_000;
    for (let k = 0; k < n; k++) bins[Math.floor(r.uniform() * 64)]++;
    const expected = n / 64;
    let chi2 = 0;
    for (const b of bins) chi2 += ((b - expected) * (b - expected)) / expected;
    // χ²(63) quantiles (standard tables, from memory): 0.1 % ≈ 33.4, 99.9 % ≈ 103.4.
    expect(chi2).toBeGreaterThan(33);
    expect(chi2).toBeLessThan(104);
  });

  it("successive pairs are uncorrelated (serial correlation of u_k, u_k+1 within 5 SE of 0)", () => {
    const r = new SeededRandom(4242);
    const n = 100_000;
    let prev = r.uniform() - 0.5;
    let s = 0;
    for (let k = 0; k < n; k++) {
      const u = r.uniform() - 0.5;
      s += prev * u;
      prev = u;
    }
    expect(Math.abs((12 * s) / n)).toBeLessThan(5 / Math.sqrt(n));
  });
});
