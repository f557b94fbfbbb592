/**
 * Display conversions. The engine works in SI and °C, times in seconds, controller gain Kc in
 * % output per °C; these functions convert to and from what people enter and read.
 *
 * Absolute temperatures and temperature differences are converted by different functions on
 * purpose: 10 °C is 50 °F, but a 10 °C *difference* (a step, a hysteresis band, an overshoot) is
 * 18 °F. Mixing the two is the classic unit bug (it adds or drops the 32 °F offset).
 */

// ---- temperature: absolute values (ITS-90 relation °F = °C·9/5 + 32, by definition) ----

/** Absolute temperature, °C → °F. */
export function celsiusToFahrenheit(tC: number): number {
  return (tC * 9) / 5 + 32;
}

/** Absolute temperature, °F → °C. */
export function fahrenheitToCelsius(tF: number): number {
  return ((tF - 32) * 5) / 9;
}

/** Absolute temperature, °C → K (0 °C = 273.15 K by definition). */
export function celsiusToKelvin(tC: number): number {
  return tC + 273.15;
}

/** Absolute temperature, K → °C. */
export function kelvinToCelsius(tK: number): number {
  return tK - 273.15;
}

// ---- temperature: differences (a kelvin is a degree Celsius; a degree Fahrenheit is 5/9 K) ----

/** Temperature difference, °C (= K) → °F. No offset. */
export function deltaCelsiusToFahrenheit(dC: number): number {
  return (dC * 9) / 5;
}

/** Temperature difference, °F → °C (= K). No offset. */
export function deltaFahrenheitToCelsius(dF: number): number {
  return (dF * 5) / 9;
}

export type TemperatureUnit = "C" | "F";

/** Absolute temperature from °C into the display unit. */
export function temperatureToDisplay(tC: number, unit: TemperatureUnit): number {
  return unit === "C" ? tC : celsiusToFahrenheit(tC);
}

/** Absolute temperature from the display unit into °C. */
export function temperatureFromDisplay(t: number, unit: TemperatureUnit): number {
  return unit === "C" ? t : fahrenheitToCelsius(t);
}

/** Temperature difference from °C into the display unit. */
export function temperatureDeltaToDisplay(dC: number, unit: TemperatureUnit): number {
  return unit === "C" ? dC : deltaCelsiusToFahrenheit(dC);
}

/** Temperature difference from the display unit into °C. */
export function temperatureDeltaFromDisplay(d: number, unit: TemperatureUnit): number {
  return unit === "C" ? d : deltaFahrenheitToCelsius(d);
}

/** A gain in % per °C into % per display degree (a per-difference quantity: divides by 9/5 for °F). */
export function gainPerCelsiusToDisplay(kcPctPerC: number, unit: TemperatureUnit): number {
  return unit === "C" ? kcPctPerC : (kcPctPerC * 5) / 9;
}

/** A gain in % per display degree into % per °C. */
export function gainPerCelsiusFromDisplay(kc: number, unit: TemperatureUnit): number {
  return unit === "C" ? kc : (kc * 9) / 5;
}

// ---- time ----

export function secondsToMinutes(s: number): number {
  return s / 60;
}

export function minutesToSeconds(min: number): number {
  return min * 60;
}

export function secondsToHours(s: number): number {
  return s / 3600;
}

export function hoursToSeconds(h: number): number {
  return h * 3600;
}

// ---- integral action: integral (reset) time ↔ repeats per minute ----
// Repeats per minute is how many times per minute the integral action repeats the proportional
// action for a constant error: 60 / Ti[s] (common practice). The engine encodes "no integral
// action" as Ti = 0 (JSON cannot carry Infinity), which corresponds to 0 repeats per minute.

/** Integral time Ti (s; 0 = no integral action) → repeats per minute (0 = no integral action). */
export function integralTimeToRepeatsPerMinute(tiS: number): number {
  if (tiS === 0 || !Number.isFinite(tiS)) return 0;
  return 60 / tiS;
}

/** Repeats per minute (0 = no integral action) → integral time Ti in s (0 = no integral action). */
export function repeatsPerMinuteToIntegralTime(repeatsPerMin: number): number {
  if (repeatsPerMin === 0 || !Number.isFinite(repeatsPerMin)) return 0;
  return 60 / repeatsPerMin;
}

/** Integral time Ti (s) → minutes per repeat (the same quantity in minutes). */
export function integralTimeToMinutesPerRepeat(tiS: number): number {
  return tiS / 60;
}

// ---- gain ↔ proportional band ----
// Proportional band PB (% of the transmitter span) is the change of PV, as a percentage of the
// span, that moves OUT through 100 %: PB = 100 % / Kc_dimensionless with
// Kc_dimensionless = Kc[%/°C] · span[°C] / 100 %. Hence PB = 10⁴ / (Kc · span) (common practice).

/** Gain Kc (% output per °C) → proportional band (% of span). Kc = 0 gives Infinity (no proportional action). */
export function gainToProportionalBand(kcPctPerC: number, spanC: number): number {
  assertSpan(spanC);
  return 10000 / (kcPctPerC * spanC);
}

/** Proportional band (% of span) → gain Kc (% output per °C). */
export function proportionalBandToGain(pbPct: number, spanC: number): number {
  assertSpan(spanC);
  return 10000 / (pbPct * spanC);
}

/** Gain Kc (% output per °C) → proportional band expressed as a temperature width (°C): 100 / Kc. */
export function gainToProportionalBandDegrees(kcPctPerC: number): number {
  return 100 / kcPctPerC;
}

/** Proportional band width in °C → gain Kc (% output per °C). */
export function proportionalBandDegreesToGain(pbC: number): number {
  return 100 / pbC;
}

/** Gain Kc (% per °C) → dimensionless gain (% output per % of span). */
export function gainToDimensionless(kcPctPerC: number, spanC: number): number {
  assertSpan(spanC);
  return (kcPctPerC * spanC) / 100;
}

/** Dimensionless gain (% output per % of span) → Kc (% per °C). */
export function dimensionlessToGain(k: number, spanC: number): number {
  assertSpan(spanC);
  return (k * 100) / spanC;
}

function assertSpan(spanC: number): void {
  if (!(spanC > 0) || !Number.isFinite(spanC)) throw new RangeError(`transmitter span must be a positive finite °C, got ${spanC}`);
}

// ---- energy ----

/** Joules → kilowatt-hours (1 kWh = 3.6 MJ). */
export function joulesToKilowattHours(j: number): number {
  return j / 3.6e6;
}
