"use client";
// Choose the Bench's plant: the engine's presets, the user's own plants and plants shared within
// the organisation, fetched with SWR from /api/plants, with the chosen plant's key figures.
import { useActionState, useEffect } from "react";
import useSWR from "swr";
import { deletePlant, setPlantShared } from "@/app/(app)/bench/actions";
import type { ActionResult } from "@/app/_lib/action";
import type { PlantListItem } from "@/db/bench-queries";
import { FormOutcome } from "@/components/forms/ActionForm";
import type { PlantDefinition } from "@/sim/plant/plant-definition";
import { Duration, Qty, fetchJson } from "./format";

export const PLANTS_KEY = "/api/plants";

export interface PlantPickerProps {
  /** the chosen plant's reference: "preset:<id>" or "plant:<uuid>" */
  value: string;
  onChange(ref: string, definition: PlantDefinition, title: string): void;
  /** optional: offered for the user's own plants (open the PlantEditor with it) */
  onEdit?(plant: PlantListItem): void;
}

const GROUPS: { source: PlantListItem["source"]; label: string }[] = [
  { source: "preset", label: "Presets" },
  { source: "own", label: "My plants" },
  { source: "shared", label: "Shared in the organisation" },
];

/** The list of plants the signed-in user may choose, shared by every SWR user of the key. */
export function usePlants() {
  return useSWR<{ plants: PlantListItem[] }>(PLANTS_KEY, fetchJson);
}

export function PlantPicker({ value, onChange, onEdit }: PlantPickerProps) {
  const { data, error, isLoading, mutate } = usePlants();
  const items = data?.plants ?? [];
  const chosen = items.find((p) => p.ref === value) ?? null;

  return (
    <div className="space-y-2 text-sm">
      <label className="block">
        <span className="mb-1 block text-xs uppercase tracking-wide text-ink-faint">Plant</span>
        <select
          value={chosen ? value : ""}
          disabled={isLoading && !data}
          onChange={(e) => {
            const item = items.find((p) => p.ref === e.target.value);
            if (item) onChange(item.ref, item.definition, item.title);
          }}
          className="w-full rounded-sm border border-rule-strong bg-paper-raised px-2 py-1.5 text-ink"
        >
          {!chosen ? <option value="">{isLoading ? "Loading plants…" : value ? "(this plant is no longer available)" : "Choose a plant"}</option> : null}
          {GROUPS.map((g) => {
            const inGroup = items.filter((p) => p.source === g.source);
            return inGroup.length ? (
              <optgroup key={g.source} label={g.label}>
                {inGroup.map((p) => (
                  <option key={p.ref} value={p.ref}>
                    {p.title}
                    {p.source === "shared" && p.ownerName ? ` — ${p.ownerName}` : ""}
                    {p.origin === "twin" ? " (twin)" : ""}
                  </option>
                ))}
              </optgroup>
            ) : null;
          })}
        </select>
      </label>
      {error ? (
        <p role="alert" className="text-alarm">
          Plants unavailable: {String((error as Error).message)}
        </p>
      ) : null}
      {chosen ? <PlantSummary item={chosen} /> : null}
      {chosen?.source === "own" ? (
        <OwnPlantControls
          key={chosen.ref}
          item={chosen}
          onEdit={onEdit}
          onChanged={() => void mutate()}
          onDeleted={() => {
            const fallback = items.find((p) => p.source === "preset");
            if (fallback) onChange(fallback.ref, fallback.definition, fallback.title);
            void mutate();
          }}
        />
      ) : null}
    </div>
  );
}

/** One line of figures for a plant: what a technician reads before tuning it. */
export function PlantSummary({ item }: { item: PlantListItem }) {
  const f = item.figures;
  return (
    <div className="space-y-1" data-testid="plant-summary">
      {item.description ? <p className="text-ink-soft">{item.description}</p> : null}
      {f ? (
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-xs">
          <dt className="text-ink-faint">Static gain at <Qty value={f.outPercent} unit="%" digits={0} /></dt>
          <dd className="text-right">
            <Qty value={f.staticGainCPerPercent} unit="°C/%" />
          </dd>
          <dt className="text-ink-faint">Steady state at <Qty value={f.outPercent} unit="%" digits={0} /></dt>
          <dd className="text-right">
            <Qty value={f.steadyStateC} unit="°C" />
          </dd>
          <dt className="text-ink-faint">Dominant time constant</dt>
          <dd className="text-right">
            <Duration seconds={f.dominantTimeConstantS} />
          </dd>
          <dt className="text-ink-faint">Apparent dead time</dt>
          <dd className="text-right">
            <Duration seconds={f.apparentDeadTimeS} />
          </dd>
        </dl>
      ) : (
        <p className="text-xs text-ink-faint">No derived figures for this plant.</p>
      )}
    </div>
  );
}

type Action = (previous: ActionResult, form: FormData) => Promise<ActionResult>;

/** Share within the organisation, edit, delete: for the owner of the chosen plant. */
function OwnPlantControls({ item, onEdit, onChanged, onDeleted }: { item: PlantListItem; onEdit?(p: PlantListItem): void; onChanged(): void; onDeleted(): void }) {
  const [shareState, shareAction, sharing] = useActionState<ActionResult, FormData>(setPlantShared as Action, { ok: true });
  const [deleteState, deleteAction, deleting] = useActionState<ActionResult, FormData>(deletePlant as Action, { ok: true });
  useEffect(() => {
    if (shareState.ok && shareState.message) onChanged();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [shareState]);
  useEffect(() => {
    if (deleteState.ok && deleteState.message) onDeleted();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [deleteState]);
  return (
    <div className="space-y-2 border-t border-rule pt-2 text-xs">
      <div className="flex flex-wrap items-center gap-3">
        <form action={shareAction}>
          <input type="hidden" name="id" value={item.id} />
          <input type="hidden" name="shared" value={item.shared ? "false" : "true"} />
          <button type="submit" disabled={sharing} className="text-ink-soft hover:text-ink disabled:opacity-50">
            {item.shared ? "Shared in the organisation · make private" : "Private · share in the organisation"}
          </button>
        </form>
        {onEdit ? (
          <button type="button" onClick={() => onEdit(item)} className="text-ink-soft hover:text-ink">
            Edit
          </button>
        ) : null}
        <form
          action={deleteAction}
          onSubmit={(e) => {
            if (!window.confirm(`Delete "${item.title}" with your tuning sets and saved runs for it?`)) e.preventDefault();
          }}
        >
          <input type="hidden" name="id" value={item.id} />
          <button type="submit" disabled={deleting} className="text-ink-faint hover:text-alarm disabled:opacity-50">
            Delete plant
          </button>
        </form>
      </div>
      {!shareState.ok ? <FormOutcome state={shareState} /> : null}
      {!deleteState.ok ? <FormOutcome state={deleteState} /> : null}
    </div>
  );
}
