/**
 * The scenario an experiment runs each variant on: the Bench's plant and starting point with a
 * scripted proof test (a setpoint step, optionally followed by a disturbance), scored in one
 * window per event. Every variant runs the same drill and seed, so their rows compare.
 */
import type { DrillEvent, DrillInput } from "../drill/schema";

/** A drill event without its time (Omit distributed over the union's members). */
export type TimelessEvent = DrillEvent extends infer E ? (E extends DrillEvent ? Omit<E, "timeS"> : never) : never;

export interface ProofTest {
  /** setpoint step at 60 s, °C (relative to the starting setpoint) */
  stepC: number;
  /** an optional disturbance after the step has settled */
  disturbance?: { atS: number; event: TimelessEvent };
  durationS: number;
}

export const STEP_AT_S = 60;

export function experimentDrill(base: DrillInput, test: ProofTest): DrillInput {
  const sp0 = base.initialState.setpointC;
  const events: DrillInput["events"] = [{ type: "setpoint", timeS: STEP_AT_S, setpointC: sp0 + test.stepC }];
  const windows: { id: string; label: string; kind: "setpoint" | "disturbance"; startS: number; endS: number }[] = [];
  const stepEnd = test.disturbance ? test.disturbance.atS : test.durationS;
  windows.push({ id: "step", label: `SP ${sp0} → ${sp0 + test.stepC} °C`, kind: "setpoint", startS: STEP_AT_S, endS: stepEnd });
  if (test.disturbance) {
    events.push({ ...test.disturbance.event, timeS: test.disturbance.atS } as DrillEvent);
    windows.push({ id: "disturbance", label: test.disturbance.event.type, kind: "disturbance", startS: test.disturbance.atS, endS: test.durationS });
  }
  return {
    ...base,
    id: `${base.id}-experiment`,
    title: `${base.title} — proof test`,
    events,
    scoring: { windows },
    durationS: test.durationS,
  };
}
