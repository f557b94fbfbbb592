// A twin's sensor chain on the Bench: the noise σ and quantization step read from its uploaded
// log become the chain's current noise and analog-input bits. Checked against the engine's own
// reading of the chain (noiseSigmaC, adcStepMa); 4–20 mA over the span is common practice.
import { describe, expect, it } from "vitest";
import { sensorFromIdentification, sensorMatching } from "@/components/bench/sensor-from-data";
import { noiseSigmaC } from "@/sim/drill/resolve";
import { adcStepMa } from "@/sim/sensor/adc";
import { sensorChainSchema } from "@/sim/sensor/config";

describe("sensorFromIdentification", () => {
  it("reads noise σ and step when they are positive numbers, and nothing else", () => {
    expect(sensorFromIdentification({ noiseSigmaC: 0.12, quantizationStepC: 0.1, candidates: [] })).toEqual({ noiseSigmaC: 0.12, quantizationStepC: 0.1 });
    expect(sensorFromIdentification({ noiseSigmaC: 0.12 })).toEqual({ noiseSigmaC: 0.12, quantizationStepC: null });
    expect(sensorFromIdentification({ noiseSigmaC: 0, quantizationStepC: null })).toEqual({ noiseSigmaC: 0, quantizationStepC: null });
    expect(sensorFromIdentification({ noiseSigmaC: "0.12", quantizationStepC: -1 })).toBeNull();
    expect(sensorFromIdentification(null)).toBeNull();
    expect(sensorFromIdentification([1, 2])).toBeNull();
  });
});

describe("sensorMatching", () => {
  it("puts σ on the loop current: 16 mA over the transmitter span (4–20 mA)", () => {
    const m = sensorMatching({ noiseSigmaC: 0.25, quantizationStepC: null });
    const chain = sensorChainSchema.parse(m.sensor);
    expect(chain.noise.sdMa).toBeCloseTo((0.25 * 16) / 200, 12);
    expect(noiseSigmaC(chain)).toBeCloseTo(0.25, 12);
    expect(m.sigmaC).toBeCloseTo(0.25, 12);
    expect(chain.analogInput.bits).toBe(16); // untouched without a step
  });

  it("matches the step with the nearest whole number of ADC bits and reports the step it gives", () => {
    // 0–24 mA over 2^bits − 1 codes; 0.1 °C on a 0–200 °C span is 0.008 mA, 3000 codes: 12 bits (4095 codes, 0.073 °C)
    const m = sensorMatching({ noiseSigmaC: null, quantizationStepC: 0.1 });
    expect(m.bits).toBe(12);
    const chain = sensorChainSchema.parse(m.sensor);
    expect(m.stepC).toBeCloseTo((adcStepMa(12, chain.analogInput.rangeLowMa, chain.analogInput.rangeHighMa) * 200) / 16, 12);
    expect(m.stepC!).toBeGreaterThan(0.05);
    expect(m.stepC!).toBeLessThan(0.15);
  });

  it("keeps a wider transmitter range when asked, and scales both figures with it", () => {
    const m = sensorMatching({ noiseSigmaC: 0.2, quantizationStepC: 0.5 }, 400);
    const chain = sensorChainSchema.parse(m.sensor);
    expect(chain.transmitter.rangeHighC).toBe(400);
    // the log's rounding (q²/12 of a uniform quantizer; Widrow & Kollár, from memory) is taken out of σ
    expect(noiseSigmaC(chain)).toBeCloseTo(Math.sqrt(0.2 ** 2 - 0.5 ** 2 / 12), 12);
    expect(Math.abs(Math.log2(m.stepC! / 0.5))).toBeLessThanOrEqual(0.5 + 1e-9);
  });
});
