// A disturbance applied live (operator action) must act exactly like the same event written in
// the drill's timeline at that instant, and replay from the action log (determinism of the
// action log: issue requirement; no outside source needed — the timeline run is the reference).
import { describe, expect, it } from "vitest";
import { operatorActionSchema, type StampedAction } from "@/sim/drill/actions";
import { runDrill } from "@/sim/drill/run-drill";
import type { DrillInput } from "@/sim/drill/schema";
import { Simulation } from "@/sim/drill/simulation";
import { drillSchema } from "@/sim/drill/schema";
import { traceFingerprint } from "@/sim/drill/trace-hash";

const base: DrillInput = {
  formatVersion: 1,
  id: "live",
  title: "live disturbance",
  plant: { kind: "preset", presetId: "benchtop-curing-cabinet" },
  initialState: { temperatures: { kind: "steady", outPercent: 25 }, mode: "auto", setpointC: 59, outPercent: 25 },
  scoring: { windows: [{ id: "w", kind: "disturbance", startS: 100, endS: 1200 }] },
  referenceTuning: { kc: 15, ti: 300, sampleTimeS: 0.5 },
  durationS: 1200,
};

describe("live disturbance actions", () => {
  it("an inlet blockage and a timed door opening act as the same timeline events would", () => {
    const timeline = runDrill({ ...base, events: [{ type: "inlet-blockage", timeS: 100, percent: 60 }, { type: "door-open", timeS: 400, durationS: 30 }] });
    const actions: StampedAction[] = [
      { sample: 200, type: "disturbance", event: { type: "inlet-blockage", percent: 60 } },
      { sample: 800, type: "disturbance", event: { type: "door-open", durationS: 30 } },
    ] as StampedAction[];
    const live = runDrill(base, undefined, actions);
    for (const k of ["trueC", "pvRawC", "outPercent"] as const) expect(Array.from(live.trace[k])).toEqual(Array.from(timeline.trace[k]));
    expect(live.events.filter((e) => e.type === "action").map((e) => e.detail)).toEqual(["disturbance inlet 60 % blocked", "disturbance door open 30 s"]);
    expect(live.events.some((e) => e.type === "timeline" && e.detail === "door-open end")).toBe(true);
  });

  it("is logged by the stepping API and replays to the same trace", () => {
    const sim = new Simulation(drillSchema.parse(base));
    sim.advance(60);
    sim.act(operatorActionSchema.parse({ type: "disturbance", event: { type: "cold-load", massKg: 5, specificHeatJPerKgK: 900, temperatureC: 18, airCouplingWPerK: 10 } }));
    sim.advance(300);
    sim.act(operatorActionSchema.parse({ type: "disturbance", event: { type: "sensor-fault", fault: "open", durationS: 20 } }));
    sim.runToEnd();
    const replay = runDrill(base, undefined, sim.actionLog);
    expect(traceFingerprint(replay.trace)).toBe(traceFingerprint(sim.trace()));
    expect(sim.trace().pvBad.some((b) => b === 1)).toBe(true); // the open element showed as a bad PV
  });

  it("refuses an invalid disturbance with the field named", () => {
    const r = operatorActionSchema.safeParse({ type: "disturbance", event: { type: "inlet-blockage", percent: 150 } });
    expect(r.success).toBe(false);
    expect(JSON.stringify(r.error?.issues)).toMatch(/percent/);
    expect(operatorActionSchema.safeParse({ type: "disturbance", event: { type: "setpoint", setpointC: 50 } }).success).toBe(false);
  });
});
