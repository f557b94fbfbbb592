// Scoring integrity (the score definition in sim/drill/score.ts; no outside source): an operator's
// own SP changes must neither cut a scored window short nor go unreported, the whole-run figures
// cover the whole run, and an action taken while a recorded log replays lands at its own stamp.
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { runDrill } from "@/sim/drill/run-drill";
import { drillSchema } from "@/sim/drill/schema";
import { Simulation } from "@/sim/drill/simulation";
import { traceFingerprint } from "@/sim/drill/trace-hash";
import type { StampedAction } from "@/sim/drill/actions";

const ladder = drillSchema.parse(JSON.parse(readFileSync("sim/examples/setpoint-ladder.json", "utf8")));

describe("scoring integrity", () => {
  it("operator SP changes do not truncate the drill's windows and are reported as violations", () => {
    const ts = ladder.referenceTuning.sampleTimeS;
    const honest = runDrill(ladder, undefined, [], undefined, { score: true });
    expect(honest.score!.score).toBeCloseTo(50, 1); // the reference tuning scores 50 by definition
    const steps = ladder.events.filter((e) => e.type === "setpoint").map((e) => e.timeS);
    const gaming: StampedAction[] = steps.map((t) => ({ sample: Math.round(t / ts) + 1, type: "setpoint", setpointC: ladder.initialState.setpointC }) as StampedAction);
    const gamed = runDrill(ladder, undefined, gaming, undefined, { score: true });
    for (let i = 0; i < ladder.scoring.windows.length; i++) {
      // the windows keep their scripted span
      expect(gamed.results.windows[i].trueTemperature.windowEndS).toBeCloseTo(honest.results.windows[i].trueTemperature.windowEndS, 9);
    }
    expect(gamed.score!.score).toBeLessThan(honest.score!.score);
    expect(gamed.results.controllerViolations.some((v) => v.startsWith("setpoint"))).toBe(true);
  });

  it("the whole-run figures cover the whole drill", () => {
    const r = runDrill(ladder);
    const whole = r.results.wholeRun.trueTemperature;
    expect(whole.windowStartS).toBe(0);
    expect(whole.windowEndS).toBe(ladder.durationS);
    expect(whole.heaterEnergyKWh).toBeCloseTo(r.results.heaterEnergyKWh, 2);
    const sumOfWindows = r.results.windows.reduce((a, w) => a + w.trueTemperature.iae, 0);
    expect(whole.iae).toBeGreaterThanOrEqual(sumOfWindows - 1e-6);
  });

  it("an action taken while a recorded log is pending applies at its own stamp", () => {
    const log: StampedAction[] = [{ sample: 3000, type: "setpoint", setpointC: 70 } as StampedAction];
    const sim = new Simulation(ladder);
    sim.schedule(log);
    sim.advance(50); // 100 samples at 0.5 s
    sim.act({ type: "setpoint", setpointC: 65 }); // stamped 100, queued before the 3000 one
    sim.runToEnd();
    const replay = runDrill(ladder, undefined, sim.actionLog);
    expect(sim.actionLog.map((a) => a.sample)).toEqual([100, 3000]);
    expect(traceFingerprint(replay.trace)).toBe(traceFingerprint(sim.trace()));
  });
});
