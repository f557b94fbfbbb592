/**
 * The drill's event timeline expanded into atomic, time-ordered changes. An event with a
 * duration yields a start change and an end change; the end returns that condition to its
 * nominal value (blockage 0 %, door shut, design ambient, nominal voltage, load taken out, no
 * extra noise, sensor healthy). A setpoint ramp becomes a staircase of setpoint changes at the
 * sample boundaries it spans, ending exactly on its target. At equal times ends come before
 * starts, then file order.
 */
import type { PlantDefinition } from "../plant/plant-definition";
import type { ColdLoad, PlantConditions } from "../plant/conditions";
import type { SensorFault } from "../sensor/config";
import type { DrillEvent } from "./schema";

export type TimelineChange =
  | { kind: "setpoint"; setpointC: number }
  | { kind: "mode"; mode: "auto" | "manual" }
  | { kind: "conditions"; patch: Partial<PlantConditions> }
  | { kind: "load-in"; load: ColdLoad }
  | { kind: "load-out" }
  | { kind: "noise"; extraNoiseSdMa: number }
  | { kind: "fault"; target: "control" | "cutout"; fault: SensorFault };

export interface TimedChange {
  timeS: number;
  change: TimelineChange;
  /** index of the drill event it comes from, and which end of it */
  eventIndex: number;
  phase: "start" | "end";
  /** for changes injected live (an operator's disturbance action): the flag's text */
  label?: string;
}

/** `sampleTimeS` places the steps of a setpoint ramp on the controller's sample boundaries. */
export function expandTimeline(events: DrillEvent[], plant: PlantDefinition, sampleTimeS = 1): TimedChange[] {
  const nominalV = plant.nominalVoltageV;
  const out: TimedChange[] = [];
  events.forEach((e, i) => {
    const add = (timeS: number, change: TimelineChange, phase: "start" | "end") => out.push({ timeS, change, eventIndex: i, phase });
    const withEnd = (start: TimelineChange, end: TimelineChange, durationS?: number) => {
      add(e.timeS, start, "start");
      if (durationS !== undefined) add(e.timeS + durationS, end, "end");
    };
    switch (e.type) {
      case "setpoint":
        add(e.timeS, { kind: "setpoint", setpointC: e.setpointC }, "start");
        break;
      case "setpoint-ramp": {
        // staircase: at every sample boundary t_k in [t0, t0 + D] SP = from + (to − from)(t_k − t0)/D
        const k0 = Math.ceil(e.timeS / sampleTimeS - 1e-9);
        const k1 = Math.floor((e.timeS + e.durationS) / sampleTimeS + 1e-9);
        for (let k = k0; k <= k1; k++) {
          const t = k * sampleTimeS;
          const f = Math.min(1, Math.max(0, (t - e.timeS) / e.durationS));
          add(t, { kind: "setpoint", setpointC: e.fromC + (e.toC - e.fromC) * f }, "start");
        }
        add(e.timeS + e.durationS, { kind: "setpoint", setpointC: e.toC }, "end");
        break;
      }
      case "mode":
        add(e.timeS, { kind: "mode", mode: e.mode }, "start");
        break;
      case "inlet-blockage":
        withEnd({ kind: "conditions", patch: { inletBlockagePercent: e.percent } }, { kind: "conditions", patch: { inletBlockagePercent: 0 } }, e.durationS);
        break;
      case "door-open": {
        const flow = e.extraAirflowM3PerH ?? (plant.kind === "enclosure" ? plant.doorOpenAirflowM3PerH : 0);
        withEnd({ kind: "conditions", patch: { doorAirflowM3PerH: flow } }, { kind: "conditions", patch: { doorAirflowM3PerH: 0 } }, e.durationS);
        break;
      }
      case "ambient":
        withEnd({ kind: "conditions", patch: { ambientC: e.temperatureC } }, { kind: "conditions", patch: { ambientC: plant.ambientC } }, e.durationS);
        break;
      case "supply-voltage":
        withEnd(
          { kind: "conditions", patch: { supplyVoltageV: (nominalV * e.percentOfNominal) / 100 } },
          { kind: "conditions", patch: { supplyVoltageV: nominalV } },
          e.durationS,
        );
        break;
      case "cold-load":
        withEnd(
          { kind: "load-in", load: { massKg: e.massKg, specificHeatJPerKgK: e.specificHeatJPerKgK, temperatureC: e.temperatureC, airCouplingWPerK: e.airCouplingWPerK } },
          { kind: "load-out" },
          e.durationS,
        );
        break;
      case "sensor-noise":
        withEnd({ kind: "noise", extraNoiseSdMa: e.extraNoiseSdMa }, { kind: "noise", extraNoiseSdMa: 0 }, e.durationS);
        break;
      case "sensor-fault":
        withEnd({ kind: "fault", target: e.target, fault: e.fault }, { kind: "fault", target: e.target, fault: "none" }, e.durationS);
        break;
    }
  });
  const rank = (c: TimedChange) => (c.phase === "end" ? 0 : 1);
  return out
    .map((c, order) => ({ c, order }))
    .sort((a, b) => a.c.timeS - b.c.timeS || rank(a.c) - rank(b.c) || a.order - b.order)
    .map((x) => x.c);
}
