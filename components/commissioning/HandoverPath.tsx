"use client";
/**
 * The hand-over path: one band above the Bench with the four things a loop needs before it is
 * handed over, each with where it stands (read from the Bench's state) and a button that brings
 * the Bench panel doing that work into view. Any stage can be revisited in any order; the band
 * only reports, the Bench does the work. The record form closes the band.
 */
import { useState } from "react";
import useSWR from "swr";
import { useShallow } from "zustand/react/shallow";
import type { TuningSetItem } from "@/db/bench-queries";
import { fetchJson } from "@/components/bench/plants/format";
import { tuningSetsKey } from "@/components/bench/saved/TuningSets";
import { useBench, type BenchPanelId } from "@/components/bench/store";
import { RecordForm } from "./RecordForm";
import { SafetyNote } from "./SafetyNote";
import { handoverStages, type StageId, type StageState } from "./stage-status";

export interface HandoverPathProps {
  plantRef: string;
  plantName: string;
  origin: "physical" | "twin";
  /** the user's own unshared plant: the record form says who will read the record */
  privatePlant?: boolean;
}

const OPENS: Record<StageId, { panel: BenchPanelId; label: string }> = {
  "power-curve": { panel: "power-curve", label: "Show the power curve" },
  relay: { panel: "relay", label: "Go to the relay test" },
  proof: { panel: "proof", label: "Go to the proof tests" },
  record: { panel: "tuning-sets", label: "Go to the tuning sets" },
};

const MARK: Record<StageState, { text: string; className: string }> = {
  open: { text: "to do", className: "border-rule-strong text-ink-faint" },
  "under-way": { text: "under way", className: "border-caution/60 text-caution" },
  done: { text: "done", className: "border-ok/60 text-ok" },
};

export function HandoverPath({ plantRef, plantName, origin, privatePlant = false }: HandoverPathProps) {
  const [recordId, setRecordId] = useState<string | null>(null);
  const s = useBench(useShallow((st) => ({ powerCurve: st.powerCurve ?? st.findings.powerCurve, findings: st.findings, siteProof: st.siteProof, savedTuningSet: st.savedTuningSet, unit: st.units.temperature, requestFocus: st.requestFocus })));
  // the same list the record form and the Bench's tuning sets read (one SWR key, one request)
  const { data } = useSWR<{ tuningSets: TuningSetItem[] }>(tuningSetsKey(plantRef), fetchJson);
  const stages = handoverStages({ ...s, recordId, tuningSetCount: data ? data.tuningSets.length : null });
  return (
    <section aria-label="Hand-over path" className="space-y-3 rounded-sm border border-rule bg-paper-raised p-4 text-sm">
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h1 className="text-base font-semibold">
          Hand-over path · <span className="font-normal">{plantName}</span>
          {origin === "twin" ? <span className="ml-2 text-xs font-normal text-ink-faint">twin (identified from uploaded data)</span> : null}
        </h1>
        <p className="text-xs text-ink-faint">Work on the Bench below; each stage reads what the Bench has done.</p>
      </header>
      <SafetyNote />
      <ol className="grid gap-px overflow-hidden rounded-sm border border-rule bg-rule md:grid-cols-4">
        {stages.map((st, i) => {
          const mark = MARK[st.state];
          const opens = OPENS[st.id];
          return (
            <li key={st.id} className="flex flex-col gap-2 bg-paper-raised p-3" aria-labelledby={`stage-${st.id}-title`} data-testid={`stage-${st.id}`} data-state={st.state}>
              <div className="flex items-baseline justify-between gap-2">
                <h2 id={`stage-${st.id}-title`} className="text-sm font-semibold">
                  <span aria-hidden="true" className="num mr-1.5 text-ink-faint">
                    {i + 1}
                  </span>
                  {st.title}
                </h2>
                <span className={`rounded-sm border px-1.5 text-[11px] ${mark.className}`} data-testid={`stage-${st.id}-state`}>
                  {mark.text}
                </span>
              </div>
              <p className="flex-1 text-xs text-ink-soft" data-testid={`stage-${st.id}-summary`}>
                {st.summary}
              </p>
              <button type="button" onClick={() => s.requestFocus(opens.panel)} className="self-start rounded-sm border border-rule-strong px-2 py-1 text-xs hover:border-ink">
                {opens.label}
              </button>
            </li>
          );
        })}
      </ol>
      <RecordForm plantRef={plantRef} plantName={plantName} origin={origin} privatePlant={privatePlant} onWritten={setRecordId} />
    </section>
  );
}
