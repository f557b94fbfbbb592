"use client";
/**
 * Disturbances applied live. Each is an operator action, so it is stamped, logged and replayed
 * like any other, and it appears as a flag on the trend.
 */
import { useState } from "react";
import type { OperatorActionInput } from "@/sim/drill/actions";
import { temperatureFromDisplay, type TemperatureUnit } from "@/sim/units";

type Disturb = (action: OperatorActionInput) => void;

export function DisturbancePanel({ onDisturb, unit, ambientC }: { onDisturb: Disturb; unit: TemperatureUnit; ambientC: number }) {
  const [blockage, setBlockage] = useState(0);
  const [doorS, setDoorS] = useState("30");
  const [ambient, setAmbient] = useState(String(unit === "C" ? ambientC : Math.round(ambientC * 1.8 + 32)));
  const [voltage, setVoltage] = useState(100);
  const [noise, setNoise] = useState(0);
  const [fault, setFault] = useState<"open" | "shorted" | "lead-break">("open");
  const send = (event: Record<string, unknown>) => onDisturb({ type: "disturbance", event } as unknown as OperatorActionInput);
  const num = (s: string) => Number(s.replace(",", "."));

  return (
    <section aria-label="Disturbances" className="space-y-3 rounded-sm border border-rule bg-paper-raised p-4 text-sm">
      <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-faint">Disturbances</h2>
      <Slider label="Inlet blockage" unit="%" value={blockage} min={0} max={100} step={5} onChange={setBlockage} onCommit={(v) => send({ type: "inlet-blockage", percent: v })} />
      <Slider label="Supply voltage" unit="% of nominal" value={voltage} min={70} max={110} step={1} onChange={setVoltage} onCommit={(v) => send({ type: "supply-voltage", percentOfNominal: v })} />
      <Slider label="Extra sensor noise" unit="mA sd" value={noise} min={0} max={0.1} step={0.005} onChange={setNoise} onCommit={(v) => send({ type: "sensor-noise", extraNoiseSdMa: v })} />
      <div className="flex items-center justify-between gap-2">
        <label htmlFor="dist-ambient" className="text-ink-soft">
          Ambient
        </label>
        <span className="flex items-center gap-1.5">
          <input id="dist-ambient" value={ambient} onChange={(e) => setAmbient(e.target.value)} className="num w-16 rounded-sm border border-rule-strong bg-paper px-1.5 py-1 text-right" />
          <span className="num text-xs text-ink-faint">°{unit}</span>
          <button type="button" className="rounded-sm border border-rule-strong px-2 py-1 text-xs hover:border-ink" onClick={() => Number.isFinite(num(ambient)) && send({ type: "ambient", temperatureC: temperatureFromDisplay(num(ambient), unit) })}>
            Set
          </button>
        </span>
      </div>
      <div className="grid grid-cols-2 gap-2">
        <span className="flex items-center gap-1">
          <button type="button" className="flex-1 rounded-sm border border-rule-strong px-2 py-1.5 text-xs hover:border-ink" onClick={() => num(doorS) > 0 && send({ type: "door-open", durationS: num(doorS) })}>
            Open door for
          </button>
          <label className="sr-only" htmlFor="dist-door">
            Door open duration, s
          </label>
          <input id="dist-door" value={doorS} onChange={(e) => setDoorS(e.target.value)} className="num w-12 rounded-sm border border-rule-strong bg-paper px-1 py-1 text-right text-xs" />
          <span className="text-xs text-ink-faint">s</span>
        </span>
        <button
          type="button"
          className="rounded-sm border border-rule-strong px-2 py-1.5 text-xs hover:border-ink"
          onClick={() => send({ type: "cold-load", massKg: 5, specificHeatJPerKgK: 900, temperatureC: 18, airCouplingWPerK: 10 })}
          title="5 kg of aluminium parts at 18 °C"
        >
          Cold load (5 kg Al)
        </button>
      </div>
      <div className="flex items-center gap-2">
        <label htmlFor="dist-fault" className="text-ink-soft">
          Sensor
        </label>
        <select id="dist-fault" value={fault} onChange={(e) => setFault(e.target.value as typeof fault)} className="flex-1 rounded-sm border border-rule-strong bg-paper px-1.5 py-1 text-xs">
          <option value="open">open element</option>
          <option value="shorted">shorted element</option>
          <option value="lead-break">lead break</option>
        </select>
        <button type="button" className="rounded-sm border border-alarm/60 px-2 py-1 text-xs text-alarm hover:border-alarm" onClick={() => send({ type: "sensor-fault", fault, target: "control", durationS: 120 })}>
          Fail for 2 min
        </button>
      </div>
    </section>
  );
}

function Slider({ label, unit, value, min, max, step, onChange, onCommit }: { label: string; unit: string; value: number; min: number; max: number; step: number; onChange: (v: number) => void; onCommit: (v: number) => void }) {
  const id = `dist-${label.toLowerCase().replace(/\s+/g, "-")}`;
  return (
    <div>
      <div className="flex justify-between">
        <label htmlFor={id} className="text-ink-soft">
          {label}
        </label>
        <span className="num">
          {value} {unit}
        </span>
      </div>
      <input
        id={id}
        type="range"
        min={min}
        max={max}
        step={step}
        value={value}
        onChange={(e) => onChange(Number(e.target.value))}
        onPointerUp={(e) => onCommit(Number((e.target as HTMLInputElement).value))}
        onKeyUp={(e) => onCommit(Number((e.target as HTMLInputElement).value))}
        className="w-full accent-ink"
      />
    </div>
  );
}
