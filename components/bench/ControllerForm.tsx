"use client";
/**
 * The controller block's settings in the user's preferred form and units, validated with the
 * engine's zod schema before anything reaches the worker. Applying is bumpless; a new sample
 * time restarts the run (the block's discretisation depends on it).
 */
import { useEffect, useMemo, useState } from "react";
import type { ControllerConfig } from "@/sim/control/config";
import { fromFormValues, toFormValues, unitLabel, type ControllerFormValues, type NumericField } from "./controller-units";
import type { DisplayUnits } from "./store";

export interface ControllerFormProps {
  config: ControllerConfig;
  units: DisplayUnits;
  spanC: number;
  onUnits: (u: DisplayUnits) => void;
  onApply: (cfg: ControllerConfig) => void;
  /** called instead of onApply when the sample time changed */
  onRestart: (cfg: ControllerConfig) => void;
  /** fields a drill forbids changing */
  locked?: Partial<Record<keyof ControllerConfig, boolean>>;
}

const LABELS: Record<NumericField, string> = {
  kc: "Gain Kc",
  ti: "Integral Ti",
  td: "Derivative Td",
  ki: "Integral gain Ki",
  kd: "Derivative gain Kd",
  derivativeFilterN: "Derivative filter N",
  setpointWeightB: "SP weight b (P)",
  setpointWeightC: "SP weight c (D)",
  trackingTimeS: "Tracking time Tt",
  outMinPct: "OUT low limit",
  outMaxPct: "OUT high limit",
  outRateLimitPctPerS: "OUT rate limit",
  deadbandC: "Error deadband",
  pvFilterTauS: "PV filter τf",
  sampleTimeS: "Sample time",
  safeOutputPct: "Safe OUT",
  hysteresisC: "Hysteresis",
  outOnPct: "OUT when on",
  outOffPct: "OUT when off",
};

const HINTS: Partial<Record<NumericField, string>> = {
  ti: "0 = no integral action",
  td: "0 = no derivative action",
  trackingTimeS: "0 = default (√(Ti·Td), or Ti for PI)",
  outRateLimitPctPerS: "0 = off",
  pvFilterTauS: "0 = off",
};

function Select<T extends string>({ id, label, value, options, onChange, disabled }: { id: string; label: string; value: T; options: [T, string][]; onChange: (v: T) => void; disabled?: boolean }) {
  return (
    <div className="flex items-center justify-between gap-2">
      <label htmlFor={id} className="text-ink-soft">
        {label}
      </label>
      <select id={id} value={value} disabled={disabled} onChange={(e) => onChange(e.target.value as T)} className="w-40 rounded-sm border border-rule-strong bg-paper px-1.5 py-1 text-right text-sm">
        {options.map(([v, l]) => (
          <option key={v} value={v}>
            {l}
          </option>
        ))}
      </select>
    </div>
  );
}

export function ControllerForm({ config, units, spanC, onUnits, onApply, onRestart, locked = {} }: ControllerFormProps) {
  const [values, setValues] = useState<ControllerFormValues>(() => toFormValues(config, units, spanC));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [notice, setNotice] = useState<string | null>(null);
  useEffect(() => {
    setValues(toFormValues(config, units, spanC));
    setErrors({});
  }, [config, units, spanC]);

  const set = <K extends keyof ControllerFormValues>(k: K, v: ControllerFormValues[K]) => setValues((prev) => ({ ...prev, [k]: v }));
  const shown = useMemo(() => {
    const f: NumericField[] = [];
    if (values.kind === "onoff") return ["hysteresisC", "outOnPct", "outOffPct", "pvFilterTauS", "sampleTimeS"] as NumericField[];
    f.push("kc");
    if (values.form === "parallel") f.push("ki", "kd");
    else f.push("ti", "td");
    f.push("derivativeFilterN", "setpointWeightB");
    if (values.derivativeOn === "error") f.push("setpointWeightC");
    if (values.antiWindup === "back-calculation") f.push("trackingTimeS");
    f.push("outMinPct", "outMaxPct", "outRateLimitPctPerS", "deadbandC", "pvFilterTauS", "sampleTimeS");
    if (values.badPvPolicy === "safe-output") f.push("safeOutputPct");
    return f;
  }, [values.kind, values.form, values.derivativeOn, values.antiWindup, values.badPvPolicy]);

  const apply = (e: React.FormEvent) => {
    e.preventDefault();
    const parsed = fromFormValues(values, units, spanC);
    if (!parsed.ok) {
      setErrors(parsed.errors as Record<string, string>);
      setNotice(null);
      return;
    }
    setErrors({});
    if (parsed.config.sampleTimeS !== config.sampleTimeS) {
      onRestart(parsed.config);
      setNotice("New sample time: the run restarted with these settings.");
    } else {
      onApply(parsed.config);
      setNotice("Applied bumplessly.");
    }
  };

  return (
    <form onSubmit={apply} aria-label="Controller" className="space-y-3 text-sm" noValidate>
      <div className="flex flex-wrap gap-x-3 gap-y-1 text-xs text-ink-soft">
        <UnitToggle label="°C / °F" value={units.temperature} options={[["C", "°C"], ["F", "°F"]]} onChange={(temperature) => onUnits({ ...units, temperature })} />
        <UnitToggle label="gain" value={units.gain} options={[["kc", "Kc"], ["pb", "PB"]]} onChange={(gain) => onUnits({ ...units, gain })} />
        <UnitToggle label="Ti" value={units.integral} options={[["s", "s"], ["min", "min"], ["repeats/min", "rpt/min"]]} onChange={(integral) => onUnits({ ...units, integral })} />
        <UnitToggle label="Td" value={units.derivative} options={[["s", "s"], ["min", "min"]]} onChange={(derivative) => onUnits({ ...units, derivative })} />
      </div>
      <div className="space-y-1.5">
        <Select id="cf-kind" label="Controller" value={values.kind} options={[["pid", "PID"], ["onoff", "on/off"]]} onChange={(v) => set("kind", v)} disabled={locked.kind} />
        {values.kind === "pid" ? (
          <>
            <Select id="cf-form" label="Form" value={values.form} options={[["standard", "standard (ideal)"], ["parallel", "parallel"], ["series", "series (interacting)"]]} onChange={(v) => set("form", v)} />
            <Select id="cf-deriv" label="Derivative on" value={values.derivativeOn} options={[["pv", "PV"], ["error", "error"]]} onChange={(v) => set("derivativeOn", v)} />
            <Select id="cf-aw" label="Anti-windup" value={values.antiWindup} options={[["back-calculation", "back-calculation"], ["conditional", "conditional"], ["none", "none"]]} onChange={(v) => set("antiWindup", v)} />
            <Select id="cf-badpv" label="On bad PV" value={values.badPvPolicy} options={[["hold", "hold OUT"], ["safe-output", "go to safe OUT"]]} onChange={(v) => set("badPvPolicy", v)} />
          </>
        ) : null}
        <Select id="cf-action" label="Action" value={values.action} options={[["reverse", "reverse (heating)"], ["direct", "direct (cooling)"]]} onChange={(v) => set("action", v)} />
      </div>
      <div className="space-y-1.5">
        {shown.map((f) => (
          <div key={f}>
            <div className="flex items-center justify-between gap-2">
              <label htmlFor={`cf-${f}`} className="text-ink-soft">
                {LABELS[f]}
              </label>
              <span className="flex items-center gap-1.5">
                <input
                  id={`cf-${f}`}
                  name={f}
                  inputMode="decimal"
                  value={values[f]}
                  disabled={locked[f]}
                  aria-invalid={errors[f] ? true : undefined}
                  aria-describedby={errors[f] ? `cf-${f}-err` : undefined}
                  onChange={(e) => set(f, e.target.value)}
                  className={`num w-24 rounded-sm border bg-paper px-1.5 py-1 text-right ${errors[f] ? "border-alarm" : "border-rule-strong"} disabled:bg-paper-sunk`}
                />
                <span className="num w-24 text-xs text-ink-faint">{unitLabel(f, units)}</span>
              </span>
            </div>
            {errors[f] ? (
              <p id={`cf-${f}-err`} className="mt-0.5 text-right text-xs text-alarm">
                {errors[f]}
              </p>
            ) : HINTS[f] ? (
              <p className="mt-0.5 text-right text-[11px] text-ink-faint">{HINTS[f]}</p>
            ) : null}
          </div>
        ))}
        <label className="flex items-center justify-between gap-2">
          <span className="text-ink-soft">SP tracks PV in manual</span>
          <input type="checkbox" checked={values.spTrackInManual} onChange={(e) => set("spTrackInManual", e.target.checked)} />
        </label>
      </div>
      {errors.form ? <p className="text-xs text-alarm">{errors.form}</p> : null}
      <button type="submit" className="w-full rounded-sm bg-ink px-3 py-2 text-sm font-semibold text-paper hover:bg-ink-soft">
        Apply tuning (bumpless)
      </button>
      {notice ? (
        <p role="status" className="text-xs text-ok">
          {notice}
        </p>
      ) : null}
    </form>
  );
}

function UnitToggle<T extends string>({ label, value, options, onChange }: { label: string; value: T; options: [T, string][]; onChange: (v: T) => void }) {
  return (
    <span className="flex items-center gap-1" role="group" aria-label={`${label} units`}>
      <span className="text-ink-faint">{label}</span>
      {options.map(([v, l]) => (
        <button key={v} type="button" aria-pressed={value === v} onClick={() => onChange(v)} className={`rounded-sm px-1.5 py-0.5 ${value === v ? "bg-ink text-paper" : "hover:bg-paper-sunk"}`}>
          {l}
        </button>
      ))}
    </span>
  );
}
