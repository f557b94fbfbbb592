/**
 * Running one drill under several controller configurations: the common core of a sweep, the
 * PI-versus-PID comparison and the tuning map. A generator, so the caller (the experiments worker)
 * can report progress and honour a cancel between runs.
 */
import { controllerConfigSchema, type ControllerConfig, type ControllerConfigInput } from "../control/config";
import { drillSchema, type Drill, type DrillInput } from "../drill/schema";
import { runDrill } from "../drill/run-drill";
import type { RunResults } from "../drill/results";

export interface Variant {
  label: string;
  controller: ControllerConfigInput;
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

export function* runVariants(drillIn: Drill | DrillInput, variants: readonly Variant[], seed: number, keepTraces = true): Generator<VariantRun> {
  const drill = drillSchema.parse(drillIn);
  for (let i = 0; i < variants.length; i++) {
    const controller = controllerConfigSchema.parse(variants[i].controller);
    const run = runDrill(drill, controller, [], seed);
    yield {
      index: i,
      label: variants[i].label,
      controller,
      results: run.results,
      timeS: keepTraces ? run.trace.timeS.slice() : new Float64Array(0),
      trueC: keepTraces ? run.trace.trueC.slice() : new Float64Array(0),
    };
  }
}
