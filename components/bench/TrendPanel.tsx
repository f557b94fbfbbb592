"use client";
// The live trend with its key and the raw-PV and true-temperature toggles, for the Bench and the
// attempt Bench: the engine's TraceBuffer drawn by Trend (uPlot), the toggles kept in the store.
import { useShallow } from "zustand/react/shallow";
import { Trend } from "@/components/trend/Trend";
import type { BenchEngine } from "./engine-client";
import { useBench } from "./store";

export function TrendPanel({ engine }: { engine: BenchEngine | null }) {
  const { events, units, showTruth, showRaw, set } = useBench(useShallow((s) => ({ events: s.events, units: s.units, showTruth: s.showTruth, showRaw: s.showRaw, set: s.set })));
  return (
    <section className="rounded-sm border border-rule bg-paper-raised p-4">
      <div className="mb-2 flex flex-wrap items-center gap-4 text-xs">
        <h2 className="font-semibold uppercase tracking-wide text-ink-faint">Trend</h2>
        <TraceKey color="var(--color-trace-sp, #4a4a4a)" dashed label="SP" />
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={showRaw} onChange={(e) => set({ showRaw: e.target.checked })} />
          <TraceKey color="#4a6f8f88" label="PV raw" />
        </label>
        <TraceKey color="#4b4fa6" label="PV filtered" />
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={showTruth} onChange={(e) => set({ showTruth: e.target.checked })} />
          <TraceKey color="#2f8f86" dotted label="true temp. (training aid)" />
        </label>
        <TraceKey color="#d9692b" label="OUT %" />
      </div>
      {engine ? <Trend buffer={engine.buffer} events={events} unit={units.temperature} showTruth={showTruth} showRaw={showRaw} /> : null}
    </section>
  );
}

function TraceKey({ color, label, dashed, dotted }: { color: string; label: string; dashed?: boolean; dotted?: boolean }) {
  return (
    <span className="flex items-center gap-1.5 text-ink-soft">
      <svg width="18" height="6" aria-hidden="true">
        <line x1="0" y1="3" x2="18" y2="3" stroke={color} strokeWidth="2" strokeDasharray={dashed ? "5 3" : dotted ? "2 2" : undefined} />
      </svg>
      {label}
    </span>
  );
}
