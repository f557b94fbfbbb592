/**
 * The controller form's conversions between the engine's canonical units (Kc in % per °C, times
 * in s, temperature differences in °C) and what the user prefers to read and type (PB in % of
 * span, minutes or repeats per minute, °F). Temperature *differences* (deadband, hysteresis) are
 * converted as differences, never as absolute temperatures.
 */
import { controllerConfigSchema, type ControllerConfig } from "@/sim/control/config";
import {
  gainPerCelsiusFromDisplay,
  gainPerCelsiusToDisplay,
  gainToProportionalBand,
  integralTimeToRepeatsPerMinute,
  minutesToSeconds,
  proportionalBandToGain,
  repeatsPerMinuteToIntegralTime,
  secondsToMinutes,
  temperatureDeltaFromDisplay,
  temperatureDeltaToDisplay,
} from "@/sim/units";
import type { DisplayUnits } from "./store";

export const NUMERIC_FIELDS = [
  "kc",
  "ti",
  "td",
  "ki",
  "kd",
  "derivativeFilterN",
  "setpointWeightB",
  "setpointWeightC",
  "trackingTimeS",
  "outMinPct",
  "outMaxPct",
  "outRateLimitPctPerS",
  "deadbandC",
  "pvFilterTauS",
  "sampleTimeS",
  "safeOutputPct",
  "hysteresisC",
  "outOnPct",
  "outOffPct",
] as const;
export type NumericField = (typeof NUMERIC_FIELDS)[number];
export type ControllerFormValues = Record<NumericField, string> &
  Pick<ControllerConfig, "kind" | "form" | "action" | "derivativeOn" | "antiWindup" | "badPvPolicy" | "spTrackInManual">;

/** The unit label shown beside a field, for the user's preferences. */
export function unitLabel(field: NumericField, u: DisplayUnits): string {
  const t = `°${u.temperature}`;
  switch (field) {
    case "kc":
      return u.gain === "pb" ? "% of span (PB)" : `%/${t}`;
    case "ti":
      return u.integral === "repeats/min" ? "repeats/min" : u.integral;
    case "td":
      return u.derivative;
    case "ki":
      return `%/(${t}·s)`;
    case "kd":
      return `%·s/${t}`;
    case "deadbandC":
    case "hysteresisC":
      return t;
    case "trackingTimeS":
    case "pvFilterTauS":
    case "sampleTimeS":
      return "s";
    case "outRateLimitPctPerS":
      return "%/s";
    case "outMinPct":
    case "outMaxPct":
    case "safeOutputPct":
    case "outOnPct":
    case "outOffPct":
      return "%";
    default:
      return "";
  }
}

const round = (v: number) => (Number.isFinite(v) ? String(Number(v.toPrecision(6))) : "");

function toDisplayNumber(field: NumericField, v: number, u: DisplayUnits, spanC: number): number {
  switch (field) {
    case "kc":
      return u.gain === "pb" ? (v > 0 ? gainToProportionalBand(v, spanC) : Infinity) : gainPerCelsiusToDisplay(v, u.temperature);
    case "ti":
      return u.integral === "repeats/min" ? integralTimeToRepeatsPerMinute(v) : u.integral === "min" ? secondsToMinutes(v) : v;
    case "td":
      return u.derivative === "min" ? secondsToMinutes(v) : v;
    case "ki":
    case "kd":
      return gainPerCelsiusToDisplay(v, u.temperature);
    case "deadbandC":
    case "hysteresisC":
      return temperatureDeltaToDisplay(v, u.temperature);
    default:
      return v;
  }
}

function fromDisplayNumber(field: NumericField, v: number, u: DisplayUnits, spanC: number): number {
  switch (field) {
    case "kc":
      return u.gain === "pb" ? proportionalBandToGain(v, spanC) : gainPerCelsiusFromDisplay(v, u.temperature);
    case "ti":
      return u.integral === "repeats/min" ? repeatsPerMinuteToIntegralTime(v) : u.integral === "min" ? minutesToSeconds(v) : v;
    case "td":
      return u.derivative === "min" ? minutesToSeconds(v) : v;
    case "ki":
    case "kd":
      return gainPerCelsiusFromDisplay(v, u.temperature);
    case "deadbandC":
    case "hysteresisC":
      return temperatureDeltaFromDisplay(v, u.temperature);
    default:
      return v;
  }
}

export function toFormValues(cfg: ControllerConfig, u: DisplayUnits, spanC: number): ControllerFormValues {
  const values = {
    kind: cfg.kind,
    form: cfg.form,
    action: cfg.action,
    derivativeOn: cfg.derivativeOn,
    antiWindup: cfg.antiWindup,
    badPvPolicy: cfg.badPvPolicy,
    spTrackInManual: cfg.spTrackInManual,
  } as ControllerFormValues;
  for (const f of NUMERIC_FIELDS) values[f] = round(toDisplayNumber(f, cfg[f], u, spanC));
  return values;
}

export type FormParse = { ok: true; config: ControllerConfig } | { ok: false; errors: Partial<Record<keyof ControllerConfig | "form", string>> };

export function fromFormValues(values: ControllerFormValues, u: DisplayUnits, spanC: number): FormParse {
  const errors: Partial<Record<string, string>> = {};
  const numbers: Partial<Record<NumericField, number>> = {};
  for (const f of NUMERIC_FIELDS) {
    const text = values[f].trim().replace(",", ".");
    const v = Number(text);
    if (text === "" || !Number.isFinite(v)) {
      errors[f] = "Enter a number.";
      continue;
    }
    if (f === "kc" && u.gain === "pb" && !(v > 0)) {
      errors[f] = "The proportional band must be above 0 %.";
      continue;
    }
    numbers[f] = fromDisplayNumber(f, v, u, spanC);
  }
  if (Object.keys(errors).length) return { ok: false, errors };
  const parsed = controllerConfigSchema.safeParse({
    kind: values.kind,
    form: values.form,
    action: values.action,
    derivativeOn: values.derivativeOn,
    antiWindup: values.antiWindup,
    badPvPolicy: values.badPvPolicy,
    spTrackInManual: values.spTrackInManual,
    ...numbers,
  });
  if (!parsed.success) {
    for (const issue of parsed.error.issues) errors[String(issue.path[0] ?? "form")] ??= issue.message;
    return { ok: false, errors };
  }
  return { ok: true, config: parsed.data };
}
