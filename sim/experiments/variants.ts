/**
 * Running a list of runs (drill, controller, seed, optional action log): the common core of a
 * sweep, the PI-versus-PID comparison, the tuning map and the comparison of saved runs. A
 * generator, so the caller (an experiments worker) can report progress and honour a cancel
 * between runs.
 */
import { controllerConfigSchema, type ControllerConfig, type ControllerConfigInput } from "../control/config";
import { drillSchema, type Drill, type DrillInput } from "../drill/schema";
import { runDrill } from "../drill/run-drill";
import type { RunResults } from "../drill/results";
import type { StampedAction } from "../drill/actions";

export interface Variant {
  label: string;
  controller: ControllerConfigInput;
}

export interface RunJob {
  label: string;
  drill: Drill | DrillInput;
  controller: ControllerConfigInput;
  seed: number;
  actions?: StampedAction[];
}

export interface VariantRun {
  index: number;
  label: string;
  controller: ControllerConfig;
  results: RunResults;
  /** for overlaid trends: time and the true temperature */
  timeS: Float64Array;
  trueC: Float64Array;
}

/** The same drill and seed under each variant's controller. */
export function jobsFor(drill: Drill | DrillInput, variants: readonly Variant[], seed: number): RunJob[] {
  const parsed = drillSchema.parse(drill); // once, not per job
  return variants.map((v) => ({ label: v.label, drill: parsed, controller: v.controller, seed }));
}

export function* runJobs(jobs: readonly RunJob[], keepTraces = true): Generator<VariantRun> {
  for (let i = 0; i < jobs.length; i++) {
    const job = jobs[i];
    const controller = controllerConfigSchema.parse(job.controller);
    const run = runDrill(job.drill, controller, job.actions ?? [], job.seed);
    yield {
      index: i,
      label: job.label,
      controller,
      results: run.results,
      timeS: keepTraces ? run.trace.timeS.slice() : new Float64Array(0),
      trueC: keepTraces ? run.trace.trueC.slice() : new Float64Array(0),
    };
  }
}
