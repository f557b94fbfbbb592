import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { drillSchema, runDrill, scoreAttempt, controllerViolations, expandTimeline } from "@/sim/drill";
import { controllerConfigSchema } from "@/sim/control/config";
import { resolvePlant } from "@/sim/drill/resolve";

const ladder = drillSchema.parse(JSON.parse(readFileSync(join(process.cwd(), "sim/examples/setpoint-ladder.json"), "utf8")));

describe("score (sim/drill/score.ts, defined once)", () => {
  it("the reference tuning scores exactly 50", () => {
    const r = runDrill(ladder, null, [], undefined, { score: true });
    expect(r.score?.score).toBe(50);
    expect(r.score?.engineVersion).toBe(r.engineVersion);
  });

  it("a sluggish tuning scores lower, and the score stays within 0–100", () => {
    const slow = { ...ladder.referenceTuning, kc: 1, ti: 2000 };
    const r = runDrill(ladder, slow, [], undefined, { score: true });
    expect(r.score!.score).toBeLessThan(50);
    expect(r.score!.score).toBeGreaterThanOrEqual(0);
  });

  it("each cutout trip multiplies the score by the drill's penalty factor", () => {
    const a = runDrill(ladder, null, [], undefined).results;
    const tripped = { ...a, safetyTrips: [{ timeS: 1, cause: "over-temperature" as const, sensorC: 200 }] };
    const s0 = scoreAttempt(ladder, a, a).score;
    const s1 = scoreAttempt(ladder, tripped, a).score;
    expect(s1).toBeCloseTo(s0 * ladder.scoring.tripPenaltyFactor, 1);
  });
});

describe("what the trainee may change", () => {
  it("tuning is free; output limits are not; the PV filter and sample time per the drill", () => {
    const ref = ladder.referenceTuning;
    expect(controllerViolations(ladder, controllerConfigSchema.parse({ ...ref, kc: 12, ti: 250, td: 30 }))).toEqual([]);
    expect(controllerViolations(ladder, controllerConfigSchema.parse({ ...ref, outMaxPct: 80 }))).toEqual(["outMaxPct"]);
    expect(controllerViolations(ladder, controllerConfigSchema.parse({ ...ref, pvFilterTauS: 3 }))).toEqual([]); // pvFilter allowed
    expect(controllerViolations(ladder, controllerConfigSchema.parse({ ...ref, sampleTimeS: 1 }))).toEqual(["sampleTimeS"]);
  });

  it("runDrill reports violations made through a tuning change in the action log", () => {
    const r = runDrill(ladder, null, [{ sample: 10, type: "tuning", controller: controllerConfigSchema.parse({ ...ladder.referenceTuning, action: "direct" }) }]);
    expect(r.results.controllerViolations).toEqual(["action"]);
  });
});

describe("timeline", () => {
  it("expands durations into start/end changes, ends first at equal times", () => {
    const d = drillSchema.parse({
      ...ladder,
      events: [
        { type: "inlet-blockage", timeS: 100, percent: 50, durationS: 100 },
        { type: "inlet-blockage", timeS: 200, percent: 80 },
        { type: "supply-voltage", timeS: 50, percentOfNominal: 90, durationS: 10 },
      ],
    });
    const ch = expandTimeline(d.events, resolvePlant(d));
    expect(ch.map((c) => [c.timeS, c.phase])).toEqual([[50, "start"], [60, "end"], [100, "start"], [200, "end"], [200, "start"]]);
    expect(ch[0].change).toEqual({ kind: "conditions", patch: { supplyVoltageV: 207 } });
  });

  it("a setpoint ramp is a staircase at sample boundaries ending on its target", () => {
    const d = drillSchema.parse({ ...ladder, events: [{ type: "setpoint-ramp", timeS: 100, durationS: 10, fromC: 60, toC: 70 }], durationS: 300, scoring: { windows: [{ id: "r", kind: "setpoint", startS: 100, endS: 300 }] } });
    const tr = runDrill(d).trace;
    const ts = d.referenceTuning.sampleTimeS;
    expect(tr.setpointC[Math.round(99.5 / ts)]).toBe(59.3);
    expect(tr.setpointC[Math.round(100 / ts)]).toBe(60);
    expect(tr.setpointC[Math.round(105 / ts)]).toBeCloseTo(65, 12);
    expect(tr.setpointC[Math.round(110 / ts)]).toBe(70);
    expect(tr.setpointC[tr.length - 1]).toBe(70);
  });

  it("a cold load lowers the temperature and the loop recovers", () => {
    const d = drillSchema.parse({
      ...ladder,
      events: [{ type: "cold-load", timeS: 600, massKg: 3, specificHeatJPerKgK: 900, temperatureC: 5, airCouplingWPerK: 10 }],
      scoring: { windows: [{ id: "load", kind: "disturbance", startS: 600, endS: 3000 }] },
      durationS: 3000,
    });
    const r = runDrill(d);
    const w = r.results.windows[0].trueTemperature;
    expect(w.peakDeviationC!).toBeLessThan(-1);
    expect(w.recoveryTimeS).not.toBeNull();
  });
});
