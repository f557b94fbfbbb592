/** A sweep: one controller parameter over a list of values, everything else held. */
import type { ControllerConfig, ControllerConfigInput } from "../control/config";
import type { Variant } from "./variants";

export const SWEEP_PARAMETERS = {
  pvFilterTauS: { label: "PV filter τf", unit: "s" },
  kc: { label: "Gain Kc", unit: "%/°C" },
  ti: { label: "Integral Ti", unit: "s" },
  td: { label: "Derivative Td", unit: "s" },
  setpointWeightB: { label: "SP weight b", unit: "" },
  derivativeFilterN: { label: "Derivative filter N", unit: "" },
} as const satisfies Partial<Record<keyof ControllerConfig, { label: string; unit: string }>>;

export type SweepParameter = keyof typeof SWEEP_PARAMETERS;

export function sweepVariants(base: ControllerConfigInput, parameter: SweepParameter, values: readonly number[]): Variant[] {
  const { label, unit } = SWEEP_PARAMETERS[parameter];
  return values.map((v) => ({ label: `${label} = ${v}${unit ? ` ${unit}` : ""}`, controller: { ...base, [parameter]: v } }));
}

/** The same loop as PI (Td = 0) and as PID (the given or current Td). */
export function piVersusPidVariants(base: ControllerConfigInput, pid: { kc: number; ti: number; td: number }, pi: { kc: number; ti: number }): Variant[] {
  return [
    { label: `PI (Kc ${pi.kc}, Ti ${pi.ti} s)`, controller: { ...base, kc: pi.kc, ti: pi.ti, td: 0 } },
    { label: `PID (Kc ${pid.kc}, Ti ${pid.ti} s, Td ${pid.td} s)`, controller: { ...base, kc: pid.kc, ti: pid.ti, td: pid.td } },
  ];
}

/** Parses "0, 0.5, 1 2;4" into numbers; refuses anything else with a message. */
export function parseValueList(text: string): { ok: true; values: number[] } | { ok: false; error: string } {
  const parts = text.split(/[\s,;]+/).filter(Boolean);
  if (parts.length < 2) return { ok: false, error: "Give at least two values, separated by commas or spaces." };
  if (parts.length > 24) return { ok: false, error: "At most 24 values in one sweep." };
  const values = parts.map(Number);
  const bad = parts.find((p, i) => !Number.isFinite(values[i]) || values[i] < 0);
  if (bad !== undefined) return { ok: false, error: `"${bad}" is not a non-negative number.` };
  return { ok: true, values };
}
