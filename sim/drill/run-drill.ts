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
import { noiseSigmaC } from "./resolve";
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

/** Rule violations of the starting configuration, of every tuning change in the log, and of operator actions the drill does not allow. */
function allViolations(drill: Drill, cfg: ControllerConfig, actions: readonly StampedAction[]): string[] {
  const found = new Set(controllerViolations(drill, cfg));
  for (const a of actions) {
    if (a.type === "tuning") {
      for (const v of controllerViolations(drill, controllerConfigSchema.parse(a.controller))) found.add(v);
    } else if ((a.type === "setpoint" || a.type === "mode" || a.type === "manual-output") && !drill.trainee.mayChange.operation) {
      found.add(`${a.type} (operating the loop is not allowed in this drill)`);
    }
  }
  return [...found];
}
