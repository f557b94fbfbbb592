/**
 * A replay file: everything needed to re-derive a Bench or attempt trace — the drill (cut to the
 * rows recorded), the starting controller, the seed and the stamped action log — plus the
 * fingerprint of the trace it came from. `npm run sim -- replay FILE` re-runs it and compares.
 */
import { z } from "zod";
import { controllerConfigSchema } from "../control/config";
import { actionLogSchema } from "./actions";
import { drillSchema, type DrillInput } from "./schema";
import type { ControllerConfig } from "../control/config";
import type { StampedAction } from "./actions";

export const REPLAY_FORMAT = "loopwright-replay" as const;

export const replayBundleSchema = z
  .object({
    format: z.literal(REPLAY_FORMAT),
    version: z.literal(1),
    engineVersion: z.string(),
    drill: drillSchema,
    controller: controllerConfigSchema,
    seed: z.number().int().min(0).max(4294967295),
    actions: actionLogSchema,
    rows: z.number().int().min(1),
    fingerprint: z.string().regex(/^[0-9a-f]{16}$/).optional(),
  })
  .strict();

export type ReplayBundle = z.input<typeof replayBundleSchema>;

/** Cuts an open-ended drill to `rows` samples (durationS = (rows − 1)·Ts) and bundles the run. */
export function makeReplayBundle(p: {
  engineVersion: string;
  drill: DrillInput;
  controller: ControllerConfig;
  seed: number;
  actions: readonly StampedAction[];
  rows: number;
  fingerprint?: string;
}): ReplayBundle {
  const durationS = Math.max(1, p.rows - 1) * p.controller.sampleTimeS;
  const drill: DrillInput = {
    ...p.drill,
    durationS,
    events: (p.drill.events ?? []).filter((e) => e.timeS <= durationS),
    scoring: {
      ...p.drill.scoring,
      windows: p.drill.scoring.windows
        .filter((w) => w.startS < durationS)
        .map((w) => ({ ...w, endS: Math.min(w.endS, durationS) })),
    },
  };
  if (drill.scoring.windows.length === 0) drill.scoring = { ...drill.scoring, windows: [{ id: "run", kind: "disturbance", startS: 0, endS: durationS, eventTimeS: 0 }] };
  return { format: REPLAY_FORMAT, version: 1, engineVersion: p.engineVersion, drill, controller: p.controller, seed: p.seed, actions: [...p.actions], rows: p.rows, fingerprint: p.fingerprint };
}
