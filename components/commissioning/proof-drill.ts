/**
 * Proof tests for the plant being pre-commissioned, as drills in the engine's format:
 * - a stored drill moved onto this plant: its timeline and scoring kept, its plant, sensor chain,
 *   final element and cutout replaced by the Bench's (the site's equipment, not the author's);
 * - a timeline built on the spot: a setpoint ladder from the working SP, then the disturbances
 *   expected on site one after another, each step and disturbance scored in its own window.
 */
import { outputHolding } from "@/components/bench/bench-drill";
import { resolvePlant } from "@/sim/drill/resolve";
import { drillSchema, type DrillEvent, type DrillInput } from "@/sim/drill/schema";
import { steadyStateTemperatureC } from "@/sim/plant/derived-figures";
import type { PlantDefinition } from "@/sim/plant/plant-definition";

/** The Bench's plant as a definition (a preset's or a stored plant's). */
function definitionOf(base: DrillInput): PlantDefinition {
  return resolvePlant(drillSchema.parse(base));
}

/** Setpoints of a drill: the starting one and every later step or ramp end. */
function setpointsOf(drill: DrillInput): number[] {
  const sps = [drill.initialState.setpointC];
  for (const e of drill.events ?? []) {
    if (e.type === "setpoint") sps.push(e.setpointC);
    if (e.type === "setpoint-ramp") sps.push(e.fromC, e.toC);
  }
  return sps;
}

/** What the technician should check before trusting a proof test on this plant. */
export function reachWarnings(drill: DrillInput, base: DrillInput): string[] {
  const def = definitionOf(base);
  const top = steadyStateTemperatureC(def, 100);
  const bottom = steadyStateTemperatureC(def, 0);
  const trip = base.cutout?.tripPointC ?? null;
  const out: string[] = [];
  const sps = setpointsOf(drill);
  const high = Math.max(...sps);
  const low = Math.min(...sps);
  if (high > top - 1) out.push(`SP ${high} °C is at or beyond what OUT 100 % holds on this plant (${top.toFixed(1)} °C).`);
  else if (trip !== null && high > trip - 5) out.push(`SP ${high} °C is within 5 °C of the cutout trip (${trip} °C).`);
  if (low < bottom + 1) out.push(`SP ${low} °C is at or below what OUT 0 % settles at on this plant (${bottom.toFixed(1)} °C).`);
  return out;
}

/** Events that only a physical enclosure answers (a transfer-function twin has no airflow, door or contents). */
export const ENCLOSURE_ONLY = new Set<DrillEvent["type"]>(["inlet-blockage", "door-open", "cold-load"]);

/** A stored drill moved onto the Bench's plant. */
export function drillOnPlant(stored: DrillInput, base: DrillInput): DrillInput {
  const def = definitionOf(base);
  const init = stored.initialState;
  // a steady start at the author's OUT would not be steady here: hold the drill's SP on this plant instead
  const temperatures = init.temperatures?.kind === "steady" ? { kind: "steady" as const, outPercent: outputHolding(def, init.setpointC) } : init.temperatures;
  const outPercent = temperatures?.kind === "steady" ? temperatures.outPercent : init.outPercent;
  const events = (stored.events ?? []).filter((e) => def.kind === "enclosure" || !ENCLOSURE_ONLY.has(e.type));
  const moved: DrillInput = {
    ...stored,
    plant: base.plant,
    initialState: { ...init, ...(temperatures ? { temperatures } : {}), ...(outPercent !== undefined ? { outPercent } : {}) },
    events,
    drive: base.drive,
    cutout: base.cutout,
  };
  if (base.sensor) moved.sensor = base.sensor;
  else delete moved.sensor;
  drillSchema.parse(moved); // throws when the drill does not fit (the caller says why)
  return moved;
}

/** Events a stored drill loses on a plant that cannot answer them (so the UI can say so). */
export function droppedEvents(stored: DrillInput, base: DrillInput): DrillEvent["type"][] {
  const def = definitionOf(base);
  if (def.kind === "enclosure") return [];
  return (stored.events ?? []).map((e) => e.type).filter((t) => ENCLOSURE_ONLY.has(t));
}

export type SiteDisturbance =
  | { kind: "inlet-blockage"; percent: number; forS: number }
  | { kind: "door-open"; forS: number }
  | { kind: "cold-load"; massKg: number; specificHeatJPerKgK: number; temperatureC: number; airCouplingWPerK: number }
  | { kind: "ambient"; temperatureC: number; forS: number }
  | { kind: "supply-voltage"; percentOfNominal: number; forS: number };

export interface LadderSpec {
  /** the working SP the test starts settled at, °C; default the Bench's starting SP */
  startC?: number;
  /** settled time at the working SP before the first step, s */
  leadInS: number;
  /** each step's SP, and the time held there before the next change, s */
  steps: { setpointC: number; holdS: number }[];
  /** after the ladder, at its last SP: each disturbance and the time watched after it, s */
  disturbances: { disturbance: SiteDisturbance; holdS: number }[];
}

/** The longest proof test a tuning record re-runs on the server (app/_lib/records/proof-run.ts). */
export const MAX_PROOF_DURATION_S = 12 * 3600;

/** A stored drill may be longer than a record can carry; the technician hears it before running it. */
export function lengthWarning(drill: DrillInput): string | null {
  return drill.durationS > MAX_PROOF_DURATION_S ? `This test runs ${(drill.durationS / 3600).toFixed(1)} h; a tuning record re-runs proof tests of at most ${MAX_PROOF_DURATION_S / 3600} h, so it cannot go on the record.` : null;
}

export function disturbanceLabel(d: SiteDisturbance): string {
  switch (d.kind) {
    case "inlet-blockage":
      return `inlet ${num(d.percent)} % blocked for ${minutes(d.forS)}`;
    case "door-open":
      return `door open ${d.forS} s`;
    case "cold-load":
      return `cold load ${num(d.massKg)} kg at ${num(d.temperatureC)} °C`;
    case "ambient":
      return `ambient ${num(d.temperatureC)} °C for ${minutes(d.forS)}`;
    case "supply-voltage":
      return `supply ${num(d.percentOfNominal)} % for ${minutes(d.forS)}`;
  }
}

/** a figure as a person would write it (no binary-fraction tails such as 41.998901 °C) */
const num = (x: number) => String(+x.toFixed(2));
const minutes = (s: number) => (s % 60 === 0 ? `${s / 60} min` : `${s} s`);

function eventOf(d: SiteDisturbance, timeS: number): DrillEvent {
  switch (d.kind) {
    case "inlet-blockage":
      return { type: "inlet-blockage", timeS, percent: d.percent, durationS: d.forS };
    case "door-open":
      return { type: "door-open", timeS, durationS: d.forS };
    case "cold-load":
      return { type: "cold-load", timeS, massKg: d.massKg, specificHeatJPerKgK: d.specificHeatJPerKgK, temperatureC: d.temperatureC, airCouplingWPerK: d.airCouplingWPerK };
    case "ambient":
      return { type: "ambient", timeS, temperatureC: d.temperatureC, durationS: d.forS };
    case "supply-voltage":
      return { type: "supply-voltage", timeS, percentOfNominal: d.percentOfNominal, durationS: d.forS };
  }
}

/** One line naming the ladder and its disturbances (the proof test's label on the record). */
export function ladderLabel(base: DrillInput, spec: LadderSpec): string {
  const sps = [spec.startC ?? base.initialState.setpointC, ...spec.steps.map((s) => s.setpointC)].join(" → ");
  const ds = spec.disturbances.map((d) => disturbanceLabel(d.disturbance));
  return [`SP ${sps} °C`, ...ds].join(", ").slice(0, 80);
}

/** Why a ladder cannot be run on this plant, or null. */
export function ladderProblem(base: DrillInput, spec: LadderSpec): string | null {
  if (spec.steps.length === 0 && spec.disturbances.length === 0) return "Give at least one SP step or one disturbance.";
  if (!(spec.leadInS >= 0)) return "The lead-in cannot be negative.";
  if (spec.startC !== undefined && !Number.isFinite(spec.startC)) return "The working SP must be a number of °C.";
  if ([...spec.steps, ...spec.disturbances].some((s) => !(s.holdS > 0))) return "Every step and disturbance needs a watch time above 0.";
  const total = spec.leadInS + [...spec.steps, ...spec.disturbances].reduce((a, s) => a + s.holdS, 0);
  if (total > MAX_PROOF_DURATION_S) return `The whole test runs ${(total / 3600).toFixed(1)} h; keep it within ${MAX_PROOF_DURATION_S / 3600} h.`;
  const def = definitionOf(base);
  const idle = spec.disturbances.find((d) => def.kind !== "enclosure" && ENCLOSURE_ONLY.has(d.disturbance.kind));
  if (idle) return `This plant is a transfer-function model: ${disturbanceLabel(idle.disturbance)} has no effect on it (it needs a physical enclosure).`;
  return null;
}

/** The ladder and disturbances as a drill on the Bench's plant, starting settled at the working SP. */
export function ladderDrill(base: DrillInput, spec: LadderSpec): DrillInput {
  const problem = ladderProblem(base, spec);
  if (problem) throw new Error(problem);
  const events: DrillEvent[] = [];
  const windows: { id: string; label: string; kind: "setpoint" | "disturbance"; startS: number; endS: number; eventTimeS: number }[] = [];
  let t = spec.leadInS;
  const def = definitionOf(base);
  const sp0 = spec.startC ?? base.initialState.setpointC;
  const out0 = outputHolding(def, sp0);
  let sp = sp0;
  spec.steps.forEach((s, i) => {
    events.push({ type: "setpoint", timeS: t, setpointC: s.setpointC });
    windows.push({ id: `step-${i + 1}`, label: `SP ${sp} → ${s.setpointC} °C`, kind: "setpoint", startS: t, endS: t + s.holdS, eventTimeS: t });
    sp = s.setpointC;
    t += s.holdS;
  });
  spec.disturbances.forEach((d, i) => {
    events.push(eventOf(d.disturbance, t));
    windows.push({ id: `disturbance-${i + 1}`, label: disturbanceLabel(d.disturbance), kind: "disturbance", startS: t, endS: t + d.holdS, eventTimeS: t });
    t += d.holdS;
  });
  const drill: DrillInput = {
    ...base,
    id: "site-proof-test",
    revision: 1,
    title: `${base.title} — site proof test`,
    description: ladderLabel(base, spec),
    initialState: { ...base.initialState, temperatures: { kind: "steady", outPercent: out0 }, setpointC: sp0, outPercent: out0 },
    events,
    scoring: { windows },
    durationS: t,
  };
  drillSchema.parse(drill);
  return drill;
}
