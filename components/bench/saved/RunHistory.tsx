"use client";
// Saved runs of the chosen plant: a history table (SWR from /api/runs), saving the Bench's
// current run, opening one for replay, ticking several for an overlay comparison, deleting.
// A saved run keeps its inputs, action log, results and engine version; the trace is re-derived
// by replaying it, never stored.
import { useActionState, useEffect, useState } from "react";
import useSWR from "swr";
import { deleteRun, saveRun } from "@/app/(app)/bench/actions";
import type { ActionResult } from "@/app/_lib/action";
import type { SavedRunDetail, SavedRunSummary } from "@/db/bench-queries";
import { FormOutcome } from "@/components/forms/ActionForm";
import { TableHead } from "@/components/tables/TableHead";
import { Duration, Qty, dateTimeFormat, fetchJson } from "@/components/bench/plants/format";
import type { ControllerConfig } from "@/sim/control/config";
import { ENGINE_VERSION } from "@/sim/version";

/** A saved run in full, as GET /api/runs/:id answers it: everything a replay needs. */
export type SavedRunFull = SavedRunDetail;

export interface CurrentRun {
  title?: string;
  drill: unknown;
  controller: ControllerConfig;
  seed: number;
  actionLog: unknown[];
  results: unknown;
  engineVersion: string;
  durationS: number;
}

export interface RunHistoryProps {
  plantRef: string;
  /** the Bench's last finished (or stopped) run; null when there is nothing to save */
  currentRun: null | CurrentRun;
  onOpen(run: SavedRunFull): void;
  onCompare(runs: SavedRunFull[]): void;
}

/** The most a run's JSON may be (the action refuses more; Next's action body limit is 1 MB). */
export const MAX_RUN_PAYLOAD_CHARS = 900_000;

export const runsKey = (plantRef: string) => `/api/runs?plant=${encodeURIComponent(plantRef)}`;

async function fetchRun(id: string): Promise<SavedRunFull> {
  return (await fetchJson<{ run: SavedRunFull }>(`/api/runs/${encodeURIComponent(id)}`)).run;
}

export function RunHistory({ plantRef, currentRun, onOpen, onCompare }: RunHistoryProps) {
  const { data, error, mutate } = useSWR<{ runs: SavedRunSummary[] }>(plantRef ? runsKey(plantRef) : null, fetchJson);
  const [title, setTitle] = useState(currentRun?.title ?? "");
  const [ticked, setTicked] = useState<string[]>([]);
  const [busy, setBusy] = useState<string | null>(null);
  const [fetchError, setFetchError] = useState<string | null>(null);
  const [saveState, saveAction, saving] = useActionState<ActionResult, FormData>(saveRun, { ok: true });
  const [deleteState, deleteAction] = useActionState<ActionResult, FormData>(deleteRun, { ok: true });
  const [tooLarge, setTooLarge] = useState<string | null>(null);

  useEffect(() => {
    void mutate();
  }, [saveState, deleteState, mutate]);
  // a new run (not merely a new object around the same one) brings its own title
  useEffect(() => setTitle(currentRun?.title ?? ""), [currentRun?.title, currentRun?.drill, currentRun?.seed, currentRun?.actionLog, currentRun?.results]);
  useEffect(() => setTicked([]), [plantRef]);

  const runs = data?.runs ?? [];
  // rows deleted since they were ticked drop out of the selection
  const tickedNow = ticked.filter((id) => runs.some((r) => r.id === id));

  const save = (form: FormData) => {
    if (!currentRun) return;
    const payload = JSON.stringify({ plantRef, ...currentRun, title: title.trim() });
    if (payload.length > MAX_RUN_PAYLOAD_CHARS) {
      setTooLarge(`This run is too large to save (${payload.length.toLocaleString("en-GB")} characters of JSON; at most ${MAX_RUN_PAYLOAD_CHARS.toLocaleString("en-GB")}).`);
      return;
    }
    setTooLarge(null);
    form.set("payload", payload);
    return saveAction(form);
  };

  const open = async (id: string) => {
    setBusy(id);
    setFetchError(null);
    try {
      onOpen(await fetchRun(id));
    } catch (err) {
      setFetchError(`Could not open the run: ${(err as Error).message}`);
    } finally {
      setBusy(null);
    }
  };

  const compare = async () => {
    setBusy("compare");
    setFetchError(null);
    try {
      onCompare(await Promise.all(tickedNow.map(fetchRun)));
    } catch (err) {
      setFetchError(`Could not fetch the runs: ${(err as Error).message}`);
    } finally {
      setBusy(null);
    }
  };

  const toggle = (id: string, on: boolean) => setTicked((t) => (on ? [...t.filter((x) => x !== id), id] : t.filter((x) => x !== id)));

  return (
    <section aria-label="Saved runs" className="space-y-3 text-sm">
      <h3 className="text-xs uppercase tracking-wide text-ink-faint">Saved runs</h3>
      <form action={save} className="flex flex-wrap items-end gap-2">
        <label className="block min-w-56 flex-1">
          <span className="mb-0.5 block text-ink-soft">Run title</span>
          <input
            value={title}
            onChange={(e) => setTitle(e.target.value)}
            maxLength={160}
            disabled={!currentRun}
            placeholder={currentRun ? "e.g. PI after relay test, filter 4 s" : "run the Bench first"}
            className="w-full rounded-sm border border-rule-strong bg-paper-raised px-2 py-1 disabled:opacity-60"
          />
        </label>
        <button type="submit" disabled={!currentRun || saving || !plantRef} className="rounded-sm border border-rule-strong bg-paper-raised px-3 py-1 hover:border-ink disabled:opacity-50">
          {saving ? "Saving…" : "Save this run"}
        </button>
      </form>
      {tooLarge ? (
        <p role="alert" className="rounded-sm border border-alarm/40 bg-alarm-soft px-3 py-2 text-alarm">
          {tooLarge}
        </p>
      ) : null}
      <FormOutcome state={saveState} />
      <FormOutcome state={deleteState} />
      {error ? (
        <p role="alert" className="text-alarm">
          Saved runs unavailable: {String((error as Error).message)}
        </p>
      ) : null}
      {fetchError ? (
        <p role="alert" className="text-alarm">
          {fetchError}
        </p>
      ) : null}

      <div className="flex items-center gap-3">
        <button type="button" onClick={compare} disabled={tickedNow.length < 2 || busy !== null} className="rounded-sm border border-rule-strong bg-paper-raised px-3 py-1 hover:border-ink disabled:opacity-50">
          {busy === "compare" ? "Fetching…" : tickedNow.length >= 2 ? `Overlay ${tickedNow.length} runs` : "Overlay ticked runs"}
        </button>
        <span className="text-xs text-ink-faint">Tick two or more runs to overlay their replayed trends.</span>
      </div>

      {data && runs.length === 0 ? <p className="text-ink-faint">No saved runs for this plant yet.</p> : null}
      {runs.length ? (
        <table className="w-full border-collapse">
          <TableHead columns={["Compare", "Title", "Saved", "Engine", "Duration", "IAE", "Overshoot", "Settling", ""]} />
          <tbody>
            {runs.map((r) => {
              const k = r.keyResults;
              const otherEngine = r.engineVersion !== ENGINE_VERSION;
              return (
                <tr key={r.id} className="border-b border-rule align-top" data-testid="saved-run">
                  <td className="py-1.5 pr-2">
                    <input type="checkbox" aria-label={`Tick ${r.title} for comparison`} checked={tickedNow.includes(r.id)} onChange={(e) => toggle(r.id, e.target.checked)} />
                  </td>
                  <td className="py-1.5 pr-2">
                    {r.title}
                    {k.trips > 0 ? <span className="ml-2 text-xs text-alarm">cutout tripped</span> : null}
                  </td>
                  <td className="num whitespace-nowrap py-1.5 pr-2 text-ink-soft">{dateTimeFormat.format(new Date(r.createdAt))}</td>
                  <td className="py-1.5 pr-2">
                    <span className={`num ${otherEngine ? "text-caution" : "text-ink-soft"}`} title={otherEngine ? `Saved with engine ${r.engineVersion}; this Bench runs ${ENGINE_VERSION}` : undefined}>
                      {r.engineVersion}
                    </span>
                  </td>
                  <td className="py-1.5 pr-2 text-right">
                    <Duration seconds={r.durationS} />
                  </td>
                  <td className="py-1.5 pr-2 text-right">
                    <Qty value={k.iae} unit="°C·s" />
                  </td>
                  <td className="py-1.5 pr-2 text-right">
                    <Qty value={k.overshootPct} unit="%" digits={1} />
                  </td>
                  <td className="py-1.5 pr-2 text-right">
                    <Qty value={k.settlingTimeS} unit="s" />
                  </td>
                  <td className="whitespace-nowrap py-1.5 text-right">
                    <button type="button" onClick={() => open(r.id)} disabled={busy !== null} className="text-xs text-ink-soft hover:text-ink disabled:opacity-50">
                      {busy === r.id ? "Opening…" : "Open"}
                    </button>
                    <form action={deleteAction} className="ml-3 inline">
                      <input type="hidden" name="id" value={r.id} />
                      <button type="submit" className="text-xs text-ink-faint hover:text-alarm" aria-label={`Delete saved run ${r.title}`}>
                        Delete
                      </button>
                    </form>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      ) : null}
      {runs.length ? <p className="text-xs text-ink-faint">On the true temperature: IAE summed over the drill’s scored windows; overshoot and settling the largest of its setpoint steps (a dash: not scored, or not settled).</p> : null}
    </section>
  );
}
