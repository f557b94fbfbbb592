/**
 * Messages between the Bench (main thread) and the engine's Web Worker. Trace chunks travel as
 * typed arrays in the transfer list, so posting them copies nothing.
 */
import type { ControllerConfigInput } from "../control/config";
import type { DrillInput } from "../drill/schema";
import type { OperatorActionInput, StampedAction } from "../drill/actions";
import type { SampleSnapshot, SimEvent } from "../drill/simulation";
import type { Trace } from "../drill/trace";
import type { BumpTestOptions } from "../tuning/bump/bump-test";
import type { HeatUpEstimate, OutputForSetpoint, PowerCurve } from "../tuning/power-curve";
import type { RelayTestOptions } from "../tuning/relay/relay-test";
import type { BenchTestOutcome, BenchTestProgress } from "./bench-tests";

/** Simulated seconds per wall second, or as fast as the worker can go. */
export type BenchSpeed = number | "max";

export type ToWorker =
  | { type: "load"; drill: DrillInput; controller?: ControllerConfigInput; seed?: number; actions?: StampedAction[] }
  | { type: "run"; speed: BenchSpeed }
  | { type: "pause" }
  | { type: "step"; samples: number }
  | { type: "act"; action: OperatorActionInput }
  | { type: "reset" }
  | { type: "fingerprint" }
  /** start a relay or bump test on the running loop; `speed` "bench" follows the Bench's run speed */
  | { type: "relay-start"; options: RelayTestOptions; speed?: "bench" | "max" }
  | { type: "bump-start"; options: BumpTestOptions; speed?: "bench" | "max" }
  | { type: "test-cancel" }
  /** the power curve of the loaded plant, with the OUT that holds `setpointC` and heat-up times */
  | { type: "power-curve"; setpointC: number };

export type FromWorker =
  | { type: "loaded"; engineVersion: string; sampleTimeS: number; seed: number }
  | { type: "chunk"; from: number; trace: Trace; snapshot: SampleSnapshot; events: SimEvent[]; actions: StampedAction[] }
  | { type: "status"; running: boolean; speed: BenchSpeed }
  | { type: "fingerprint"; rows: number; value: string }
  | { type: "error"; message: string }
  | { type: "power-curve"; setpointC: number; curve: PowerCurve; holding: OutputForSetpoint; staticGainCPerPercent: number | null; heatUp: HeatUpEstimate }
  | ({ type: "test-progress" } & BenchTestProgress)
  | ({ type: "test-outcome" } & BenchTestOutcome);

export const TRACE_ARRAY_KEYS = [
  "timeS",
  "setpointC",
  "pvRawC",
  "pvFilteredC",
  "trueC",
  "outPercent",
  "heaterPowerW",
  "heaterOn",
  "pvBad",
  "cutoutTripped",
] as const satisfies readonly (keyof Trace)[];

/** The buffers of a chunk, for postMessage's transfer list. */
export function transferablesOf(trace: Trace): ArrayBuffer[] {
  return TRACE_ARRAY_KEYS.map((k) => trace[k].buffer as ArrayBuffer);
}
