import { describe, expect, it } from "vitest";
import { runDrill, Simulation, type StampedAction } from "@/sim/drill";
import { ENGINE_VERSION } from "@/sim/version";
import { makeDrill } from "./drills";

const noisy = { noise: { sdMa: 0.02 } };

function sameTrace(a: ReturnType<typeof runDrill>["trace"], b: ReturnType<typeof runDrill>["trace"]) {
  expect(a.length).toBe(b.length);
  for (const key of ["timeS", "setpointC", "pvRawC", "pvFilteredC", "trueC", "outPercent", "heaterPowerW", "heaterOn", "pvBad", "cutoutTripped"] as const) {
    expect(Array.from(a[key])).toEqual(Array.from(b[key]));
  }
}

describe("determinism (same inputs → identical trace)", () => {
  const drill = makeDrill({
    durationS: 1800,
    events: [{ type: "setpoint", timeS: 60, setpointC: 70 }, { type: "sensor-noise", timeS: 900, extraNoiseSdMa: 0.02, durationS: 300 }],
    sensor: noisy,
  });

  it("same seed gives an identical trace, results and events; every output carries the engine version", () => {
    const a = runDrill(drill, null, [], 77);
    const b = runDrill(drill, null, [], 77);
    sameTrace(a.trace, b.trace);
    expect(JSON.stringify(a.results)).toBe(JSON.stringify(b.results));
    expect(a.engineVersion).toBe(ENGINE_VERSION);
    expect(a.trace.engineVersion).toBe(ENGINE_VERSION);
    expect(a.results.engineVersion).toBe(ENGINE_VERSION);
  });

  it("another seed gives different noise but the same true temperature in open loop", () => {
    const manual = makeDrill({ durationS: 600, initialState: { temperatures: { kind: "steady", outPercent: 25 }, mode: "manual", setpointC: 60, outPercent: 40 }, sensor: noisy });
    const a = runDrill(manual, null, [], 1);
    const b = runDrill(manual, null, [], 2);
    expect(Array.from(a.trace.trueC)).toEqual(Array.from(b.trace.trueC));
    let differ = 0;
    for (let k = 0; k < a.trace.length; k++) if (a.trace.pvRawC[k] !== b.trace.pvRawC[k]) differ++;
    expect(differ).toBeGreaterThan(a.trace.length * 0.9);
  });
});

describe("action log replay", () => {
  it("the Bench's stamped action log, replayed by runDrill, reproduces the trace exactly", () => {
    const drill = makeDrill({ durationS: 1200, sensor: noisy, events: [{ type: "inlet-blockage", timeS: 500, percent: 40 }] });
    const sim = new Simulation(drill, { seed: 9 });
    sim.advance(100);
    sim.act({ type: "mode", mode: "manual" });
    sim.advance(37.5);
    sim.act({ type: "manual-output", outPercent: 55 });
    sim.advance(200);
    sim.act({ type: "mode", mode: "auto" });
    sim.act({ type: "setpoint", setpointC: 72 });
    sim.advance(300);
    sim.act({ type: "tuning", controller: { ...sim.controllerConfig, kc: 10, ti: 250 } });
    sim.runToEnd();
    const log: StampedAction[] = sim.actionLog;
    expect(log.map((a) => a.sample)).toEqual([200, 275, 675, 675, 1275]);
    const replay = runDrill(drill, null, log, 9);
    sameTrace(sim.trace(), replay.trace);
    // the log survives JSON (what the server receives)
    const again = runDrill(drill, null, JSON.parse(JSON.stringify(log)), 9);
    sameTrace(sim.trace(), again.trace);
  });
});
