/**
 * Results of a run: per scoring window and for the whole run, each on the true (air)
 * temperature — what is scored — and the same on the filtered PV (what the controller saw).
 * The window measures themselves come from sim/results (computeWindowResults).
 */
import { computeWindowResults, type WindowResults } from "../results/window";
import type { SafetyTrip } from "../safety/cutout";
import type { Drill, ScoringWindow } from "./schema";
import type { Trace } from "./trace";

export interface WindowResultPair {
  id: string;
  label: string;
  kind: "setpoint" | "disturbance";
  weight: number;
  trueTemperature: WindowResults;
  filteredPv: WindowResults;
}

export interface RunResults {
  engineVersion: string;
  drillId: string;
  drillRevision: number;
  formatVersion: number;
  seed: number;
  windows: WindowResultPair[];
  wholeRun: { trueTemperature: WindowResults; filteredPv: WindowResults };
  safetyTrips: SafetyTrip[];
  /** ∫ heater power dt over the drill, kWh (exact, from the integration) */
  heaterEnergyKWh: number;
  /** settings the trainee changed that the drill does not allow (empty = within the rules) */
  controllerViolations: string[];
}

export interface ResultsContext {
  drill: Drill;
  seed: number;
  engineVersion: string;
  noiseSigmaC: number;
  cutoutPointC: number;
  safetyTrips: readonly SafetyTrip[];
  heaterEnergyKWh: number;
  controllerViolations: string[];
}

function setpointStep(trace: Trace, eventTimeS: number, endS: number): number | undefined {
  const ts = trace.length > 1 ? trace.timeS[1] - trace.timeS[0] : 1;
  const before = Math.max(0, Math.min(trace.length - 1, Math.round(eventTimeS / ts) - 1));
  const end = Math.max(0, Math.min(trace.length - 1, Math.round(endS / ts)));
  const step = trace.setpointC[end] - trace.setpointC[before];
  return step !== 0 ? step : undefined;
}

/** A setpoint window ends before the next setpoint change inside it (the measures are about one step). */
function effectiveEnd(trace: Trace, kind: string, eventTimeS: number, endS: number): number {
  if (kind !== "setpoint" || trace.length < 2) return endS;
  const ts = trace.timeS[1] - trace.timeS[0];
  const i0 = Math.max(0, Math.round(eventTimeS / ts));
  const i1 = Math.min(trace.length - 1, Math.round(endS / ts));
  for (let i = i0 + 1; i <= i1; i++) if (trace.setpointC[i] !== trace.setpointC[i0]) return trace.timeS[i - 1];
  return endS;
}

function windowPair(trace: Trace, win: Pick<ScoringWindow, "kind" | "startS" | "endS" | "eventTimeS">, ctx: ResultsContext) {
  const eventTimeS = win.eventTimeS ?? win.startS;
  const w = { ...win, endS: effectiveEnd(trace, win.kind, eventTimeS, win.endS) };
  const common = {
    t: trace.timeS,
    sp: trace.setpointC,
    out: trace.outPercent,
    heaterPowerW: trace.heaterPowerW,
    windowStartS: w.startS,
    windowEndS: w.endS,
    kind: w.kind,
    eventTimeS,
    stepSizeC: w.kind === "setpoint" ? setpointStep(trace, eventTimeS, w.endS) : undefined,
    bandFloorC: ctx.drill.scoring.bandFloorC,
    noiseSigmaC: ctx.noiseSigmaC,
    cutoutPointC: ctx.cutoutPointC,
  };
  return {
    trueTemperature: computeWindowResults({ ...common, y: trace.trueC }),
    filteredPv: computeWindowResults({ ...common, y: trace.pvFilteredC }),
  };
}

export function computeRunResults(trace: Trace, ctx: ResultsContext): RunResults {
  const d = ctx.drill;
  return {
    engineVersion: ctx.engineVersion,
    drillId: d.id,
    drillRevision: d.revision,
    formatVersion: d.formatVersion,
    seed: ctx.seed,
    windows: d.scoring.windows.map((w) => ({ id: w.id, label: w.label ?? w.id, kind: w.kind, weight: w.weight, ...windowPair(trace, w, ctx) })),
    wholeRun: windowPair(trace, { kind: "setpoint", startS: 0, endS: d.durationS }, ctx),
    safetyTrips: [...ctx.safetyTrips],
    heaterEnergyKWh: ctx.heaterEnergyKWh,
    controllerViolations: ctx.controllerViolations,
  };
}
