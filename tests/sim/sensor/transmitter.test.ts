import { describe, expect, it } from "vitest";
import {
  temperatureToLoopCurrentMa,
  transmitterOutputMa,
  loopCurrentToTemperatureC,
  loopCurrentToPercentOfSpan,
  isElementFailed,
  NE43_MEASUREMENT_MIN_MA,
  NE43_MEASUREMENT_MAX_MA,
  type TransmitterParams,
} from "../../../sim/sensor/transmitter";
import { pt100Resistance } from "../../../sim/sensor/pt100";

const tx: TransmitterParams = { rangeLowC: 0, rangeHighC: 200, failureDirection: "downscale", failureLowMa: 3.6, failureHighMa: 21 };

describe("4–20 mA transmitter with NAMUR NE 43 levels", () => {
  it("linear 4–20 mA over the range", () => {
    expect(temperatureToLoopCurrentMa(0, 0, 200)).toBe(4);
    expect(temperatureToLoopCurrentMa(100, 0, 200)).toBe(12);
    expect(temperatureToLoopCurrentMa(200, 0, 200)).toBe(20);
    expect(transmitterOutputMa(pt100Resistance(150), tx)).toBeCloseTo(16, 9);
  });

  it("out-of-range temperatures clip at the NE 43 measurement limits 3.8 and 20.5 mA", () => {
    // NAMUR NE 43: measurement information 3.8 ≤ I ≤ 20.5 mA (references §11, CONFIRMED-2nd).
    expect(NE43_MEASUREMENT_MIN_MA).toBe(3.8);
    expect(NE43_MEASUREMENT_MAX_MA).toBe(20.5);
    expect(temperatureToLoopCurrentMa(-50, 0, 200)).toBe(3.8);
    expect(temperatureToLoopCurrentMa(400, 0, 200)).toBe(20.5);
    // Linear under/over-range up to the limits: −2 °C on 0–200 is 3.84 mA, 205 °C is 20.4 mA.
    expect(temperatureToLoopCurrentMa(-2, 0, 200)).toBeCloseTo(3.84, 12);
    expect(temperatureToLoopCurrentMa(205, 0, 200)).toBeCloseTo(20.4, 12);
  });

  it("a failed element drives the configured failure current: ≤ 3.6 mA downscale, ≥ 21 mA upscale", () => {
    // NAMUR NE 43: failure signal I ≤ 3.6 mA or I ≥ 21.0 mA (references §11).
    expect(transmitterOutputMa(Infinity, tx)).toBe(3.6); // open element
    expect(transmitterOutputMa(0, tx)).toBe(3.6); // shorted element
    const up = { ...tx, failureDirection: "upscale" as const };
    expect(transmitterOutputMa(Infinity, up)).toBe(21);
    expect(transmitterOutputMa(1, up)).toBe(21); // shorted behind 2 × 0.5 Ω leads
    expect(isElementFailed(pt100Resistance(-200))).toBe(false);
    expect(isElementFailed(pt100Resistance(850))).toBe(false);
    expect(isElementFailed(NaN)).toBe(true);
  });

  it("percent-of-span readings of the NE 43 levels (references §11 check values)", () => {
    expect(loopCurrentToPercentOfSpan(3.6)).toBeCloseTo(-2.5, 12);
    expect(loopCurrentToPercentOfSpan(3.8)).toBeCloseTo(-1.25, 12);
    expect(loopCurrentToPercentOfSpan(20.5)).toBeCloseTo(103.125, 12);
    expect(loopCurrentToPercentOfSpan(21)).toBeCloseTo(106.25, 12);
    expect(loopCurrentToTemperatureC(12, 0, 200)).toBe(100);
    expect(loopCurrentToTemperatureC(temperatureToLoopCurrentMa(37.3, -50, 250), -50, 250)).toBeCloseTo(37.3, 12);
  });
});
