"use client";
/**
 * The drill's event timeline: add, move (edit the time) and delete events of every type the
 * engine offers, each with its time, duration and size in units. Every row is validated as the
 * user types with the engine's own drillEventSchema (plus "not after the end of the drill"); the
 * parent gets the parsed events and whether every row is valid.
 */
import { useMemo, useRef, useState } from "react";
import { drillEventSchema, type DrillEvent } from "@/sim/drill/schema";
import { formatElapsed } from "@/components/trend/format";

type EventType = DrillEvent["type"];

interface FieldSpec {
  name: string;
  label: string;
  unit?: string;
  /** select fields */
  options?: [string, string][];
  optional?: boolean;
  initial: string;
  hint?: string;
}

const duration = (optional: boolean, initial = ""): FieldSpec => ({
  name: "durationS",
  label: "Duration",
  unit: "s",
  optional,
  initial,
  hint: optional ? "empty = stays until the end" : undefined,
});

export const EVENT_TYPES: { type: EventType; label: string; fields: FieldSpec[] }[] = [
  { type: "setpoint", label: "SP step", fields: [{ name: "setpointC", label: "New SP", unit: "°C", initial: "60" }] },
  {
    type: "setpoint-ramp",
    label: "SP ramp",
    fields: [
      { ...duration(false, "600"), label: "Ramp time" },
      { name: "fromC", label: "From", unit: "°C", initial: "50" },
      { name: "toC", label: "To", unit: "°C", initial: "70" },
    ],
  },
  { type: "mode", label: "Mode change", fields: [{ name: "mode", label: "Mode", options: [["manual", "manual"], ["auto", "auto"]], initial: "manual" }] },
  { type: "inlet-blockage", label: "Inlet blockage", fields: [{ name: "percent", label: "Blocked", unit: "%", initial: "50" }, duration(true, "900")] },
  { type: "door-open", label: "Door open", fields: [duration(false, "120"), { name: "extraAirflowM3PerH", label: "Extra air", unit: "m³/h", optional: true, initial: "", hint: "empty = the plant's door airflow" }] },
  { type: "ambient", label: "Ambient change", fields: [{ name: "temperatureC", label: "Ambient", unit: "°C", initial: "10" }, duration(true, "1800")] },
  { type: "supply-voltage", label: "Supply voltage", fields: [{ name: "percentOfNominal", label: "Voltage", unit: "% of nominal", initial: "90" }, duration(true, "600")] },
  {
    type: "cold-load",
    label: "Cold load",
    fields: [
      { name: "massKg", label: "Mass", unit: "kg", initial: "5" },
      { name: "specificHeatJPerKgK", label: "Specific heat", unit: "J/(kg·K)", initial: "900" },
      { name: "temperatureC", label: "Load temp.", unit: "°C", initial: "15" },
      { name: "airCouplingWPerK", label: "Coupling h·A", unit: "W/K", initial: "10" },
      duration(true),
    ],
  },
  { type: "sensor-noise", label: "Sensor noise", fields: [{ name: "extraNoiseSdMa", label: "Extra noise σ", unit: "mA", initial: "0.02" }, duration(true, "600")] },
  {
    type: "sensor-fault",
    label: "Sensor fault",
    fields: [
      { name: "fault", label: "Fault", options: [["open", "open element"], ["shorted", "shorted element"], ["lead-break", "lead break"]], initial: "open" },
      { name: "target", label: "Sensor", options: [["control", "controller's"], ["cutout", "cutout's"]], initial: "control" },
      duration(true, "120"),
    ],
  },
];

const specOf = (type: EventType) => EVENT_TYPES.find((t) => t.type === type)!;
export const eventLabel = (type: EventType) => specOf(type).label;

interface Row {
  key: number;
  type: EventType;
  timeS: string;
  values: Record<string, string>;
}

function rowOf(key: number, e: DrillEvent): Row {
  const values: Record<string, string> = {};
  const rec = e as unknown as Record<string, unknown>;
  for (const f of specOf(e.type).fields) values[f.name] = rec[f.name] === undefined ? "" : String(rec[f.name]);
  return { key, type: e.type, timeS: String(e.timeS), values };
}

function freshValues(type: EventType): Record<string, string> {
  return Object.fromEntries(specOf(type).fields.map((f) => [f.name, f.initial]));
}

/** The row as an engine event, or the message naming what is wrong. */
export function parseRow(row: Pick<Row, "type" | "timeS" | "values">, drillDurationS: number): { ok: true; event: DrillEvent } | { ok: false; error: string } {
  const spec = specOf(row.type);
  const out: Record<string, unknown> = { type: row.type };
  const time = Number(row.timeS);
  if (row.timeS.trim() === "" || !Number.isFinite(time)) return { ok: false, error: "Time must be a number of seconds." };
  if (time < 0) return { ok: false, error: "Time cannot be before the start (0 s)." };
  if (time > drillDurationS) return { ok: false, error: `Time is after the end of the drill (${drillDurationS} s).` };
  out.timeS = time;
  for (const f of spec.fields) {
    const text = (row.values[f.name] ?? "").trim();
    if (f.options) {
      out[f.name] = text;
      continue;
    }
    if (text === "") {
      if (f.optional) continue;
      return { ok: false, error: `${f.label} is required.` };
    }
    const x = Number(text);
    if (!Number.isFinite(x)) return { ok: false, error: `${f.label} must be a number${f.unit ? ` (${f.unit})` : ""}.` };
    if (f.name === "durationS" && x <= 0) return { ok: false, error: `${f.label} must be more than 0 s.` };
    out[f.name] = x;
  }
  const r = drillEventSchema.safeParse(out);
  if (!r.success) {
    const issue = r.error.issues[0];
    const field = spec.fields.find((f) => f.name === issue.path[0]);
    return { ok: false, error: `${field?.label ?? String(issue.path[0] ?? "Event")}: ${issue.message}` };
  }
  return { ok: true, event: r.data };
}

export interface TimelineEditorProps {
  events: readonly DrillEvent[];
  durationS: number;
  /** every change: the valid events (in time order) and whether all rows are valid */
  onChange: (events: DrillEvent[], allValid: boolean) => void;
  readOnly?: boolean;
}

export function TimelineEditor({ events, durationS, onChange, readOnly = false }: TimelineEditorProps) {
  const nextKey = useRef(events.length);
  const [rows, setRows] = useState<Row[]>(() => events.map((e, i) => rowOf(i, e)));
  const [addType, setAddType] = useState<EventType>("setpoint");
  const parsed = useMemo(() => rows.map((r) => parseRow(r, durationS)), [rows, durationS]);

  const commit = (next: Row[]) => {
    setRows(next);
    const results = next.map((r) => parseRow(r, durationS));
    const valid = results.flatMap((r) => (r.ok ? [r.event] : []));
    onChange([...valid].sort((a, b) => a.timeS - b.timeS), results.every((r) => r.ok));
  };
  const update = (key: number, change: (r: Row) => Row) => commit(rows.map((r) => (r.key === key ? change(r) : r)));
  const sortByTime = () => {
    const sorted = [...rows].sort((a, b) => (Number(a.timeS) || 0) - (Number(b.timeS) || 0));
    if (sorted.some((r, i) => r !== rows[i])) setRows(sorted);
  };
  const add = () => {
    const last = rows.reduce((m, r) => Math.max(m, Number(r.timeS) || 0), 0);
    const timeS = rows.length === 0 ? Math.min(300, durationS) : Math.min(last + 300, durationS);
    commit([...rows, { key: nextKey.current++, type: addType, timeS: String(timeS), values: freshValues(addType) }]);
  };

  return (
    <div className="space-y-2 text-sm" data-testid="timeline-editor">
      {rows.length === 0 ? <p className="text-ink-faint">No events: the plant runs undisturbed at the initial SP.</p> : null}
      <ol className="divide-y divide-rule border-y border-rule">
        {rows.map((row, i) => {
          const spec = specOf(row.type);
          const result = parsed[i];
          const time = Number(row.timeS);
          return (
            <li key={row.key} className="py-2" data-testid="timeline-row" aria-label={`Event ${i + 1}: ${spec.label}`}>
              <div className="flex flex-wrap items-end gap-x-3 gap-y-1.5">
                <label className="flex flex-col">
                  <span className="text-xs text-ink-faint">Time</span>
                  <span className="flex items-center gap-1">
                    <input
                      aria-label={`Event ${i + 1} time`}
                      inputMode="decimal"
                      value={row.timeS}
                      disabled={readOnly}
                      onChange={(e) => update(row.key, (r) => ({ ...r, timeS: e.target.value }))}
                      onBlur={sortByTime}
                      className="num w-20 rounded-sm border border-rule-strong bg-paper px-1.5 py-1 text-right disabled:bg-paper-sunk"
                    />
                    <span className="num text-xs text-ink-faint">s</span>
                    <span className="num w-14 text-xs text-ink-faint">{Number.isFinite(time) ? formatElapsed(time) : "—"}</span>
                  </span>
                </label>
                <label className="flex flex-col">
                  <span className="text-xs text-ink-faint">Event</span>
                  <select
                    aria-label={`Event ${i + 1} type`}
                    value={row.type}
                    disabled={readOnly}
                    onChange={(e) => {
                      const type = e.target.value as EventType;
                      update(row.key, (r) => ({ ...r, type, values: freshValues(type) }));
                    }}
                    className="rounded-sm border border-rule-strong bg-paper px-1.5 py-1"
                  >
                    {EVENT_TYPES.map((t) => (
                      <option key={t.type} value={t.type}>
                        {t.label}
                      </option>
                    ))}
                  </select>
                </label>
                {spec.fields.map((f) => (
                  <label key={f.name} className="flex flex-col" title={f.hint}>
                    <span className="text-xs text-ink-faint">{f.label}</span>
                    {f.options ? (
                      <select
                        aria-label={`Event ${i + 1} ${f.label.toLowerCase()}`}
                        value={row.values[f.name] ?? f.initial}
                        disabled={readOnly}
                        onChange={(e) => update(row.key, (r) => ({ ...r, values: { ...r.values, [f.name]: e.target.value } }))}
                        className="rounded-sm border border-rule-strong bg-paper px-1.5 py-1"
                      >
                        {f.options.map(([v, l]) => (
                          <option key={v} value={v}>
                            {l}
                          </option>
                        ))}
                      </select>
                    ) : (
                      <span className="flex items-center gap-1">
                        <input
                          aria-label={`Event ${i + 1} ${f.label.toLowerCase()}`}
                          inputMode="decimal"
                          placeholder={f.optional ? "—" : undefined}
                          value={row.values[f.name] ?? ""}
                          disabled={readOnly}
                          onChange={(e) => update(row.key, (r) => ({ ...r, values: { ...r.values, [f.name]: e.target.value } }))}
                          className="num w-20 rounded-sm border border-rule-strong bg-paper px-1.5 py-1 text-right disabled:bg-paper-sunk"
                        />
                        {f.unit ? <span className="num text-xs text-ink-faint">{f.unit}</span> : null}
                      </span>
                    )}
                  </label>
                ))}
                {readOnly ? null : (
                  <button type="button" onClick={() => commit(rows.filter((r) => r.key !== row.key))} aria-label={`Delete event ${i + 1}`} className="ml-auto pb-1 text-xs text-ink-faint hover:text-alarm">
                    Delete
                  </button>
                )}
              </div>
              {!result.ok ? (
                <p role="alert" className="mt-1 text-xs text-alarm">
                  {result.error}
                </p>
              ) : null}
            </li>
          );
        })}
      </ol>
      {readOnly ? null : (
        <div className="flex items-center gap-2">
          <select aria-label="New event type" value={addType} onChange={(e) => setAddType(e.target.value as EventType)} className="rounded-sm border border-rule-strong bg-paper px-1.5 py-1">
            {EVENT_TYPES.map((t) => (
              <option key={t.type} value={t.type}>
                {t.label}
              </option>
            ))}
          </select>
          <button type="button" onClick={add} className="rounded-sm border border-rule-strong bg-paper-raised px-3 py-1 hover:border-ink">
            Add event
          </button>
          <span className="text-xs text-ink-faint">Events with a duration return to nominal afterwards.</span>
        </div>
      )}
    </div>
  );
}
