/** The benchmark's 2-hour reference drill: 0.1 s sample time, 2 s cycle time, noise on. */
import { drillSchema, type Drill } from "../drill";

export function referenceDrill(lossModel: "linear" | "nonlinear" = "linear"): Drill {
  return drillSchema.parse({
    formatVersion: 1,
    id: "perf-reference",
    title: "Benchmark: 2 h ladder with a clogged inlet",
    plant: { kind: "preset", presetId: "benchtop-curing-cabinet", lossModel },
    initialState: { temperatures: { kind: "steady", outPercent: 25 }, mode: "auto", setpointC: 59.3, outPercent: 25 },
    events: [
      { type: "setpoint", timeS: 300, setpointC: 80 },
      { type: "inlet-blockage", timeS: 2400, percent: 60, durationS: 1800 },
      { type: "setpoint", timeS: 4800, setpointC: 95 },
      { type: "door-open", timeS: 6000, durationS: 120 },
    ],
    scoring: { windows: [{ id: "all", kind: "setpoint", startS: 300, endS: 2400 }] },
    referenceTuning: { kind: "pid", kc: 8, ti: 400, td: 20, sampleTimeS: 0.1, pvFilterTauS: 1 },
    sensor: { noise: { sdMa: 0.01 } },
    noise: { seed: 4242 },
    drive: { kind: "time-proportioning", cycleTimeS: 2, minOnTimeS: 0.02, minOffTimeS: 0.02 },
    durationS: 7200,
  });
}

