/**
 * Headless run of a drill: the same Simulation the Bench uses, with a recorded action log
 * replayed at its sample stamps. Deterministic: the same drill, controller, actions, seed and
 * engine version give an identical trace.
 */
import { ENGINE_VERSION } from "../version";
import { controllerConfigSchema, type ControllerConfig, type ControllerConfigInput } from "../control/config";
import type { IntegratorKind } from "../plant/enclosure-plant";
import { drillSchema, type Drill, type DrillInput } from "./schema";
import { Simulation, type SimEvent } from "./simulation";
import type { StampedAction } from "./actions";
import type { Trace } from "./trace";
import { computeRunResults, type RunResults } from "./results";
import { controllerViolations } from "./permissions";
import { noiseSigmaC, resolvePlant } from "./resolve";
import { expandTimeline } from "./timeline";
import { SAME_INSTANT_S } from "../actuator/heater-drive";
import { scoreAttempt, type AttemptScore } from "./score";

export interface RunDrillOptions {
  integrator?: IntegratorKind;
  odexTolerance?: number;
  rk4MaxStepS?: number;
  /** also run the reference tuning and score the attempt (doubles the cost) */
  score?: boolean;
}

export interface DrillRun {
  engineVersion: string;
  seed: number;
  controller: ControllerConfig;
  trace: Trace;
  events: SimEvent[];
  actions: StampedAction[];
  results: RunResults;
  score?: AttemptScore;
}

function asDrill(drill: Drill | DrillInput): Drill {
  return drillSchema.parse(drill);
}

export function runDrill(
  drillIn: Drill | DrillInput,
  controller?: ControllerConfig | ControllerConfigInput | null,
  actions: readonly StampedAction[] = [],
  seed?: number,
  options: RunDrillOptions = {},
): DrillRun {
  const drill = asDrill(drillIn);
  const cfg = controllerConfigSchema.parse(controller ?? drill.referenceTuning);
  const sim = new Simulation(drill, { controller: cfg, seed, integrator: options.integrator, odexTolerance: options.odexTolerance, rk4MaxStepS: options.rk4MaxStepS });
  sim.schedule(actions);
  sim.runToEnd();
  const trace = sim.trace().length > sim.lastSample + 1 ? sim.traceChunk(0, sim.lastSample + 1) : sim.trace();
  const results = computeRunResults(trace, {
    drill,
    seed: sim.seed,
    engineVersion: ENGINE_VERSION,
    noiseSigmaC: noiseSigmaC(sim.sensorConfig),
    cutoutPointC: sim.cutoutConfig.tripPointC,
    safetyTrips: sim.safetyTrips,
    heaterEnergyKWh: energyKWh(trace, sim.sampleTimeS),
    controllerViolations: allViolations(drill, cfg, actions),
  });
  const run: DrillRun = { engineVersion: ENGINE_VERSION, seed: sim.seed, controller: cfg, trace, events: sim.events, actions: sim.actionLog, results };
  if (options.score) {
    const ref = runDrill(drill, drill.referenceTuning, [], sim.seed, { ...options, score: false });
    run.score = scoreAttempt(drill, results, ref.results);
  }
  return run;
}

/** Σ mean power × Ts over the drill's sample intervals (the last row starts no interval), kWh. */
function energyKWh(trace: Trace, ts: number): number {
  let e = 0;
  for (let i = 0; i + 1 < trace.length; i++) e += trace.heaterPowerW[i] * ts;
  return e / 3.6e6;
}

/**
 * Rule violations of the starting configuration, of every tuning change in the log, and of
 * operator actions the drill does not allow. Method: the drill's own rules (schema.ts trainee):
 * - mode and manual-output actions are allowed when operating the loop is, and also when the drill
 *   allows a relay or bump test (sim/worker/bench-tests.ts takes the loop to manual and drives OUT
 *   through exactly those actions);
 * - setpoint actions need `operation`, except, when tests are allowed, one made while in manual that
 *   puts the SP back to the value it had when the loop went to manual (the bump test's hand-back
 *   with SP tracking: SP restored, then auto, at the same sample; the log is taken in sample order).
 * Results score against the drill's scripted SP when operation is not allowed (results.ts), so
 * hand-operating cannot game the setpoint.
 */
function allViolations(drill: Drill, cfg: ControllerConfig, actions: readonly StampedAction[]): string[] {
  const found = new Set(controllerViolations(drill, cfg));
  const t = drill.trainee;
  const testsAllowed = t.relayTestAllowed || t.bumpTestAllowed;
  const modeAndOutputOk = t.mayChange.operation || testsAllowed;
  // the SP the drill prescribes at a sample (its initial SP and scripted steps and ramps)
  const ts = cfg.sampleTimeS;
  const scripted = expandTimeline(drill.events, resolvePlant(drill), ts).filter((c) => c.change.kind === "setpoint");
  const scriptedSpAt = (sample: number): number => {
    let sp = drill.initialState.setpointC;
    for (const c of scripted) {
      if (c.timeS > sample * ts + SAME_INSTANT_S) continue;
      if (c.change.kind === "setpoint") sp = c.change.setpointC;
    }
    return sp;
  };
  let operatorSp: number | null = null; // an SP set by hand (itself reported when not allowed)
  let spWhenManual: number | null = null;
  for (const a of [...actions].sort((x, y) => x.sample - y.sample)) {
    if (a.type === "tuning") {
      // a relay test switches the block to on/off between its two OUT levels (and back): allowed with the test
      const relayLevels = new Set(t.relayTestAllowed ? ["outOnPct", "outOffPct"] : []);
      for (const v of controllerViolations(drill, controllerConfigSchema.parse(a.controller))) if (!relayLevels.has(v)) found.add(v);
    } else if (a.type === "mode" || a.type === "manual-output") {
      if (a.type === "mode") spWhenManual = a.mode === "manual" ? operatorSp ?? scriptedSpAt(a.sample) : null; // a restore counts only while in manual
      if (!modeAndOutputOk) found.add(`${a.type} (operating the loop is not allowed in this drill)`);
    } else if (a.type === "setpoint") {
      const restore: boolean = testsAllowed && spWhenManual !== null && Math.abs(a.setpointC - spWhenManual) <= 1e-9;
      // the SP set to the value already in force changes nothing (a relay test pins it so)
      const unchanged: boolean = testsAllowed && Math.abs(a.setpointC - (operatorSp ?? scriptedSpAt(a.sample))) <= 1e-9;
      if (!t.mayChange.operation && !restore && !unchanged) found.add(`${a.type} (operating the loop is not allowed in this drill)`);
      operatorSp = restore || unchanged ? operatorSp : a.setpointC;
    }
  }
  return [...found];
}
