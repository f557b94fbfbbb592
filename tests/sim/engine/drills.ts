// Drill builders shared by the engine tests (not a test file itself).
import { drillSchema, type Drill, type DrillInput } from "@/sim/drill";

/** A quiet sensor chain: no noise, 32-bit ADC, ideal element — PV equals the element temperature. */
export const QUIET_SENSOR = {
  element: { toleranceClass: "A", tolerancePosition: 0, wiring: "4-wire" },
  transmitter: { rangeLowC: 0, rangeHighC: 200 },
  noise: { sdMa: 0 },
  analogInput: { bits: 32 },
} as const;

export function makeDrill(over: Partial<DrillInput> & { durationS: number }): Drill {
  const base: DrillInput = {
    formatVersion: 1,
    id: "test",
    title: "test drill",
    plant: { kind: "preset", presetId: "benchtop-curing-cabinet" },
    initialState: { temperatures: { kind: "steady", outPercent: 25 }, mode: "auto", setpointC: 59.3, outPercent: 25 },
    events: [],
    scoring: { windows: [{ id: "w", kind: "setpoint", startS: 0, endS: over.durationS }] },
    referenceTuning: { kind: "pid", kc: 6, ti: 400, sampleTimeS: 0.5 },
    drive: { kind: "time-proportioning", cycleTimeS: 2, minOnTimeS: 0, minOffTimeS: 0 },
    durationS: over.durationS,
  };
  return drillSchema.parse({ ...base, ...over });
}

/** FOPDT/first-order transfer-function plant around (50 %, 50 °C). */
export function firstOrderPlant(gain: number, tau: number, deadTimeS = 0) {
  return {
    kind: "transfer-function" as const,
    gainCPerPercent: gain,
    timeConstantsS: [tau],
    deadTimeS,
    operatingPoint: { outPercent: 50, temperatureC: 50 },
    ambientC: 20,
    sensorTimeConstantS: 0,
  };
}
