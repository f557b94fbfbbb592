"use client";
/**
 * The loop's faceplate: PV, SP and OUT readouts, auto/manual (bumpless in the engine), SP and
 * manual OUT entry with arrow-key nudges, and the alarm states (high PV, bad PV, cutout tripped).
 */
import { useEffect, useState } from "react";
import { temperatureFromDisplay, temperatureToDisplay, type TemperatureUnit } from "@/sim/units";
import type { SampleSnapshot } from "@/sim/drill/simulation";

export interface FaceplateProps {
  snapshot: SampleSnapshot | null;
  unit: TemperatureUnit;
  highAlarmC: number;
  onSetpoint: (spC: number) => void;
  onMode: (mode: "auto" | "manual") => void;
  onManualOutput: (outPercent: number) => void;
  onCutoutReset: () => void;
}

const fmt = (v: number | undefined, digits: number) => (v === undefined || !Number.isFinite(v) ? "—" : v.toFixed(digits));

/** ArrowUp/ArrowDown change a numeric entry by `step` (×10 with Shift) and commit it. */
function nudgeKey(e: React.KeyboardEvent<HTMLInputElement>, value: string, step: number, commit: (v: number) => void) {
  if (e.key !== "ArrowUp" && e.key !== "ArrowDown") return false;
  e.preventDefault();
  e.stopPropagation();
  const base = Number(value);
  if (!Number.isFinite(base)) return true;
  const next = base + (e.key === "ArrowUp" ? 1 : -1) * step * (e.shiftKey ? 10 : 1);
  commit(Math.round(next * 100) / 100);
  return true;
}

export function Faceplate({ snapshot, unit, highAlarmC, onSetpoint, onMode, onManualOutput, onCutoutReset }: FaceplateProps) {
  const manual = snapshot?.mode === "manual";
  const pv = snapshot ? temperatureToDisplay(snapshot.pvFilteredC, unit) : undefined;
  const sp = snapshot ? temperatureToDisplay(snapshot.setpointC, unit) : undefined;
  const [spText, setSpText] = useState("");
  const [outText, setOutText] = useState("");
  const [spEditing, setSpEditing] = useState(false);
  const [outEditing, setOutEditing] = useState(false);
  useEffect(() => {
    if (!spEditing && sp !== undefined) setSpText(sp.toFixed(1));
  }, [sp, spEditing]);
  useEffect(() => {
    if (!outEditing && snapshot) setOutText(snapshot.outPercent.toFixed(1));
  }, [snapshot, outEditing]);

  const commitSp = (display: number) => {
    setSpText(display.toFixed(1));
    onSetpoint(temperatureFromDisplay(display, unit));
  };
  const commitOut = (v: number) => {
    const clipped = Math.min(100, Math.max(0, v));
    setOutText(clipped.toFixed(1));
    onManualOutput(clipped);
  };
  const highPv = snapshot ? snapshot.pvFilteredC > highAlarmC : false;
  const badPv = snapshot?.pvBad ?? false;
  const tripped = snapshot?.cutoutTripped ?? false;
  const spStep = unit === "C" ? 0.5 : 1;

  return (
    <section aria-label="Faceplate" className="rounded-sm border border-rule bg-paper-raised p-4">
      <p className="text-xs text-ink-faint">Loop · enclosure air temperature</p>
      <div className="mt-1 flex items-baseline gap-2">
        <output className={`num text-5xl font-medium leading-none ${badPv ? "text-alarm" : ""}`} data-testid="pv-readout" aria-label="PV">
          {badPv ? "BAD" : fmt(pv, 1)}
        </output>
        <span className="text-sm text-ink-soft">°{unit} PV</span>
      </div>

      <div className="mt-4 grid grid-cols-[3rem_1fr] items-center gap-x-3 gap-y-3 text-sm">
        <label htmlFor="fp-sp" className="text-ink-soft">
          SP
        </label>
        <div className="flex items-center gap-2">
          <input
            id="fp-sp"
            inputMode="decimal"
            value={spText}
            onFocus={() => setSpEditing(true)}
            onBlur={() => setSpEditing(false)}
            onChange={(e) => setSpText(e.target.value)}
            onKeyDown={(e) => {
              if (nudgeKey(e, spText, spStep, commitSp)) return;
              if (e.key === "Enter" && Number.isFinite(Number(spText))) commitSp(Number(spText));
            }}
            className="num w-24 rounded-sm border border-rule-strong bg-paper px-2 py-1 text-right"
            data-testid="sp-input"
          />
          <span className="num text-ink-faint">°{unit}</span>
          <span className="text-[11px] text-ink-faint">↑↓ ±{spStep}, Enter</span>
        </div>

        <label htmlFor="fp-out" className="text-ink-soft">
          OUT
        </label>
        <div>
          <div className="relative h-5 overflow-hidden rounded-sm border border-rule-strong bg-paper" aria-hidden="true">
            <div className="absolute inset-y-0 left-0 bg-trace-out/80" style={{ width: `${Math.min(100, Math.max(0, snapshot?.outPercent ?? 0))}%` }} />
          </div>
          <div className="mt-1 flex items-center gap-2">
            <input
              id="fp-out"
              inputMode="decimal"
              value={outText}
              disabled={!manual}
              onFocus={() => setOutEditing(true)}
              onBlur={() => setOutEditing(false)}
              onChange={(e) => setOutText(e.target.value)}
              onKeyDown={(e) => {
                if (nudgeKey(e, outText, 1, commitOut)) return;
                if (e.key === "Enter" && Number.isFinite(Number(outText))) commitOut(Number(outText));
              }}
              className="num w-24 rounded-sm border border-rule-strong bg-paper px-2 py-1 text-right disabled:bg-paper-sunk disabled:text-ink-soft"
              data-testid="out-input"
            />
            <span className="num text-ink-faint">%</span>
            <span className="text-[11px] text-ink-faint">{manual ? "manual entry" : "set by the controller"}</span>
          </div>
        </div>
      </div>

      <div className="mt-4 grid grid-cols-2 gap-2" role="group" aria-label="Mode">
        <button
          type="button"
          aria-pressed={!manual}
          onClick={() => onMode("auto")}
          className={`rounded-sm border px-3 py-2 text-sm font-semibold ${!manual ? "border-ink bg-ink text-paper" : "border-rule-strong hover:border-ink"}`}
        >
          Auto
        </button>
        <button
          type="button"
          aria-pressed={manual}
          onClick={() => onMode("manual")}
          className={`rounded-sm border px-3 py-2 text-sm font-semibold ${manual ? "border-ink bg-ink text-paper" : "border-rule-strong hover:border-ink"}`}
        >
          Manual
        </button>
      </div>

      <FaceplateAlarms highPv={highPv} badPv={badPv} tripped={tripped} onCutoutReset={onCutoutReset} />
    </section>
  );
}

/** The alarm chips, the latched-cutout notice with its reset, and the cutout caution (Bench and attempt Bench). */
export function FaceplateAlarms({ highPv, badPv, tripped, onCutoutReset }: { highPv: boolean; badPv: boolean; tripped: boolean; onCutoutReset: () => void }) {
  return (
    <>
      <ul className="mt-4 grid grid-cols-3 gap-2 text-center text-[11px] font-semibold uppercase tracking-wide" aria-label="Alarms">
        <AlarmChip active={highPv} label="High PV" />
        <AlarmChip active={badPv} label="Bad PV" />
        <AlarmChip active={tripped} label="Cutout" />
      </ul>
      {tripped ? (
        <div className="mt-3 rounded-sm border border-alarm/50 bg-alarm-soft p-3 text-xs text-alarm" role="alert">
          <p className="font-semibold">Excess-temperature cutout tripped — heater held off.</p>
          <p className="mt-1">It releases only on a manual reset, once its own sensor has cooled below the trip point.</p>
          <button type="button" onClick={onCutoutReset} className="mt-2 rounded-sm border border-alarm px-2 py-1 font-semibold hover:bg-paper">
            Reset cutout
          </button>
        </div>
      ) : null}
      <p className="mt-3 text-[11px] leading-snug text-ink-faint">
        On real equipment the cutout is a separate, independent device with its own sensor; wiring and setting it is work for licensed people under local codes.
      </p>
    </>
  );
}

function AlarmChip({ active, label }: { active: boolean; label: string }) {
  return (
    <li
      className={`rounded-full border px-2 py-1 ${active ? "border-alarm bg-alarm text-paper" : "border-rule-strong text-ink-faint"}`}
      aria-label={`${label}: ${active ? "active" : "normal"}`}
    >
      {label}
    </li>
  );
}
