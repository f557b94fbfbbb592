import { describe, expect, it } from "vitest";
import {
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  celsiusToKelvin,
  kelvinToCelsius,
  deltaCelsiusToFahrenheit,
  deltaFahrenheitToCelsius,
  temperatureToDisplay,
  temperatureFromDisplay,
  temperatureDeltaToDisplay,
  temperatureDeltaFromDisplay,
  gainPerCelsiusToDisplay,
  gainPerCelsiusFromDisplay,
  secondsToMinutes,
  minutesToSeconds,
  secondsToHours,
  hoursToSeconds,
  integralTimeToRepeatsPerMinute,
  repeatsPerMinuteToIntegralTime,
  integralTimeToMinutesPerRepeat,
  gainToProportionalBand,
  proportionalBandToGain,
  gainToProportionalBandDegrees,
  proportionalBandDegreesToGain,
  gainToDimensionless,
  dimensionlessToGain,
  joulesToKilowattHours,
} from "../../sim/units";

describe("absolute temperatures", () => {
  it("fixed points: water freezes at 0 °C = 32 °F, boils at 100 °C = 212 °F; −40 is the same on both (°F definition)", () => {
    expect(celsiusToFahrenheit(0)).toBe(32);
    expect(celsiusToFahrenheit(100)).toBe(212);
    expect(celsiusToFahrenheit(-40)).toBe(-40);
    expect(fahrenheitToCelsius(212)).toBe(100);
    expect(celsiusToKelvin(0)).toBe(273.15);
    expect(kelvinToCelsius(300)).toBeCloseTo(26.85, 12);
  });

  it("round trip °C → °F → °C and K over −200…850 °C", () => {
    for (let t = -200; t <= 850; t += 13.7) {
      expect(fahrenheitToCelsius(celsiusToFahrenheit(t))).toBeCloseTo(t, 10);
      expect(kelvinToCelsius(celsiusToKelvin(t))).toBeCloseTo(t, 10);
      expect(temperatureFromDisplay(temperatureToDisplay(t, "F"), "F")).toBeCloseTo(t, 10);
      expect(temperatureToDisplay(t, "C")).toBe(t);
    }
  });
});

describe("temperature differences (no 32 °F offset)", () => {
  it("a 10 °C difference is 18 °F, while 10 °C absolute is 50 °F", () => {
    expect(deltaCelsiusToFahrenheit(10)).toBe(18);
    expect(celsiusToFahrenheit(10)).toBe(50);
    expect(deltaFahrenheitToCelsius(9)).toBe(5);
    expect(temperatureDeltaToDisplay(10, "F")).toBe(18);
  });

  it("round trip of differences, and the difference of two absolute conversions equals the difference conversion", () => {
    for (let d = -300; d <= 300; d += 7.3) {
      expect(deltaFahrenheitToCelsius(deltaCelsiusToFahrenheit(d))).toBeCloseTo(d, 10);
      expect(temperatureDeltaFromDisplay(temperatureDeltaToDisplay(d, "F"), "F")).toBeCloseTo(d, 10);
      const a = 37.5;
      expect(celsiusToFahrenheit(a + d) - celsiusToFahrenheit(a)).toBeCloseTo(deltaCelsiusToFahrenheit(d), 9);
    }
  });

  it("a gain per °C converts as the inverse of a difference: 2 %/°C = 1.111 %/°F, and back", () => {
    expect(gainPerCelsiusToDisplay(2, "F")).toBeCloseTo(10 / 9, 12);
    expect(gainPerCelsiusFromDisplay(gainPerCelsiusToDisplay(3.3, "F"), "F")).toBeCloseTo(3.3, 12);
    expect(gainPerCelsiusToDisplay(3.3, "C")).toBe(3.3);
  });
});

describe("time and integral action", () => {
  it("seconds ↔ minutes ↔ hours", () => {
    expect(secondsToMinutes(90)).toBe(1.5);
    expect(minutesToSeconds(secondsToMinutes(123.4))).toBeCloseTo(123.4, 12);
    expect(secondsToHours(7200)).toBe(2);
    expect(hoursToSeconds(0.5)).toBe(1800);
  });

  it("repeats per minute = 60 / Ti[s] (common practice); Ti = 0 ↔ 0 repeats (no integral)", () => {
    expect(integralTimeToRepeatsPerMinute(120)).toBe(0.5);
    expect(integralTimeToRepeatsPerMinute(30)).toBe(2);
    expect(repeatsPerMinuteToIntegralTime(2)).toBe(30);
    expect(integralTimeToRepeatsPerMinute(0)).toBe(0);
    expect(repeatsPerMinuteToIntegralTime(0)).toBe(0);
    expect(integralTimeToMinutesPerRepeat(90)).toBe(1.5);
    for (const ti of [0.5, 7, 45, 600, 3600]) expect(repeatsPerMinuteToIntegralTime(integralTimeToRepeatsPerMinute(ti))).toBeCloseTo(ti, 9);
  });
});

describe("gain ↔ proportional band (common practice: PB = 100 % / dimensionless gain)", () => {
  it("a 0–200 °C span with PB 50 % means 100 °C moves OUT through 100 %: Kc = 1 %/°C", () => {
    expect(proportionalBandToGain(50, 200)).toBe(1);
    expect(gainToProportionalBand(1, 200)).toBe(50);
    expect(gainToProportionalBandDegrees(1)).toBe(100);
    expect(proportionalBandDegreesToGain(25)).toBe(4);
    expect(gainToDimensionless(1, 200)).toBe(2);
    expect(dimensionlessToGain(2, 200)).toBe(1);
  });

  it("round trips and Kc = 0 ↔ infinite band", () => {
    for (const kc of [0.05, 0.8, 2, 15]) {
      expect(proportionalBandToGain(gainToProportionalBand(kc, 150), 150)).toBeCloseTo(kc, 12);
      expect(dimensionlessToGain(gainToDimensionless(kc, 150), 150)).toBeCloseTo(kc, 12);
    }
    expect(gainToProportionalBand(0, 200)).toBe(Infinity);
    expect(() => gainToProportionalBand(1, 0)).toThrow(RangeError);
  });

  it("energy: 3.6 MJ = 1 kWh (definition)", () => {
    expect(joulesToKilowattHours(3.6e6)).toBe(1);
  });
});
