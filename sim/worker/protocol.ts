/**
 * Messages between the Bench (main thread) and the engine's Web Worker. Trace chunks travel as
 * typed arrays in the transfer list, so posting them copies nothing.
 */
import type { ControllerConfigInput } from "../control/config";
import type { DrillInput } from "../drill/schema";
import type { OperatorActionInput, StampedAction } from "../drill/actions";
import type { SampleSnapshot, SimEvent } from "../drill/simulation";
import type { Trace } from "../drill/trace";

/** Simulated seconds per wall second, or as fast as the worker can go. */
export type BenchSpeed = number | "max";

export type ToWorker =
  | { type: "load"; drill: DrillInput; controller?: ControllerConfigInput; seed?: number; actions?: StampedAction[] }
  | { type: "run"; speed: BenchSpeed }
  | { type: "pause" }
  | { type: "step"; samples: number }
  | { type: "act"; action: OperatorActionInput }
  | { type: "reset" }
  | { type: "fingerprint" };

export type FromWorker =
  | { type: "loaded"; engineVersion: string; sampleTimeS: number; seed: number }
  | { type: "chunk"; from: number; trace: Trace; snapshot: SampleSnapshot; events: SimEvent[]; actions: StampedAction[] }
  | { type: "status"; running: boolean; speed: BenchSpeed }
  | { type: "fingerprint"; rows: number; value: string }
  | { type: "error"; message: string };

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
