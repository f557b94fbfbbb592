/** Drill builders for the tuning tests on the engine (not a test file). */
import { drillSchema, type Drill, type DrillInput } from "@/sim/drill";

/** No noise, 32-bit input, ideal 4-wire element: PV equals the element temperature. */
export const QUIET = {
  element: { toleranceClass: "A", tolerancePosition: 0, wiring: "4-wire" },
  transmitter: { rangeLowC: 0, rangeHighC: 200 },
  noise: { sdMa: 0 },
  analogInput: { bits: 32 },
} as const;

export function drill(over: Partial<DrillInput> & { durationS: number }): Drill {
  const base: DrillInput = {
    formatVersion: 1,
    id: "tuning-test",
    title: "tuning test",
    plant: { kind: "preset", presetId: "benchtop-curing-cabinet" },
    initialState: { temperatures: { kind: "steady", outPercent: 25 }, mode: "manual", setpointC: 60, outPercent: 25 },
    events: [],
    scoring: { windows: [{ id: "w", kind: "setpoint", startS: 0, endS: over.durationS }] },
    referenceTuning: { kind: "pid", kc: 6, ti: 400, sampleTimeS: 0.5 },
    drive: { kind: "continuous" },
    cutout: { enabled: false, tripPointC: 500 },
    durationS: over.durationS,
  };
  return drillSchema.parse({ ...base, ...over });
}

/** FOPDT around (50 %, 50 °C). */
export function fopdtPlant(gain: number, tau: number, deadTimeS: number, sensorTimeConstantS = 0) {
  return {
    kind: "transfer-function" as const,
    gainCPerPercent: gain,
    timeConstantsS: [tau],
    deadTimeS,
    operatingPoint: { outPercent: 50, temperatureC: 50 },
    ambientC: 20,
    sensorTimeConstantS,
  };
}
