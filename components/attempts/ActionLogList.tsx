"use client";
/**
 * An attempt's operator actions in words, one line each: the sample index, the time (mm:ss) and
 * what it did, e.g. "Kc 4 → 6 %/°C, Ti 300 s → 240 s", "SP 60.0 °C", "manual OUT 35 %",
 * "relay test: on/off 60 % / 20 %, hysteresis 0.4 °C".
 */
import { useState } from "react";
import { formatElapsed } from "@/components/trend/format";
import { controllerConfigSchema } from "@/sim/control/config";

type Obj = Record<string, unknown>;

export interface LoggedAction {
  sample: number;
  type: string;
  [k: string]: unknown;
}

const num = (x: unknown, digits?: number): string => {
  if (typeof x !== "number" || !Number.isFinite(x)) return "?";
  if (digits !== undefined) return x.toFixed(digits);
  return String(Number(x.toPrecision(6)));
};

/** The tuning fields worth naming when they change, with their units. */
const TUNING_FIELDS: { key: string; name: string; unit: string }[] = [
  { key: "kind", name: "controller", unit: "" },
  { key: "form", name: "form", unit: "" },
  { key: "kc", name: "Kc", unit: " %/°C" },
  { key: "ti", name: "Ti", unit: " s" },
  { key: "td", name: "Td", unit: " s" },
  { key: "ki", name: "Ki", unit: " %/(°C·s)" },
  { key: "kd", name: "Kd", unit: " %·s/°C" },
  { key: "action", name: "action", unit: "" },
  { key: "derivativeOn", name: "D on", unit: "" },
  { key: "derivativeFilterN", name: "N", unit: "" },
  { key: "setpointWeightB", name: "b", unit: "" },
  { key: "setpointWeightC", name: "c", unit: "" },
  { key: "antiWindup", name: "anti-windup", unit: "" },
  { key: "trackingTimeS", name: "Tt", unit: " s" },
  { key: "outMinPct", name: "OUT min", unit: " %" },
  { key: "outMaxPct", name: "OUT max", unit: " %" },
  { key: "outRateLimitPctPerS", name: "OUT rate limit", unit: " %/s" },
  { key: "deadbandC", name: "deadband", unit: " °C" },
  { key: "pvFilterTauS", name: "PV filter τf", unit: " s" },
  { key: "sampleTimeS", name: "sample time", unit: " s" },
  { key: "spTrackInManual", name: "SP tracking", unit: "" },
  { key: "badPvPolicy", name: "bad PV", unit: "" },
  { key: "safeOutputPct", name: "safe OUT", unit: " %" },
  { key: "hysteresisC", name: "hysteresis", unit: " °C" },
  { key: "outOnPct", name: "OUT on", unit: " %" },
  { key: "outOffPct", name: "OUT off", unit: " %" },
];

const show = (v: unknown, unit: string) => (typeof v === "number" ? `${num(v)}${unit}` : typeof v === "boolean" ? (v ? "on" : "off") : v === undefined ? "—" : String(v));

/** "Kc 4 → 6 %/°C, Ti 300 s → 240 s" against the controller in force before (or every set field without one). */
export function describeTuning(next: Obj, before: Obj | null): string {
  if (next.kind === "onoff" && (!before || before.kind !== "onoff")) {
    return `relay test: on/off ${num(next.outOnPct ?? 100)} % / ${num(next.outOffPct ?? 0)} %, hysteresis ${num(next.hysteresisC ?? 1)} °C`;
  }
  if (before && before.kind === "onoff" && next.kind !== "onoff") {
    const k = [`Kc ${num(next.kc)} %/°C`, `Ti ${num(next.ti)} s`];
    if (typeof next.td === "number" && next.td > 0) k.push(`Td ${num(next.td)} s`);
    return `relay test ended: PID ${k.join(", ")}`;
  }
  const parts: string[] = [];
  for (const f of TUNING_FIELDS) {
    const a = before?.[f.key];
    const b = next[f.key];
    if (b === undefined) continue;
    if (before && a === b) continue;
    if (before && a !== undefined) {
      // gains carry their (compound) unit once, at the end; times, temperatures and outputs on both sides
      const once = f.unit.includes("/") || f.unit === "";
      parts.push(typeof b === "number" && typeof a === "number" ? `${f.name} ${num(a)}${once ? "" : f.unit} → ${num(b)}${f.unit}` : `${f.name} ${show(a, f.unit)} → ${show(b, f.unit)}`);
    } else if (!before && ["kc", "ti", "td"].includes(f.key)) {
      parts.push(`${f.name} ${show(b, f.unit)}`);
    } else if (before) parts.push(`${f.name} ${show(b, f.unit)}`);
  }
  if (parts.length === 0) return "tuning re-entered (no change)";
  return parts.join(", ");
}

function describeDisturbance(e: Obj): string {
  const t = String(e.type);
  const dur = typeof e.durationS === "number" ? ` for ${formatElapsed(e.durationS)}` : "";
  switch (t) {
    case "inlet-blockage":
      return `disturbance: inlet ${num(e.percent)} % blocked${dur}`;
    case "door-open":
      return `disturbance: door opened${dur}`;
    case "ambient":
      return `disturbance: ambient ${num(e.temperatureC, 1)} °C${dur}`;
    case "supply-voltage":
      return `disturbance: supply ${num(e.percentOfNominal)} % of nominal${dur}`;
    case "cold-load":
      return `disturbance: cold load${typeof e.massKg === "number" ? ` ${num(e.massKg)} kg` : ""}${typeof e.temperatureC === "number" ? ` at ${num(e.temperatureC, 1)} °C` : ""}${dur}`;
    case "sensor-noise":
      return `disturbance: sensor noise +${num(e.extraNoiseSdMa)} mA${dur}`;
    case "sensor-fault":
      return `disturbance: sensor fault${typeof e.fault === "string" ? ` (${e.fault})` : ""}${dur}`;
    default:
      return `disturbance: ${t}${dur}`;
  }
}

/**
 * Words for one logged action. `before` is the controller in force before it (for tuning
 * changes); pass null when unknown.
 */
export function describeAction(a: LoggedAction, before: Obj | null = null): string {
  switch (a.type) {
    case "setpoint":
      return `SP ${num(a.setpointC, 1)} °C`;
    case "mode":
      return a.mode === "manual" ? "to manual" : "to auto";
    case "manual-output":
      return `manual OUT ${num(a.outPercent)} %`;
    case "tuning":
      return describeTuning((a.controller ?? {}) as Obj, before);
    case "cutout-reset":
      return "cutout reset";
    case "disturbance":
      return describeDisturbance((a.event ?? {}) as Obj);
    default:
      return a.type;
  }
}

export interface ActionLine {
  sample: number;
  timeS: number;
  text: string;
  type: string;
}

/** The log as lines: times from the trace when given (timeOf), else sample × sample time. */
/** A controller with its defaults filled in (so a diff names only real changes); as given when it does not parse. */
function full(c: unknown): Obj | null {
  if (!c || typeof c !== "object") return null;
  const p = controllerConfigSchema.safeParse(c);
  return p.success ? (p.data as Obj) : (c as Obj);
}

export function actionLines(actions: readonly unknown[], startController: Obj | null, sampleTimeS: number, timeOf?: (sample: number) => number | undefined): ActionLine[] {
  let controller: Obj | null = full(startController);
  const out: ActionLine[] = [];
  for (const raw of actions) {
    if (!raw || typeof raw !== "object") continue;
    const a = (raw as LoggedAction).type === "tuning" ? ({ ...(raw as LoggedAction), controller: full((raw as LoggedAction).controller) } as LoggedAction) : (raw as LoggedAction);
    const sample = typeof a.sample === "number" ? a.sample : 0;
    const text = describeAction(a, controller);
    if (a.type === "tuning" && a.controller && typeof a.controller === "object") controller = a.controller as Obj;
    out.push({ sample, timeS: timeOf?.(sample) ?? sample * sampleTimeS, text, type: a.type });
  }
  return out;
}

/** A long log (a relay test by hand, a nervous operator) lists this many lines until asked for all. */
const LIST_LIMIT = 500;

export function ActionLogList({ actions, controller, sampleTimeS, timeOf }: { actions: readonly unknown[]; controller: Obj | null; sampleTimeS: number; timeOf?: (sample: number) => number | undefined }) {
  const [all, setAll] = useState(false);
  const lines = actionLines(actions, controller, sampleTimeS, timeOf);
  if (lines.length === 0) return <p className="text-sm text-ink-faint">No operator actions: the run went untouched from its starting tuning.</p>;
  const shown = all ? lines : lines.slice(0, LIST_LIMIT);
  return (
    <div className="space-y-1">
      <ol className="max-h-80 divide-y divide-rule overflow-y-auto border-y border-rule text-sm" data-testid="action-log">
        {shown.map((l, i) => (
          <li key={i} className="flex gap-3 py-1" data-testid="action-log-item">
            <span className="num w-16 shrink-0 text-right text-ink-faint" title="sample index">
              #{l.sample}
            </span>
            <span className="num w-16 shrink-0 text-ink-soft">{formatElapsed(l.timeS)}</span>
            <span>{l.text}</span>
          </li>
        ))}
      </ol>
      {shown.length < lines.length ? (
        <button type="button" onClick={() => setAll(true)} className="text-xs underline decoration-rule-strong underline-offset-2 hover:decoration-ink">
          show all <span className="num">{lines.length}</span> actions
        </button>
      ) : null}
    </div>
  );
}
