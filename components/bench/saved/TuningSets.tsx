"use client";
// Tuning sets of the chosen plant: the user's named controller configurations, listed with SWR
// from /api/tuning-sets, saved and deleted through server actions, loaded into the Bench.
import { useActionState, useEffect, useRef, useState } from "react";
import useSWR from "swr";
import { deleteTuningSet, saveTuningSet, type SavedResult } from "@/app/(app)/bench/actions";
import type { ActionResult } from "@/app/_lib/action";
import type { TuningSetItem } from "@/db/bench-queries";
import { FormOutcome } from "@/components/forms/ActionForm";
import { Qty, dateTimeFormat, fetchJson } from "@/components/bench/plants/format";
import { controllerConfigSchema, type ControllerConfig } from "@/sim/control/config";

export interface TuningSetsProps {
  plantRef: string;
  /** the Bench's controller configuration now (what "Save" stores) */
  current: ControllerConfig;
  onLoad(controller: ControllerConfig): void;
  /** told the new row's id after a save (the hand-over path settles on it) */
  onSaved?(id: string, name: string): void;
}

export const tuningSetsKey = (plantRef: string) => `/api/tuning-sets?plant=${encodeURIComponent(plantRef)}`;

/** The settings that tell tuning sets apart, each with its unit. */
export function ControllerSummary({ c }: { c: ControllerConfig }) {
  const parts: [string, number, string][] = [];
  if (c.kind === "onoff") {
    parts.push(["hysteresis", c.hysteresisC, "°C"]);
  } else if (c.form === "parallel") {
    parts.push(["Kp", c.kc, "%/°C"], ["Ki", c.ki, "%/(°C·s)"], ["Kd", c.kd, "%·s/°C"]);
  } else {
    parts.push(["Kc", c.kc, "%/°C"], ["Ti", c.ti, "s"], ["Td", c.td, "s"]);
  }
  if (c.pvFilterTauS > 0) parts.push(["PV filter", c.pvFilterTauS, "s"]);
  parts.push(["h", c.sampleTimeS, "s"]);
  return (
    <span className="flex flex-wrap gap-x-3 gap-y-0.5 text-xs text-ink-soft">
      <span>{c.kind === "onoff" ? "on/off" : `PID ${c.form}`}</span>
      {parts.map(([label, value, unit]) => (
        <span key={label}>
          {label} <Qty value={value} unit={unit} />
        </span>
      ))}
      {c.kind === "pid" && c.ti === 0 && c.form !== "parallel" ? <span className="text-ink-faint">no integral</span> : null}
    </span>
  );
}

export function TuningSets({ plantRef, current, onLoad, onSaved }: TuningSetsProps) {
  const key = plantRef ? tuningSetsKey(plantRef) : null;
  const { data, error, mutate } = useSWR<{ tuningSets: TuningSetItem[] }>(key, fetchJson);
  const [name, setName] = useState("");
  const [notes, setNotes] = useState("");
  const [saveState, saveAction, saving] = useActionState<SavedResult, FormData>(saveTuningSet, { ok: true });
  const savedName = useRef("");
  const onSavedRef = useRef(onSaved);
  onSavedRef.current = onSaved;
  const [deleteState, deleteAction] = useActionState<ActionResult, FormData>(deleteTuningSet, { ok: true });

  useEffect(() => {
    void mutate();
    if (saveState.ok && saveState.message) {
      if (saveState.id) onSavedRef.current?.(saveState.id, savedName.current);
      setName("");
      setNotes("");
    }
  }, [saveState, deleteState, mutate]);

  const save = (form: FormData) => {
    savedName.current = name.trim();
    form.set("payload", JSON.stringify({ plantRef, name: name.trim(), notes: notes.trim(), controller: current }));
    return saveAction(form);
  };

  const sets = data?.tuningSets ?? [];
  return (
    <section aria-label="Tuning sets" className="space-y-3 text-sm">
      <h3 className="text-xs uppercase tracking-wide text-ink-faint">Tuning sets</h3>
      <form action={save} aria-label="Save a tuning set" className="flex flex-wrap items-end gap-2">
        <label className="block min-w-40 flex-1">
          <span className="mb-0.5 block text-ink-soft">Tuning set name</span>
          <input value={name} onChange={(e) => setName(e.target.value)} required maxLength={120} placeholder="e.g. relay test, PI, filter 4 s" className="w-full rounded-sm border border-rule-strong bg-paper-raised px-2 py-1" />
        </label>
        <label className="block min-w-40 flex-1">
          <span className="mb-0.5 block text-ink-soft">Notes</span>
          <input value={notes} onChange={(e) => setNotes(e.target.value)} maxLength={4000} className="w-full rounded-sm border border-rule-strong bg-paper-raised px-2 py-1" />
        </label>
        <button type="submit" disabled={saving || name.trim() === "" || !plantRef} className="rounded-sm border border-rule-strong bg-paper-raised px-3 py-1 hover:border-ink disabled:opacity-50">
          {saving ? "Saving…" : "Save current tuning"}
        </button>
      </form>
      <FormOutcome state={saveState} />
      <FormOutcome state={deleteState} />
      {error ? (
        <p role="alert" className="text-alarm">
          Tuning sets unavailable: {String((error as Error).message)}
        </p>
      ) : null}
      {data && sets.length === 0 ? <p className="text-ink-faint">No tuning sets for this plant yet.</p> : null}
      <ul className="divide-y divide-rule border-y border-rule">
        {sets.map((t) => (
          <li key={t.id} className="flex items-start gap-3 py-2" data-testid="tuning-set">
            <div className="min-w-0 flex-1 space-y-0.5">
              <div className="flex items-baseline gap-2">
                <span className="font-medium text-ink">{t.name}</span>
                <span className="num text-xs text-ink-faint">{dateTimeFormat.format(new Date(t.createdAt))}</span>
              </div>
              <ControllerSummary c={t.controller} />
              {t.notes ? <p className="text-xs text-ink-faint">{t.notes}</p> : null}
            </div>
            <button type="button" onClick={() => onLoad(controllerConfigSchema.parse(t.controller))} className="text-xs text-ink-soft hover:text-ink">
              Load
            </button>
            <form action={deleteAction}>
              <input type="hidden" name="id" value={t.id} />
              <button type="submit" className="text-xs text-ink-faint hover:text-alarm" aria-label={`Delete tuning set ${t.name}`}>
                Delete
              </button>
            </form>
          </li>
        ))}
      </ul>
    </section>
  );
}
