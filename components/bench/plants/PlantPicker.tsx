"use client";
// Choose the Bench's plant: the engine's presets, the user's own plants and plants shared within
// the organisation, fetched with SWR from /api/plants, with the chosen plant's key figures.
import useSWR from "swr";
import type { PlantListItem } from "@/db/bench-queries";
import type { PlantDefinition } from "@/sim/plant/plant-definition";
import { Duration, Qty, fetchJson } from "./format";

export const PLANTS_KEY = "/api/plants";

export interface PlantPickerProps {
  /** the chosen plant's reference: "preset:<id>" or "plant:<uuid>" */
  value: string;
  onChange(ref: string, definition: PlantDefinition, title: string): void;
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

export function PlantPicker({ value, onChange }: PlantPickerProps) {
  const { data, error, isLoading } = usePlants();
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
