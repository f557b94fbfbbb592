/**
 * The open-ended drill the Bench runs for free practice: a plant, a starting point near an
 * operating temperature, no scripted events (the operator applies disturbances live), and one
 * whole-run scoring window so results are always defined.
 */
import type { ControllerConfigInput } from "@/sim/control/config";
import type { DrillInput } from "@/sim/drill/schema";
import { steadyStateTemperatureC } from "@/sim/plant/derived-figures";
import type { PlantDefinition } from "@/sim/plant/plant-definition";
import { findPreset } from "@/sim/plant/presets";
import type { SensorChainConfigInput } from "@/sim/sensor/config";

export const BENCH_DURATION_S = 12 * 3600;

/** A stored plant may bring its own sensor chain (a twin's: the noise and step of its uploaded log). */
export type BenchPlant = { kind: "preset"; presetId: string } | { kind: "stored"; definition: PlantDefinition; cutoutTripC: number; sensor?: SensorChainConfigInput };

export function plantDefinitionOf(plant: BenchPlant): PlantDefinition {
  if (plant.kind === "stored") return plant.definition;
  const preset = findPreset(plant.presetId);
  if (!preset) throw new Error(`unknown plant preset ${plant.presetId}`);
  return preset.plant;
}

/** Output that holds `targetC` at steady state (linear interpolation on the steady-state curve). */
export function outputHolding(def: PlantDefinition, targetC: number): number {
  const t0 = steadyStateTemperatureC(def, 0);
  const t100 = steadyStateTemperatureC(def, 100);
  if (!(t100 > t0)) return 0;
  let lo = 0;
  let hi = 100;
  for (let i = 0; i < 40; i++) {
    const mid = (lo + hi) / 2;
    if (steadyStateTemperatureC(def, mid) < targetC) lo = mid;
    else hi = mid;
  }
  return Math.round(((lo + hi) / 2) * 10) / 10;
}

export function benchDrill(opts: {
  plant: BenchPlant;
  title: string;
  setpointC: number;
  reference: ControllerConfigInput;
  seed: number;
}): DrillInput {
  const def = plantDefinitionOf(opts.plant);
  const out = outputHolding(def, opts.setpointC);
  return {
    formatVersion: 1,
    id: "bench-free-run",
    title: opts.title,
    description: "Free practice on the Bench.",
    plant: opts.plant.kind === "preset" ? { kind: "preset", presetId: opts.plant.presetId } : opts.plant.definition,
    initialState: { temperatures: { kind: "steady", outPercent: out }, mode: "auto", setpointC: opts.setpointC, outPercent: out },
    events: [],
    // one whole-run window without step metrics (free practice has no single step); the live
    // results table measures each SP change and disturbance on its own
    scoring: { windows: [{ id: "run", label: "whole run", kind: "disturbance", startS: 0, endS: BENCH_DURATION_S, eventTimeS: 0 }] },
    // free practice: the operator changes SP, mode and manual OUT at will
    trainee: { mayChange: { pvFilter: true, sampleTime: true, operation: true } },
    referenceTuning: opts.reference,
    noise: { seedPolicy: "fixed", seed: opts.seed },
    ...(opts.plant.kind === "stored" ? { cutout: { tripPointC: opts.plant.cutoutTripC } } : {}),
    ...(opts.plant.kind === "stored" && opts.plant.sensor ? { sensor: opts.plant.sensor } : {}),
    durationS: BENCH_DURATION_S,
  };
}

/** A workable first tuning (on the benchtop cabinet: about 3 % overshoot on a 10 °C step), so a new user sees a loop that works. */
export const BENCH_START_TUNING: ControllerConfigInput = {
  kind: "pid",
  form: "standard",
  kc: 15,
  ti: 300,
  td: 0,
  sampleTimeS: 0.5,
  pvFilterTauS: 0,
  antiWindup: "back-calculation",
};
