import { describe, expect, it } from "vitest";
import { AnalogInput, adcCode, adcStepMa } from "../../../sim/sensor/adc";

describe("analog input quantisation (mid-tread uniform quantiser, common practice)", () => {
  it("step of an N-bit converter over its range is span / (2ᴺ − 1)", () => {
    expect(adcStepMa(12, 0, 24)).toBeCloseTo(24 / 4095, 15);
    expect(adcStepMa(16, 0, 24)).toBeCloseTo(24 / 65535, 15);
    expect(new AnalogInput(8, 4, 20).stepMa).toBeCloseTo(16 / 255, 15);
  });

  it("readings are multiples of the step, with error ≤ half a step", () => {
    const ai = new AnalogInput(10, 0, 24);
    const step = 24 / 1023;
    let worst = 0;
    for (let i = 0; i <= 24; i += 0.0123) {
      const q = ai.quantize(i);
      const codes = q / step;
      expect(Math.abs(codes - Math.round(codes))).toBeLessThan(1e-9);
      worst = Math.max(worst, Math.abs(q - i));
    }
    expect(worst).toBeLessThanOrEqual(step / 2 + 1e-12);
    expect(worst).toBeGreaterThan(0.45 * step); // the error really reaches about half a step
  });

  it("saturates at the end codes", () => {
    const ai = new AnalogInput(12, 0, 24);
    expect(ai.code(-1)).toBe(0);
    expect(ai.code(30)).toBe(4095);
    expect(ai.quantize(30)).toBe(24);
    expect(adcCode(12, 12, 0, 24)).toBe(2048); // 12/24 · 4095 = 2047.5 → rounds to 2048
  });

  it("a 12-bit input over 0–24 mA resolves 0.0059 mA, i.e. 0.073 °C on a 0–200 °C transmitter", () => {
    const stepMa = adcStepMa(12, 0, 24);
    expect((stepMa / 16) * 200).toBeCloseTo(0.0733, 4);
  });
});
