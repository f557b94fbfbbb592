/**
 * Starting points for a new drill, as drill documents (sim/drill/schema.ts input). Pure: used by
 * the server (app/_lib/drills.ts creates the first draft from one) and by the builder's forms.
 * The scenarios are Loopwright's own (fictional rigs of the engine's presets).
 */
import type { ControllerConfigInput } from "@/sim/control/config";
import type { DrillInput } from "@/sim/drill/schema";
import { steadyStateTemperatureC } from "@/sim/plant/derived-figures";
import type { PlantDefinition } from "@/sim/plant/plant-definition";
import { PLANT_PRESETS, findPreset } from "@/sim/plant/presets";

export interface DrillStarter {
  id: string;
  title: string;
  summary: string;
}

export const DRILL_STARTERS: readonly DrillStarter[] = [
  { id: "blank", title: "Blank drill", summary: "Benchtop curing cabinet held steady, no events, one scoring window over the whole run." },
  { id: "setpoint-step", title: "Setpoint step", summary: "Benchtop curing cabinet: one +15 °C SP step five minutes in, scored on overshoot and settling." },
  { id: "airflow-disturbance", title: "Airflow disturbance", summary: "Walk-in drying room at 55 °C: lint blocks 60 % of the exhaust inlet for 30 min, then it is cleared." },
];

export const isStarterId = (id: string) => DRILL_STARTERS.some((s) => s.id === id);

/** Average OUT that holds `targetC` at steady state (bisection on the steady-state curve), %, to 0.1. */
export function outputHoldingC(def: PlantDefinition, targetC: number): number {
  let lo = 0;
  let hi = 100;
  if (!(steadyStateTemperatureC(def, 100) > steadyStateTemperatureC(def, 0))) return 0;
  for (let i = 0; i < 40; i++) {
    const mid = (lo + hi) / 2;
    if (steadyStateTemperatureC(def, mid) < targetC) lo = mid;
    else hi = mid;
  }
  return Math.round(((lo + hi) / 2) * 10) / 10;
}

const round1 = (x: number) => Math.round(x * 10) / 10;

const CABINET_TUNING: ControllerConfigInput = { kind: "pid", form: "standard", kc: 15, ti: 300, td: 0, sampleTimeS: 0.5, pvFilterTauS: 0, antiWindup: "back-calculation" };
const ROOM_TUNING: ControllerConfigInput = { kind: "pid", form: "standard", kc: 8, ti: 900, td: 0, sampleTimeS: 1, pvFilterTauS: 0, antiWindup: "back-calculation" };

/** The first draft of a new drill from a starter; `id` and `title` are the drill's. */
export function starterDocument(starterId: string, id: string, title: string): DrillInput {
  if (starterId === "airflow-disturbance") {
    const room = findPreset("walk-in-drying-room")!;
    const out = outputHoldingC(room.plant, 55);
    return {
      formatVersion: 1,
      id,
      revision: 1,
      title,
      description: "Drying room D-1 holds 55 °C for a timber batch. Half an hour in, lint blocks 60 % of the exhaust inlet (airflow down to 40 %); it is cleared 30 min later. Hold 55 °C through both changes.",
      plant: { kind: "preset", presetId: room.id },
      initialState: { temperatures: { kind: "steady", outPercent: out }, mode: "auto", setpointC: 55, outPercent: out },
      events: [{ type: "inlet-blockage", timeS: 1800, percent: 60, durationS: 1800 }],
      scoring: {
        windows: [
          { id: "clog", label: "inlet 60 % blocked", kind: "disturbance", startS: 1800, endS: 3600, weight: 1 },
          { id: "clear", label: "inlet cleared", kind: "disturbance", startS: 3600, endS: 6000, weight: 1 },
        ],
      },
      referenceTuning: ROOM_TUNING,
      trainee: { mayChange: { tuning: true, pvFilter: true, sampleTime: false }, relayTestAllowed: true, bumpTestAllowed: true },
      pace: { speeds: [10, 60, 600], pauseAllowed: true },
      noise: { seedPolicy: "fixed", seed: 7 },
      drive: { kind: "continuous" },
      durationS: 6000,
    };
  }
  const cabinet = findPreset("benchtop-curing-cabinet") ?? PLANT_PRESETS[0];
  const out = 25;
  const spC = round1(steadyStateTemperatureC(cabinet.plant, out));
  const base: DrillInput = {
    formatVersion: 1,
    id,
    revision: 1,
    title,
    description: "",
    plant: { kind: "preset", presetId: cabinet.id },
    initialState: { temperatures: { kind: "steady", outPercent: out }, mode: "auto", setpointC: spC, outPercent: out },
    events: [],
    scoring: { windows: [{ id: "run", label: "whole run", kind: "setpoint", startS: 0, endS: 3600, weight: 1 }] },
    referenceTuning: CABINET_TUNING,
    durationS: 3600,
  };
  if (starterId !== "setpoint-step") return base;
  return {
    ...base,
    description: `Cabinet C-2 holds ${spC} °C at ${out} % OUT. Five minutes in, raise it to ${round1(spC + 15)} °C without passing 2 °C of overshoot.`,
    events: [{ type: "setpoint", timeS: 300, setpointC: round1(spC + 15) }],
    scoring: { windows: [{ id: "step", label: `${spC} → ${round1(spC + 15)} °C`, kind: "setpoint", startS: 300, endS: 3600, weight: 1 }] },
  };
}
