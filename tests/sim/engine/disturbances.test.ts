import { describe, expect, it } from "vitest";
import { runDrill } from "@/sim/drill";
import { firstOrderPlant, makeDrill, QUIET_SENSOR } from "./drills";

const at = (tr: { timeS: Float64Array }, t: number) => Math.round(t / (tr.timeS[1] - tr.timeS[0]));

describe("disturbances through the runner", () => {
  it("a clogged inlet: the loop lowers OUT to hold SP and raises it again when the flow is restored (references §16, common practice)", () => {
    const d = makeDrill({
      durationS: 9000,
      initialState: { temperatures: { kind: "steady", outPercent: 40 }, mode: "auto", setpointC: 82.2, outPercent: 40 },
      events: [{ type: "inlet-blockage", timeS: 1000, percent: 80, durationS: 4000 }],
      sensor: QUIET_SENSOR,
      drive: { kind: "continuous" },
    });
    const tr = runDrill(d).trace;
    const mean = (t0: number, t1: number) => {
      let s = 0;
      for (let k = at(tr, t0); k < at(tr, t1); k++) s += tr.outPercent[k];
      return s / (at(tr, t1) - at(tr, t0));
    };
    const before = mean(500, 1000), blocked = mean(4000, 5000), after = mean(8000, 9000);
    expect(blocked).toBeLessThan(before - 5);
    expect(after).toBeGreaterThan(blocked + 5);
    expect(Math.abs(after - before)).toBeLessThan(1);
  });

  it("an open door cools the air at once; a voltage sag cuts heater power by (V/V_nom)²", () => {
    const d = makeDrill({
      durationS: 600,
      initialState: { temperatures: { kind: "steady", outPercent: 40 }, mode: "manual", setpointC: 80, outPercent: 100 },
      events: [
        { type: "door-open", timeS: 100, durationS: 60 },
        { type: "supply-voltage", timeS: 300, percentOfNominal: 90, durationS: 100 },
      ],
      sensor: QUIET_SENSOR,
      drive: { kind: "continuous" },
    });
    const tr = runDrill(d).trace;
    expect(tr.trueC[at(tr, 150)]).toBeLessThan(tr.trueC[at(tr, 99)] - 5);
    expect(tr.heaterPowerW[at(tr, 350)]).toBeCloseTo(0.81 * 800, 9);
    expect(tr.heaterPowerW[at(tr, 450)]).toBeCloseTo(800, 9);
  });

  it("ambient change shifts a transfer-function plant's response by the same amount", () => {
    const d = makeDrill({
      durationS: 4000,
      plant: firstOrderPlant(1, 200),
      initialState: { temperatures: { kind: "steady", outPercent: 50 }, mode: "manual", setpointC: 50, outPercent: 50 },
      events: [{ type: "ambient", timeS: 10, temperatureC: 25 }],
      sensor: QUIET_SENSOR,
      drive: { kind: "continuous" },
      cutout: { enabled: false, tripPointC: 500 },
    });
    const tr = runDrill(d).trace;
    expect(tr.trueC[tr.length - 1]).toBeCloseTo(55, 6);
  });

  it("a failed controller element gives a bad PV at the NE 43 failure level (references §11)", () => {
    const d = makeDrill({
      durationS: 200,
      events: [{ type: "sensor-fault", timeS: 50, fault: "open", target: "control", durationS: 50 }],
      referenceTuning: { kind: "pid", kc: 6, ti: 400, sampleTimeS: 0.5, badPvPolicy: "hold" },
      sensor: QUIET_SENSOR,
    });
    const tr = runDrill(d).trace;
    expect(tr.pvBad[at(tr, 49.5)]).toBe(0);
    expect(tr.pvBad[at(tr, 60)]).toBe(1);
    expect(tr.pvBad[at(tr, 101)]).toBe(0);
    expect(tr.outPercent[at(tr, 99)]).toBe(tr.outPercent[at(tr, 50)]); // hold policy
  });
});
