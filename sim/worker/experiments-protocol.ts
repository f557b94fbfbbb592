/** Messages to and from the experiments worker (sweeps, comparisons, tuning maps). */
import type { DrillInput } from "../drill/schema";
import type { Variant, VariantRun } from "../experiments/variants";

export type ToExperiments =
  | { type: "start"; id: number; drill: DrillInput; variants: Variant[]; seed: number; keepTraces: boolean }
  | { type: "cancel"; id: number };

export type FromExperiments =
  | { type: "progress"; id: number; done: number; total: number }
  | { type: "row"; id: number; run: VariantRun }
  | { type: "done"; id: number; elapsedMs: number }
  | { type: "cancelled"; id: number }
  | { type: "error"; id: number; message: string };
