/**
 * The Bench's run as a record to save: the drill cut to the rows recorded, the starting
 * controller, seed, action log, and the results the engine's own results code computes on the
 * streamed trace (the same function runDrill uses, on the same samples).
 */
import type { ControllerConfig } from "@/sim/control/config";
import type { StampedAction } from "@/sim/drill/actions";
import { makeReplayBundle } from "@/sim/drill/replay-bundle";
import { computeRunResults, type RunResults } from "@/sim/drill/results";
import { noiseSigmaC, resolveCutout, resolveSensor } from "@/sim/drill/resolve";
import { drillSchema, type DrillInput } from "@/sim/drill/schema";
import type { SimEvent } from "@/sim/drill/simulation";
import type { Trace } from "@/sim/drill/trace";
import type { SafetyTrip } from "@/sim/safety/cutout";

export interface CurrentRunRecord {
  drill: DrillInput;
  controller: ControllerConfig;
  seed: number;
  actionLog: StampedAction[];
  results: RunResults;
  engineVersion: string;
  durationS: number;
}

export function currentRunRecord(p: { drill: DrillInput; controller: ControllerConfig; seed: number; actions: StampedAction[]; trace: Trace; events: SimEvent[]; engineVersion: string }): CurrentRunRecord | null {
  const rows = p.trace.length;
  if (rows < 3) return null;
  const bundle = makeReplayBundle({ engineVersion: p.engineVersion, drill: p.drill, controller: p.controller, seed: p.seed, actions: p.actions, rows });
  const drill = drillSchema.parse(bundle.drill);
  const sensor = resolveSensor(drill);
  const cutout = resolveCutout(drill);
  const ts = p.controller.sampleTimeS;
  let energyJ = 0;
  for (let i = 0; i + 1 < rows; i++) energyJ += p.trace.heaterPowerW[i] * ts;
  // the worker's events carry each trip as "<cause> at <sensor °C> °C"
  const trips: SafetyTrip[] = p.events
    .filter((e) => e.type === "safety-trip")
    .map((e) => {
      const m = /^(\S+) at (-?[\d.]+)/.exec(e.detail);
      return { timeS: e.timeS, cause: (m?.[1] ?? e.detail) as SafetyTrip["cause"], sensorC: m ? Number(m[2]) : 0 };
    });
  const results = computeRunResults(p.trace, {
    drill,
    seed: p.seed,
    engineVersion: p.engineVersion,
    noiseSigmaC: noiseSigmaC(sensor),
    cutoutPointC: cutout.tripPointC,
    safetyTrips: trips,
    heaterEnergyKWh: energyJ / 3.6e6,
    controllerViolations: [],
  });
  return { drill: bundle.drill, controller: p.controller, seed: p.seed, actionLog: [...p.actions], results, engineVersion: p.engineVersion, durationS: drill.durationS };
}
