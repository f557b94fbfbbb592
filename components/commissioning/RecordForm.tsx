"use client";
/**
 * Writing the tuning record: the tuning set settled on, a title, notes, and which proof tests go
 * on it. The request is built from what the Bench recorded (record-request.ts), checked with the
 * record's own schema here for a quick message, and sent to createTuningRecord, which checks it
 * again and re-runs every proof test on the server. A written record opens at /records/<id>.
 */
import { useActionState, useEffect, useMemo, useState } from "react";
import { useRouter } from "next/navigation";
import useSWR from "swr";
import { useShallow } from "zustand/react/shallow";
import { createTuningRecord, type RecordActionResult } from "@/app/(app)/records/actions";
import { MAX_PROOF_TESTS, recordRequestSchema } from "@/app/_lib/records/record-document";
import type { TuningSetItem } from "@/db/bench-queries";
import { FormOutcome } from "@/components/forms/ActionForm";
import { fetchJson, Qty } from "@/components/bench/plants/format";
import { tuningSetsKey } from "@/components/bench/saved/TuningSets";
import { useBench } from "@/components/bench/store";
import { RULE_LABELS } from "@/components/bench/tests/labels";
import { buildRecordRequest } from "./record-request";

export interface RecordFormProps {
  plantRef: string;
  plantName: string;
  origin: "physical" | "twin";
  /** the user's own unshared plant */
  privatePlant?: boolean;
  onWritten?(id: string): void;
}

export function RecordForm({ plantRef, plantName, origin, privatePlant = false, onWritten }: RecordFormProps) {
  const router = useRouter();
  const { data, mutate } = useSWR<{ tuningSets: TuningSetItem[] }>(tuningSetsKey(plantRef), fetchJson);
  const { findings, powerCurve, savedTuningSet } = useBench(useShallow((s) => ({ findings: s.findings, powerCurve: s.powerCurve ?? s.findings.powerCurve, savedTuningSet: s.savedTuningSet })));
  const sets = useMemo(() => data?.tuningSets ?? [], [data]);
  const [picked, setPicked] = useState<string>("");
  const [title, setTitle] = useState(`Tuning record: ${plantName}`);
  const [notes, setNotes] = useState("");
  // runs are on the record unless left out, so a new comparison joins it without a click
  const [leftOut, setLeftOut] = useState<Set<string>>(new Set());
  const [problem, setProblem] = useState<string | null>(null);
  const [state, action, pending] = useActionState<RecordActionResult, FormData>(createTuningRecord, { ok: true });

  // the set saved last on this Bench is the one settled on, until another is picked
  const setId = picked || (savedTuningSet && sets.some((t) => t.id === savedTuningSet.id) ? savedTuningSet.id : (sets[0]?.id ?? ""));
  const set = sets.find((t) => t.id === setId) ?? null;
  const runs = findings.proofRuns;
  const included = runs.filter((r) => !leftOut.has(r.key));

  // a set saved a moment ago may not be in the list yet
  const savedId = savedTuningSet?.id;
  useEffect(() => {
    if (savedId) void mutate();
  }, [savedId, mutate]);

  useEffect(() => {
    if (state.ok && state.id) {
      onWritten?.(state.id);
      router.push(`/records/${state.id}`);
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [state]);

  const submit = (form: FormData) => {
    if (!set) return setProblem("Save the tuning as a tuning set first.");
    if (included.length > MAX_PROOF_TESTS) return setProblem(`At most ${MAX_PROOF_TESTS} proof tests per record: leave some out.`);
    const request = buildRecordRequest({ plantRef, origin, tuningSet: set, title, notes, findings, powerCurve, proofKeys: included.map((r) => r.key) });
    const parsed = recordRequestSchema.safeParse(request);
    if (!parsed.success) return setProblem(parsed.error.issues[0]?.message ?? "The record request is not valid.");
    setProblem(null);
    form.set("payload", JSON.stringify(request));
    return action(form);
  };

  const model = origin === "twin" ? "the twin's identified model (filled in by the server)" : findings.applied?.source === "bump" && findings.applied.model ? `the bump test's ${findings.applied.model.kind.toUpperCase()} model` : findings.bumpModel ? `the bump test's ${findings.bumpModel.kind.toUpperCase()} model` : "none (no bump test run)";
  const relay = findings.relay ? (findings.relayRule ? `Ku and Pu with ${RULE_LABELS[findings.relayRule] ?? findings.relayRule}` : "left out: no rule applied to it yet") : "none";
  const input = "w-full rounded-sm border border-rule-strong bg-paper px-2 py-1";

  return (
    <form action={submit} aria-label="Tuning record" className="space-y-3 border-t border-rule pt-3" noValidate>
      <h2 className="text-xs font-semibold uppercase tracking-wide text-ink-faint">Write the tuning record</h2>
      <div className="grid gap-3 md:grid-cols-[1fr_1fr_1.2fr]">
        <div className="space-y-2">
          <label className="block">
            <span className="mb-0.5 block text-ink-soft">Tuning set on the record</span>
            <select value={setId} onChange={(e) => setPicked(e.target.value)} className={input} disabled={sets.length === 0}>
              {sets.length === 0 ? <option value="">no tuning set saved for this plant</option> : null}
              {sets.map((t) => (
                <option key={t.id} value={t.id}>
                  {t.name}
                </option>
              ))}
            </select>
          </label>
          <label className="block">
            <span className="mb-0.5 block text-ink-soft">Record title</span>
            <input value={title} onChange={(e) => setTitle(e.target.value)} maxLength={160} className={input} />
          </label>
        </div>
        <label className="block">
          <span className="mb-0.5 block text-ink-soft">Notes for the record</span>
          <textarea value={notes} onChange={(e) => setNotes(e.target.value)} maxLength={8000} rows={4} className={input} placeholder="site, loop tag, what was agreed…" />
        </label>
        <fieldset className="space-y-1">
          <legend className="mb-0.5 text-ink-soft">Proof tests on the record</legend>
          {runs.length === 0 ? <p className="text-xs text-ink-faint">None run yet: compare PI with PID on a site proof test first.</p> : null}
          <ul className="max-h-36 space-y-0.5 overflow-y-auto text-xs">
            {runs.map((r) => (
              <li key={r.key}>
                <label className="flex items-baseline gap-1.5">
                  <input
                    type="checkbox"
                    checked={!leftOut.has(r.key)}
                    onChange={(e) =>
                      setLeftOut((prev) => {
                        const next = new Set(prev);
                        if (e.target.checked) next.delete(r.key);
                        else next.add(r.key);
                        return next;
                      })
                    }
                  />
                  <span>
                    {r.label}
                    {r.drillVersion ? <span className="text-ink-faint"> · drill v{r.drillVersion.version}</span> : null}
                    <span className="text-ink-faint">
                      {" "}
                      · IAE <Qty value={r.iae} unit="°C·s" />
                    </span>
                  </span>
                </label>
              </li>
            ))}
          </ul>
        </fieldset>
      </div>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-xs" data-testid="record-contents">
        <dt className="text-ink-faint">Model</dt>
        <dd>{model}</dd>
        <dt className="text-ink-faint">Power curve</dt>
        <dd>{powerCurve ? `${Math.min(60, powerCurve.curve.points.length)} points` : "not computed"}</dd>
        <dt className="text-ink-faint">Relay test</dt>
        <dd>{relay}</dd>
        <dt className="text-ink-faint">Proof tests</dt>
        <dd>
          {included.length} of {runs.length}, re-run on the server when the record is written
        </dd>
      </dl>
      {privatePlant ? (
        <p className="text-xs text-ink-soft" data-testid="record-visibility-note">
          This plant is private to you, but a tuning record is a hand-over document: everyone in your organisation can read it, with the plant&apos;s model{origin === "twin" ? " and the name and checksum of its source file" : ""}.
        </p>
      ) : null}
      {problem ? (
        <p role="alert" className="rounded-sm border border-alarm/40 bg-alarm-soft px-3 py-2 text-sm text-alarm">
          {problem}
        </p>
      ) : null}
      <FormOutcome state={state} />
      <button type="submit" disabled={pending || !set} className="rounded-sm bg-ink px-3 py-1.5 text-sm font-semibold text-paper hover:bg-ink-soft disabled:opacity-50">
        {pending ? "Writing the record…" : "Write tuning record"}
      </button>
    </form>
  );
}
