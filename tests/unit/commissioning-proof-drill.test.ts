// Proof tests for the pre-commissioning flow: a setpoint ladder with site disturbances built as a
// drill on the Bench's plant, and a stored drill moved onto the plant being commissioned. The
// drills are checked with the engine's own schema and run by the engine (runDrill).
import { describe, expect, it } from "vitest";
import { BENCH_START_TUNING, benchDrill, outputHolding } from "@/components/bench/bench-drill";
import { droppedEvents, drillOnPlant, ladderDrill, lengthWarning, ladderLabel, ladderProblem, reachWarnings, type LadderSpec } from "@/components/commissioning/proof-drill";
import { starterDocument } from "@/components/drills/starters";
import { runDrill } from "@/sim/drill/run-drill";
import { drillSchema } from "@/sim/drill/schema";
import { controllerConfigSchema } from "@/sim/control/config";
import { findPreset } from "@/sim/plant/presets";
import type { PlantDefinition } from "@/sim/plant/plant-definition";

const SEED = 7;
const cabinet = findPreset("benchtop-curing-cabinet")!;
const presetBase = benchDrill({ plant: { kind: "preset", presetId: cabinet.id }, title: "Cabinet", setpointC: 60, reference: BENCH_START_TUNING, seed: SEED });
const stored: PlantDefinition = cabinet.plant;
const storedBase = benchDrill({ plant: { kind: "stored", definition: stored, cutoutTripC: 110, sensor: { noise: { sdMa: 0.01 } } }, title: "Cabinet C-7", setpointC: 60, reference: BENCH_START_TUNING, seed: SEED });
const twin: PlantDefinition = {
  kind: "transfer-function",
  gainCPerPercent: 1.2,
  timeConstantsS: [900, 120],
  deadTimeS: 40,
  operatingPoint: { outPercent: 35, temperatureC: 70 },
  ambientC: 22,
  heaterRatingW: 2000,
  nominalVoltageV: 230,
  sensorTimeConstantS: 0,
};
const twinBase = benchDrill({ plant: { kind: "stored", definition: twin, cutoutTripC: 120 }, title: "Twin", setpointC: 70, reference: BENCH_START_TUNING, seed: SEED });

const spec: LadderSpec = {
  leadInS: 120,
  steps: [
    { setpointC: 70, holdS: 1800 },
    { setpointC: 80, holdS: 1800 },
  ],
  disturbances: [
    { disturbance: { kind: "door-open", forS: 60 }, holdS: 1200 },
    { disturbance: { kind: "inlet-blockage", percent: 60, forS: 600 }, holdS: 1800 },
  ],
};

describe("ladderDrill", () => {
  it("places the steps and then the disturbances one after another, each in its own scoring window", () => {
    const d = ladderDrill(presetBase, spec);
    expect(drillSchema.safeParse(d).success).toBe(true);
    expect(d.events).toEqual([
      { type: "setpoint", timeS: 120, setpointC: 70 },
      { type: "setpoint", timeS: 1920, setpointC: 80 },
      { type: "door-open", timeS: 3720, durationS: 60 },
      { type: "inlet-blockage", timeS: 4920, percent: 60, durationS: 600 },
    ]);
    expect(d.scoring.windows.map((w) => [w.kind, w.startS, w.endS])).toEqual([
      ["setpoint", 120, 1920],
      ["setpoint", 1920, 3720],
      ["disturbance", 3720, 4920],
      ["disturbance", 4920, 6720],
    ]);
    expect(d.durationS).toBe(6720);
    // the Bench's plant and starting point are kept
    expect(d.plant).toEqual(presetBase.plant);
    expect(d.initialState.setpointC).toBe(60);
    expect(ladderLabel(presetBase, spec)).toBe("SP 60 → 70 → 80 °C, door open 60 s, inlet 60 % blocked for 10 min");
  });

  it("starts settled at another working SP when asked (the OUT that holds it on this plant)", () => {
    const d = ladderDrill(presetBase, { ...spec, startC: 65 });
    const out = outputHolding(cabinet.plant, 65);
    expect(d.initialState).toMatchObject({ setpointC: 65, outPercent: out, temperatures: { kind: "steady", outPercent: out } });
    expect(d.scoring.windows[0].label).toBe("SP 65 → 70 °C");
  });

  it("is a drill the engine runs: one result window per step and disturbance", () => {
    const d = ladderDrill(presetBase, spec);
    const run = runDrill(d, controllerConfigSchema.parse(BENCH_START_TUNING), [], SEED);
    expect(run.results.windows.map((w) => w.kind)).toEqual(["setpoint", "setpoint", "disturbance", "disturbance"]);
    expect(run.results.safetyTrips).toEqual([]);
  });

  it("refuses what cannot run: nothing to do, a zero watch time, too long, enclosure disturbances on a twin", () => {
    expect(ladderProblem(presetBase, { leadInS: 0, steps: [], disturbances: [] })).toMatch(/at least one/);
    expect(ladderProblem(presetBase, { leadInS: 0, steps: [{ setpointC: 70, holdS: 0 }], disturbances: [] })).toMatch(/watch time/);
    expect(ladderProblem(presetBase, { leadInS: 0, steps: [{ setpointC: 70, holdS: 13 * 3600 }], disturbances: [] })).toMatch(/within 12 h/);
    expect(ladderProblem(twinBase, spec)).toMatch(/transfer-function model: door open 60 s has no effect/);
    const ok = ladderDrill(twinBase, { leadInS: 60, steps: [{ setpointC: 75, holdS: 3600 }], disturbances: [{ disturbance: { kind: "ambient", temperatureC: 15, forS: 1800 }, holdS: 3600 }] });
    expect(ok.events?.[1]).toEqual({ type: "ambient", timeS: 3660, temperatureC: 15, durationS: 1800 });
  });
});

describe("drillOnPlant", () => {
  const airflow = starterDocument("airflow-disturbance", "6b1d2c40-7a1e-4c55-9e0a-3f8d2b6c1a99", "Lint on the inlet");

  it("replaces plant, sensor chain, final element and cutout with the Bench's; keeps timeline, scoring and seed", () => {
    const moved = drillOnPlant(airflow, storedBase);
    expect(moved.plant).toEqual(stored);
    expect(moved.sensor).toEqual(storedBase.sensor);
    expect(moved.cutout).toEqual({ tripPointC: 110 });
    expect(moved.drive).toEqual(storedBase.drive);
    expect(moved.events).toEqual(airflow.events);
    expect(moved.scoring).toEqual(airflow.scoring);
    expect(moved.noise).toEqual(airflow.noise);
    // steady at the drill's SP on this plant, not at the author's OUT for another plant
    expect(moved.initialState).toMatchObject({ setpointC: 55, temperatures: { kind: "steady", outPercent: outputHolding(stored, 55) } });
    expect(drillSchema.safeParse(moved).success).toBe(true);
  });

  it("drops the events a twin cannot answer, and says which", () => {
    expect(droppedEvents(airflow, twinBase)).toEqual(["inlet-blockage"]);
    const moved = drillOnPlant(airflow, twinBase);
    expect(moved.events).toEqual([]);
    expect(moved.plant).toEqual(twin);
    expect(moved.sensor).toBeUndefined(); // the twin's Bench run uses the chain defaults here
  });

  it("warns when a drill is longer than a record re-runs", () => {
    expect(lengthWarning({ ...airflow, durationS: 13 * 3600 })).toMatch(/13\.0 h; a tuning record re-runs proof tests of at most 12 h/);
    expect(lengthWarning(airflow)).toBeNull();
  });

  it("warns when a setpoint is beyond this plant's reach or near its cutout", () => {
    const hot = { ...airflow, events: [{ type: "setpoint" as const, timeS: 60, setpointC: 500 }] };
    expect(reachWarnings(hot, storedBase).join(" ")).toMatch(/SP 500 °C is at or beyond what OUT 100 % holds/);
    const near = { ...airflow, events: [{ type: "setpoint" as const, timeS: 60, setpointC: 107 }] };
    expect(reachWarnings(near, storedBase).join(" ")).toMatch(/within 5 °C of the cutout trip \(110 °C\)/);
  });
});
