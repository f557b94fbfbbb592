import { describe, expect, it } from "vitest";
import { runDrill, type StampedAction } from "@/sim/drill";
import { makeDrill, QUIET_SENSOR } from "./drills";

// The fast exact path against odex at tight tolerance (Hairer's ODEX; the accuracy reference):
// a closed-loop run records OUT; the same OUT sequence is replayed in manual through the runner
// with both integrators, and the trajectories agree within 0.01 °C (in practice ~1e-8).
describe("exact path vs odex with a recorded OUT sequence replayed", () => {
  it("agrees within 0.01 °C on the true temperature and both sensor elements", () => {
    const drill = makeDrill({
      durationS: 900,
      events: [
        { type: "setpoint", timeS: 20, setpointC: 75 },
        { type: "inlet-blockage", timeS: 400, percent: 50, durationS: 200 },
        { type: "door-open", timeS: 700, durationS: 30 },
      ],
      referenceTuning: { kind: "pid", kc: 8, ti: 300, td: 10, sampleTimeS: 0.5 },
      sensor: QUIET_SENSOR,
      drive: { kind: "time-proportioning", cycleTimeS: 2, minOnTimeS: 0.05, minOffTimeS: 0.05 },
    });
    const closed = runDrill(drill);
    const outs = closed.trace.outPercent;
    const replay: StampedAction[] = [{ sample: 0, type: "mode", mode: "manual" }];
    for (let k = 0; k < outs.length; k++) replay.push({ sample: k, type: "manual-output", outPercent: outs[k] });
    const exact = runDrill(drill, null, replay);
    const ref = runDrill(drill, null, replay, undefined, { integrator: "odex", odexTolerance: 1e-11 });
    // manual replay reproduces the closed-loop OUT (bumpless mode switch at sample 0)
    expect(Array.from(exact.trace.outPercent)).toEqual(Array.from(outs));
    let worst = 0;
    for (let k = 0; k < exact.trace.length; k++) {
      worst = Math.max(worst, Math.abs(exact.trace.trueC[k] - ref.trace.trueC[k]), Math.abs(exact.trace.pvRawC[k] - ref.trace.pvRawC[k]));
    }
    expect(worst).toBeLessThan(0.01);
    // closed loop and replay in manual give the same temperatures with the exact integrator
    for (let k = 0; k < exact.trace.length; k++) expect(exact.trace.trueC[k]).toBe(closed.trace.trueC[k]);
  });
});
