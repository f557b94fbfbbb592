/** Messages to and from the experiments worker (sweeps, comparisons, tuning maps). */
import type { RunJob, VariantRun } from "../experiments/variants";

export type ToExperiments =
  | { type: "start"; id: number; jobs: RunJob[]; keepTraces: boolean }
  | { type: "cancel"; id: number };

export type FromExperiments =
  | { type: "progress"; id: number; done: number; total: number }
  | { type: "row"; id: number; run: VariantRun }
  | { type: "done"; id: number; elapsedMs: number }
  | { type: "cancelled"; id: number }
  | { type: "error"; id: number; message: string };
