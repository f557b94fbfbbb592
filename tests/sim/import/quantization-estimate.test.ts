import { describe, expect, it } from "vitest";
import { estimateQuantizationStep } from "@/sim/tuning/identify";
import { SeededRandom } from "@/sim/random";

// A quantizer with step q puts every sample on k·q + offset (common practice); the test signals are invented.
const quantize = (x: number, q: number, offset = 0) => Math.round((x - offset) / q) * q + offset;
const sine = (n: number, amp: number, mean: number) => Array.from({ length: n }, (_, i) => mean + amp * Math.sin((2 * Math.PI * i) / 500));

describe("estimateQuantizationStep", () => {
  it("a sine quantized to 0.1 gives 0.1 within 1 %", () => {
    const q = estimateQuantizationStep(sine(2000, 3, 50).map((x) => quantize(x, 0.1)));
    expect(q).not.toBeNull();
    expect(Math.abs(q! / 0.1 - 1)).toBeLessThan(0.01);
  });
  it("a 12-bit ADC over 256 °C (256/4096 = 0.0625 °C per code) gives 0.0625, with noise and an offset", () => {
    const rng = new SeededRandom(5);
    const pv = sine(3000, 2, 80).map((x) => quantize(x + 0.05 * rng.gaussian(), 0.0625, 0.01));
    expect(estimateQuantizationStep(pv)).toBeCloseTo(0.0625, 9);
  });
  it("when only double steps occur the lattice is still found (candidates m/2, m/3, m/4)", () => {
    const pv = [0, 0.2, 0.5, 0.7, 1.0, 1.2, 1.5, 1.7, 2.0, 2.2, 2.5].map((x) => x + 20);
    expect(estimateQuantizationStep(pv)).toBeCloseTo(0.1, 9);
  });
  it("unquantized noisy data give null; too few changes give null", () => {
    const rng = new SeededRandom(9);
    expect(estimateQuantizationStep(sine(2000, 3, 50).map((x) => x + 0.05 * rng.gaussian()))).toBeNull();
    expect(estimateQuantizationStep(Array.from({ length: 500 }, () => 20 + rng.uniform()))).toBeNull();
    expect(estimateQuantizationStep([20, 20, 20.1, 20.1, 20])).toBeNull();
    expect(estimateQuantizationStep([])).toBeNull();
  });
});
