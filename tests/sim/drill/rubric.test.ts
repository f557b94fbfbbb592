// Rubric (sim/drill/rubric.ts): a read-out of the drill's scoring and rules. Sources: the drill
// format (sim/drill/README.md) and the score's one definition (SCORE_FORMULA, sim/drill/score.ts).
import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { drillRubric, drillSchema, SCORE_FORMULA } from "@/sim/drill";

const inlet = drillSchema.parse(JSON.parse(readFileSync("sim/examples/inlet-blockage.json", "utf8")));
const ladder = drillSchema.parse(JSON.parse(readFileSync("sim/examples/setpoint-ladder.json", "utf8")));

describe("drillRubric", () => {
  it("windows with their share of the total weight (weights 0.5, 1, 1, 1 → 14.3 %, 28.6 % …)", () => {
    const r = drillRubric(inlet);
    expect(r.formula).toBe(SCORE_FORMULA);
    expect(r.windows.map((w) => w.id)).toEqual(["settle", "filter-clogs", "filter-changed", "door"]);
    expect(r.windows[0]).toMatchObject({ label: "take-over at 55 °C", kind: "setpoint", startS: 0, endS: 3600, weight: 0.5 });
    expect(r.windows[0].sharePct).toBeCloseTo((100 * 0.5) / 3.5, 9);
    expect(r.windows.reduce((s, w) => s + w.sharePct, 0)).toBeCloseTo(100, 9);
  });

  it("metric weights in %, band floor, trip penalty (README defaults 0.5/0.25/0.25 → 50/25/25 %, factor 0.5)", () => {
    const r = drillRubric(inlet);
    expect(r.metricWeightsPct).toEqual({ iae: 50, peak: 25, time: 25 });
    expect(r.bandFloorC).toBe(0.5);
    expect(r.tripPenaltyFactor).toBe(0.5);
    const custom = drillRubric(drillSchema.parse({ ...ladder, scoring: { ...ladder.scoring, metricWeights: { iae: 2, peak: 1, time: 1 } } }));
    expect(custom.metricWeightsPct).toEqual({ iae: 50, peak: 25, time: 25 });
  });

  it("rules, pace and seed policy as the drill states them", () => {
    const r = drillRubric(ladder);
    expect(r.mayChange).toEqual({ tuning: true, pvFilter: true, sampleTime: false, operation: false, relayTest: true, bumpTest: false });
    expect(r.pace).toEqual({ speeds: [1, 10, 60, 600], pauseAllowed: true });
    expect(r.seed).toEqual({ policy: "fixed", seed: 3141 });
    const perAttempt = drillRubric(drillSchema.parse({ ...ladder, noise: { seedPolicy: "per-attempt" } }));
    expect(perAttempt.seed).toEqual({ policy: "per-attempt", seed: null });
  });
});
