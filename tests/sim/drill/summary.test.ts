// Attempt summary (sim/drill/summary.ts). Sources: the task's definition of the standings measures
// (worst window per measure) and the score's rounding to 0.1 (sim/drill/score.ts); "never" beats
// every time (common practice: an unsettled loop is the worst case).
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { attemptSummary, drillSchema, runDrill, scoreAttempt, type RunResults } from "@/sim/drill";

const ladder = drillSchema.parse(JSON.parse(readFileSync("sim/examples/setpoint-ladder.json", "utf8")));
const inlet = drillSchema.parse(JSON.parse(readFileSync("sim/examples/inlet-blockage.json", "utf8")));

describe("attemptSummary", () => {
  it("takes the worst setpoint window, the whole-run IAE, energy and trips (definition)", () => {
    const run = runDrill(ladder, { ...ladder.referenceTuning, kc: 12, ti: 200 });
    const ref = runDrill(ladder).results;
    const score = scoreAttempt(ladder, run.results, ref);
    const s = attemptSummary(run.results, score);
    const sp = run.results.windows.map((w) => w.trueTemperature);
    expect(s.rawScore).toBe(score.score);
    expect(s.score).toBe(score.score);
    expect(s.overshootC).toBe(Math.max(...sp.map((w) => w.overshootC ?? -Infinity)));
    const settle = sp.map((w) => w.settlingTimeS);
    expect(s.settlingTimeS).toBe(settle.includes(null) ? null : Math.max(...(settle as number[])));
    expect(s.iae).toBe(run.results.wholeRun.trueTemperature.iae);
    expect(s.recoveryTimeS).toBeNull(); // the ladder has no disturbance window
    expect(s.energyKWh).toBe(run.results.heaterEnergyKWh);
    expect(s.safetyTrips).toBe(0);
  });

  it("applies the late factor and rounds to 0.1 (score.ts rounding)", () => {
    const r = runDrill(ladder).results;
    const score = { ...scoreAttempt(ladder, r, r), score: 77.7 };
    const s = attemptSummary(r, score, 0.8);
    expect(s.score).toBe(62.2); // 77.7 × 0.8 = 62.16
    expect(s.rawScore).toBe(77.7);
  });

  it("null settling / recovery when any window never got there; longest otherwise (definition)", () => {
    const r = runDrill(inlet).results;
    const score = scoreAttempt(inlet, r, r);
    const base = attemptSummary(r, score);
    const dist = r.windows.filter((w) => w.kind === "disturbance").map((w) => w.trueTemperature.recoveryTimeS);
    expect(base.recoveryTimeS).toBe(dist.includes(null) ? null : Math.max(...(dist as number[])));
    const never: RunResults = {
      ...r,
      windows: r.windows.map((w, i) => (i === 1 ? { ...w, trueTemperature: { ...w.trueTemperature, recoveryTimeS: null } } : w)),
      safetyTrips: [{ timeS: 10, cause: "over-temperature", sensorC: 200 }] as RunResults["safetyTrips"],
    };
    const s = attemptSummary(never, score);
    expect(s.recoveryTimeS).toBeNull();
    expect(s.safetyTrips).toBe(1);
    const onlyDisturbance: RunResults = { ...r, windows: r.windows.filter((w) => w.kind === "disturbance") };
    expect(attemptSummary(onlyDisturbance, score).settlingTimeS).toBeNull(); // no setpoint window
    expect(attemptSummary(onlyDisturbance, score).overshootC).toBeNull();
  });
});
