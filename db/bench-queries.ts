// Reads of the Bench's saved work (plants, tuning sets, saved runs). Callers authorize first
// (app/_lib/guard.ts) and pass the signed-in user; every query here is scoped to what that user
// may read, so a route handler cannot leak another user's private rows by forgetting a check.
import { and, desc, eq, or, sql } from "drizzle-orm";
import { z } from "zod";
import { controllerConfigSchema, type ControllerConfig } from "@/sim/control/config";
import type { StampedAction } from "@/sim/drill/actions";
import type { Drill } from "@/sim/drill/schema";
import { derivedFigures } from "@/sim/plant/derived-figures";
import { plantDefinitionSchema, type PlantDefinition } from "@/sim/plant/plant-definition";
import { PLANT_PRESETS, findPreset } from "@/sim/plant/presets";
import { getDb } from "./client";
import { plants, savedRuns, tuningSets, users } from "./schema";

export interface BenchReader {
  id: string;
  organizationId: string;
}

/** The figures a plant list shows, at OUT 50 % (see sim/plant/derived-figures.ts). */
export interface PlantFiguresSummary {
  outPercent: number;
  staticGainCPerPercent: number;
  steadyStateC: number;
  dominantTimeConstantS: number;
  apparentDeadTimeS: number;
  timeTo63PercentS: number;
}

export interface PlantListItem {
  /** "preset:<id>" or "plant:<uuid>" */
  ref: string;
  source: "preset" | "own" | "shared";
  id: string;
  title: string;
  description: string;
  kind: PlantDefinition["kind"];
  origin: "preset" | "physical" | "twin";
  shared: boolean;
  ownerName: string | null;
  updatedAt: string | null;
  definition: PlantDefinition;
  figures: PlantFiguresSummary | null;
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function figuresSummary(def: PlantDefinition, outPercent = 50): PlantFiguresSummary | null {
  try {
    const f = derivedFigures(def, outPercent);
    const summary = {
      outPercent,
      staticGainCPerPercent: f.staticGainCPerPercent,
      steadyStateC: f.steadyStateC,
      dominantTimeConstantS: f.dominantTimeConstantS,
      apparentDeadTimeS: f.apparentDeadTimeS,
      timeTo63PercentS: f.timeTo63PercentS,
    };
    return Object.values(summary).every(Number.isFinite) ? summary : null;
  } catch {
    return null;
  }
}

// Presets never change while the server runs: their figures are computed once.
let presetItems: PlantListItem[] | null = null;
export function presetPlantItems(): PlantListItem[] {
  presetItems ??= PLANT_PRESETS.map((p) => ({
    ref: `preset:${p.id}`,
    source: "preset" as const,
    id: p.id,
    title: p.title,
    description: p.description,
    kind: p.plant.kind,
    origin: "preset" as const,
    shared: true,
    ownerName: null,
    updatedAt: null,
    definition: p.plant,
    figures: figuresSummary(p.plant),
  }));
  return presetItems;
}

const readable = (user: BenchReader) =>
  or(eq(plants.ownerId, user.id), and(eq(plants.organizationId, user.organizationId), eq(plants.shared, true)));

type PlantJoinRow = { plant: typeof plants.$inferSelect; ownerName: string };

function toItem(user: BenchReader, { plant, ownerName }: PlantJoinRow): PlantListItem | null {
  const def = plantDefinitionSchema.safeParse(plant.definition);
  if (!def.success) return null; // written by an older engine and no longer valid: left out, kept in the table
  return {
    ref: `plant:${plant.id}`,
    source: plant.ownerId === user.id ? "own" : "shared",
    id: plant.id,
    title: plant.name,
    description: plant.description,
    kind: def.data.kind,
    origin: plant.origin,
    shared: plant.shared,
    ownerName,
    updatedAt: plant.updatedAt.toISOString(),
    definition: def.data,
    figures: figuresSummary(def.data),
  };
}

/** Presets, then the user's own plants, then plants shared within the organisation. */
export async function plantsFor(user: BenchReader): Promise<PlantListItem[]> {
  const rows = await getDb()
    .select({ plant: plants, ownerName: users.displayName })
    .from(plants)
    .innerJoin(users, eq(users.id, plants.ownerId))
    .where(readable(user))
    .orderBy(plants.name);
  const stored = rows.map((r) => toItem(user, r)).filter((x): x is PlantListItem => x !== null);
  return [...presetPlantItems(), ...stored.filter((p) => p.source === "own"), ...stored.filter((p) => p.source === "shared")];
}

/** One stored plant (by uuid) or preset (by preset id) the user may read; null otherwise. */
export async function plantFor(user: BenchReader, idOrPreset: string): Promise<PlantListItem | null> {
  if (!uuidPattern.test(idOrPreset)) return presetPlantItems().find((p) => p.id === idOrPreset) ?? null;
  const [row] = await getDb()
    .select({ plant: plants, ownerName: users.displayName })
    .from(plants)
    .innerJoin(users, eq(users.id, plants.ownerId))
    .where(and(eq(plants.id, idOrPreset), readable(user)));
  return row ? toItem(user, row) : null;
}

/** A plant reference resolved for the user, or null when it names nothing they may read. */
export async function plantByRef(user: BenchReader, ref: string): Promise<PlantListItem | null> {
  if (ref.startsWith("preset:")) return findPreset(ref.slice(7)) ? plantFor(user, ref.slice(7)) : null;
  if (ref.startsWith("plant:") && uuidPattern.test(ref.slice(6))) return plantFor(user, ref.slice(6));
  return null;
}

export function isPlantRef(ref: string): boolean {
  return (ref.startsWith("preset:") && ref.length > 7) || (ref.startsWith("plant:") && uuidPattern.test(ref.slice(6)));
}

// ---- tuning sets ----

export interface TuningSetItem {
  id: string;
  plantRef: string;
  name: string;
  notes: string;
  controller: ControllerConfig;
  createdAt: string;
}

/** The user's own tuning sets for a plant, by name. */
export async function tuningSetsFor(user: BenchReader, plantRef: string): Promise<TuningSetItem[]> {
  const rows = await getDb()
    .select()
    .from(tuningSets)
    .where(and(eq(tuningSets.ownerId, user.id), eq(tuningSets.plantRef, plantRef)))
    .orderBy(tuningSets.name);
  return rows.flatMap((r) => {
    const c = controllerConfigSchema.safeParse(r.controller);
    return c.success ? [{ id: r.id, plantRef: r.plantRef, name: r.name, notes: r.notes, controller: c.data, createdAt: r.createdAt.toISOString() }] : [];
  });
}

// ---- saved runs ----

export interface RunKeyResults {
  /** on the true temperature: IAE summed over the drill's scoring windows (whole run when it has none), °C·s */
  iae: number | null;
  /** the largest overshoot among the setpoint windows, % */
  overshootPct: number | null;
  /** the longest settling time among the setpoint windows, s (null when one never settled or none was scored) */
  settlingTimeS: number | null;
  /** safety trips recorded in the run */
  trips: number;
}

export interface SavedRunSummary {
  id: string;
  plantRef: string;
  title: string;
  createdAt: string;
  engineVersion: string;
  durationS: number;
  seed: number;
  actionCount: number;
  keyResults: RunKeyResults;
}

const num = z.number().nullable().optional().catch(null);
const measuresSchema = z.looseObject({ kind: z.string().nullable().optional().catch(null), iae: num, overshootPct: num, settlingTimeS: num });
const windowsSchema = z.array(measuresSchema).nullable().catch(null);

/** Key results from the per-window measures (and the whole run's, for a run without windows). */
export function keyResultsOf(windows: unknown, whole: unknown, trips: number): RunKeyResults {
  const ws = windowsSchema.parse(windows) ?? [];
  const w = measuresSchema.nullable().catch(null).parse(whole);
  if (ws.length === 0) return { iae: w?.iae ?? null, overshootPct: w?.overshootPct ?? null, settlingTimeS: w?.settlingTimeS ?? null, trips };
  const iaes = ws.map((x) => x.iae);
  const steps = ws.filter((x) => x.kind === "setpoint");
  const overshoots = steps.map((x) => x.overshootPct).filter((x): x is number => typeof x === "number");
  const settling = steps.map((x) => x.settlingTimeS);
  return {
    iae: iaes.every((x) => typeof x === "number") ? (iaes as number[]).reduce((a, b) => a + b, 0) : null,
    overshootPct: overshoots.length ? Math.max(...overshoots) : null,
    settlingTimeS: settling.length && settling.every((x) => typeof x === "number") ? Math.max(...(settling as number[])) : null,
    trips,
  };
}

/** The user's own saved runs of a plant, newest first; without the drill, controller or action log. */
export async function runsFor(user: BenchReader, plantRef: string, limit = 200): Promise<SavedRunSummary[]> {
  const rows = await getDb()
    .select({
      id: savedRuns.id,
      plantRef: savedRuns.plantRef,
      title: savedRuns.title,
      createdAt: savedRuns.createdAt,
      engineVersion: savedRuns.engineVersion,
      durationS: savedRuns.durationS,
      seed: savedRuns.seed,
      actionCount: sql<number>`jsonb_array_length(${savedRuns.actionLog})`.mapWith(Number),
      whole: sql<unknown>`${savedRuns.results} #> '{wholeRun,trueTemperature}'`,
      // only the three measures of each window on the true temperature, not the windows in full
      windows: sql<unknown>`(select jsonb_agg(jsonb_build_object('kind', w -> 'kind', 'iae', w #> '{trueTemperature,iae}', 'overshootPct', w #> '{trueTemperature,overshootPct}', 'settlingTimeS', w #> '{trueTemperature,settlingTimeS}')) from jsonb_array_elements(case when jsonb_typeof(${savedRuns.results} -> 'windows') = 'array' then ${savedRuns.results} -> 'windows' else '[]'::jsonb end) as w)`,
      trips: sql<number>`coalesce(jsonb_array_length(case when jsonb_typeof(${savedRuns.results} -> 'safetyTrips') = 'array' then ${savedRuns.results} -> 'safetyTrips' end), 0)`.mapWith(Number),
    })
    .from(savedRuns)
    .where(and(eq(savedRuns.ownerId, user.id), eq(savedRuns.plantRef, plantRef)))
    .orderBy(desc(savedRuns.createdAt), desc(savedRuns.id))
    .limit(limit);
  return rows.map(({ whole, windows, trips, createdAt, ...r }) => ({ ...r, createdAt: createdAt.toISOString(), keyResults: keyResultsOf(windows, whole, trips) }));
}

export interface SavedRunDetail {
  id: string;
  plantRef: string;
  title: string;
  createdAt: string;
  drill: Drill;
  controller: ControllerConfig;
  seed: number;
  actionLog: StampedAction[];
  results: Record<string, unknown>;
  engineVersion: string;
  durationS: number;
}

/** The full saved run for replay: the owner's only. */
export async function runFor(user: BenchReader, runId: string): Promise<SavedRunDetail | null> {
  if (!uuidPattern.test(runId)) return null;
  const [r] = await getDb().select().from(savedRuns).where(and(eq(savedRuns.id, runId), eq(savedRuns.ownerId, user.id)));
  if (!r) return null;
  // Returned exactly as stored (validated on write with the engine of engineVersion): parsing
  // again here could fill defaults of a newer engine and change the replay.
  return {
    id: r.id,
    plantRef: r.plantRef,
    title: r.title,
    createdAt: r.createdAt.toISOString(),
    drill: r.drill as unknown as Drill,
    controller: r.controller as unknown as ControllerConfig,
    seed: r.seed,
    actionLog: r.actionLog as StampedAction[],
    results: r.results,
    engineVersion: r.engineVersion,
    durationS: r.durationS,
  };
}
