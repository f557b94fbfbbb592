/**
 * Results of a run: per scoring window and for the whole run, each on the true (air)
 * temperature — what is scored — and the same on the filtered PV (what the controller saw).
 * The window measures themselves come from sim/results (computeWindowResults).
 */
import { computeWindowResults, type WindowResults } from "../results/window";
import type { SafetyTrip } from "../safety/cutout";
import type { Drill, ScoringWindow } from "./schema";
import type { Trace } from "./trace";
import { expandTimeline } from "./timeline";
import { resolvePlant } from "./resolve";
import { SAME_INSTANT_S } from "../actuator/heater-drive";

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

function setpointStep(sp: ArrayLike<number>, trace: Trace, eventTimeS: number, endS: number): number | undefined {
  const ts = trace.length > 1 ? trace.timeS[1] - trace.timeS[0] : 1;
  const before = Math.max(0, Math.min(trace.length - 1, Math.round(eventTimeS / ts) - 1));
  const end = Math.max(0, Math.min(trace.length - 1, Math.floor(endS / ts)));
  const step = sp[end] - sp[before];
  return step !== 0 ? step : undefined;
}

/** Start times of the drill's own setpoint changes (steps and ramps), sorted. */
function scriptedSetpointTimes(drill: Drill): number[] {
  return drill.events
    .filter((e) => e.type === "setpoint" || e.type === "setpoint-ramp")
    .map((e) => e.timeS)
    .sort((a, b) => a - b);
}

/**
 * A setpoint window ends just before the drill's next scripted setpoint change inside it, so its
 * measures are about one step. Only the drill's timeline counts: an operator's own SP change must
 * not cut a scored window short (that would shrink its IAE and settling horizon).
 */
function effectiveEnd(drill: Drill, trace: Trace, kind: string, eventTimeS: number, endS: number): number {
  if (kind !== "setpoint" || trace.length < 2) return endS;
  const ts = trace.timeS[1] - trace.timeS[0];
  const next = scriptedSetpointTimes(drill).find((t) => t > eventTimeS + ts / 2 && t <= endS);
  return next === undefined ? endS : next - ts / 2;
}

/**
 * The setpoint the drill prescribes at every sample: its initial SP and its own timeline (a ramp
 * as the same staircase the simulation applies), applied at the first sample at or after each
 * change. Scored windows measure against it unless the trainee may operate the loop, so setting
 * the SP back by hand cannot make a step look easy.
 */
function scriptedSetpoint(drill: Drill, trace: Trace): Float64Array {
  const ts = trace.length > 1 ? trace.timeS[1] - trace.timeS[0] : drill.referenceTuning.sampleTimeS;
  const changes = expandTimeline(drill.events, resolvePlant(drill), ts).filter((c) => c.change.kind === "setpoint");
  const out = new Float64Array(trace.length);
  let sp = drill.initialState.setpointC;
  let j = 0;
  for (let k = 0; k < trace.length; k++) {
    while (j < changes.length && changes[j].timeS <= trace.timeS[k] + SAME_INSTANT_S) {
      const c = changes[j++].change;
      if (c.kind === "setpoint") sp = c.setpointC;
    }
    out[k] = sp;
  }
  return out;
}

function windowPair(trace: Trace, win: Pick<ScoringWindow, "kind" | "startS" | "endS" | "eventTimeS">, ctx: ResultsContext, sp: ArrayLike<number> = trace.setpointC) {
  const eventTimeS = win.eventTimeS ?? win.startS;
  const w = { ...win, endS: effectiveEnd(ctx.drill, trace, win.kind, eventTimeS, win.endS) };
  const common = {
    t: trace.timeS,
    sp,
    out: trace.outPercent,
    heaterPowerW: trace.heaterPowerW,
    windowStartS: w.startS,
    windowEndS: w.endS,
    kind: w.kind,
    eventTimeS,
    stepSizeC: w.kind === "setpoint" ? setpointStep(sp, trace, eventTimeS, w.endS) : undefined,
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
  const sp = d.trainee.mayChange.operation ? trace.setpointC : scriptedSetpoint(d, trace);
  return {
    engineVersion: ctx.engineVersion,
    drillId: d.id,
    drillRevision: d.revision,
    formatVersion: d.formatVersion,
    seed: ctx.seed,
    windows: d.scoring.windows.map((w) => ({ id: w.id, label: w.label ?? w.id, kind: w.kind, weight: w.weight, ...windowPair(trace, w, ctx, sp) })),
    // the whole run has no single step: integrals, effort, energy and peak deviation over [0, end]
    wholeRun: windowPair(trace, { kind: "disturbance", startS: 0, endS: d.durationS, eventTimeS: 0 }, ctx, sp),
    safetyTrips: [...ctx.safetyTrips],
    heaterEnergyKWh: ctx.heaterEnergyKWh,
    controllerViolations: ctx.controllerViolations,
  };
}
