import { describe, expect, it } from "vitest";
import { runDrill, Simulation } from "@/sim/drill";
import { makeDrill, QUIET_SENSOR } from "./drills";

// NFPA 86 excess-temperature limit (references §14; title and scope [CONFIRMED], clause wording
// [MEMORY]): independent of the controller, own sensor, latches, manual reset only.
describe("excess-temperature cutout through the runner", () => {
  const drill = makeDrill({
    durationS: 6000,
    initialState: { temperatures: { kind: "steady", outPercent: 40 }, mode: "auto", setpointC: 82, outPercent: 40 },
    events: [{ type: "sensor-fault", timeS: 100, fault: "shorted", target: "control" }],
    // a shorted element reads bad; the (badly chosen) safe output is 100 %
    referenceTuning: { kind: "pid", kc: 6, ti: 400, sampleTimeS: 0.5, badPvPolicy: "safe-output", safeOutputPct: 100 },
    sensor: QUIET_SENSOR,
    cutout: { enabled: true, tripPointC: 130, sensorTimeConstantS: 10, resetMarginC: 5 },
  });

  it("with the controller's element shorted and OUT at 100 %, trips on its own sensor and stays off until reset", () => {
    const sim = new Simulation(drill);
    while (sim.safetyTrips.length === 0 && sim.timeS < 5000) sim.advance(10);
    sim.advance(20);
    const tr = sim.trace();
    expect(tr.pvBad[300]).toBe(1);
    expect(tr.outPercent[300]).toBe(100);
    expect(sim.safetyTrips).toHaveLength(1);
    const trip = sim.safetyTrips[0];
    expect(trip.cause).toBe("over-temperature");
    expect(trip.sensorC).toBeGreaterThan(130);
    const kTrip = Math.ceil(trip.timeS / sim.sampleTimeS);
    // heater off from the trip on, although OUT stays at 100 %
    for (let k = kTrip; k < tr.length; k++) {
      expect(tr.heaterPowerW[k]).toBe(0);
      expect(tr.cutoutTripped[k]).toBe(1);
    }
    // a reset while still hot is refused
    expect(sim.plant.cutoutSensorTemperatureC()).toBeGreaterThan(125);
    sim.act({ type: "cutout-reset" });
    sim.advance(1);
    expect(sim.events.at(-1)?.type).toBe("cutout-reset-refused");
    expect(sim.cutout.tripped).toBe(true);
    sim.advance(300);
    expect(sim.trace().heaterPowerW[sim.trace().length - 1]).toBe(0);
    // let it cool below trip − margin, reset: the heater comes back (OUT is still 100 %)
    while (sim.plant.cutoutSensorTemperatureC() > 120) sim.advance(10);
    sim.act({ type: "cutout-reset" });
    sim.advance(10);
    expect(sim.events.some((e) => e.type === "cutout-reset")).toBe(true);
    const t2 = sim.trace();
    expect(t2.heaterPowerW[t2.length - 1]).toBeGreaterThan(0);
  });

  it("the trip is a safety event in the results", () => {
    const r = runDrill(drill);
    expect(r.results.safetyTrips.length).toBeGreaterThanOrEqual(1);
    expect(r.results.wholeRun.trueTemperature.timeAboveCutoutS).toBeGreaterThan(0);
    expect(r.events.some((e) => e.type === "safety-trip")).toBe(true);
  });

  it("trips when its own sensor fails", () => {
    const d = makeDrill({ durationS: 100, events: [{ type: "sensor-fault", timeS: 50, fault: "open", target: "cutout" }] });
    const r = runDrill(d);
    expect(r.results.safetyTrips.map((t) => t.cause)).toEqual(["sensor-failure"]);
    expect(r.results.safetyTrips[0].timeS).toBeCloseTo(50, 9);
    // a fault between samples trips at its own instant
    const mid = runDrill(makeDrill({ durationS: 100, events: [{ type: "sensor-fault", timeS: 50.123, fault: "lead-break", target: "cutout" }] }));
    expect(mid.results.safetyTrips[0].timeS).toBeCloseTo(50.123, 9);
  });
});
