/**
 * The tuning record's request (app/_lib/records/record-document.ts) from what the Bench recorded
 * as the technician went: the power curve, the relay result with the rule applied, the bump
 * model, and the proof tests exactly as they were run. The server re-runs every proof test and
 * recomputes what it can; this only says what was done.
 */
import type { RecordRequest } from "@/app/_lib/records/record-document";
import type { BenchFindings, BenchState, ProofRun } from "@/components/bench/store";
import { controllerConfigSchema, type ControllerConfig } from "@/sim/control/config";
import type { ProcessModel } from "@/sim/tuning/models";

type RecordModel = NonNullable<RecordRequest["model"]>;
type PowerCurve = NonNullable<BenchState["powerCurve"]>;

export const MAX_CURVE_POINTS = 60;

/** Only the model's own figures (the record's schema is strict). */
export function recordModelOf(m: ProcessModel): RecordModel {
  return m.kind === "fopdt"
    ? { kind: "fopdt", gainCPerPercent: m.gainCPerPercent, timeConstantS: m.timeConstantS, deadTimeS: m.deadTimeS }
    : { kind: "sopdt", gainCPerPercent: m.gainCPerPercent, timeConstant1S: m.timeConstant1S, timeConstant2S: m.timeConstant2S, deadTimeS: m.deadTimeS };
}

/** The curve's points, thinned evenly (ends kept) when there are more than the record holds. */
export function curvePoints(pc: PowerCurve): { outPercent: number; temperatureC: number }[] {
  const p = pc.curve.points.filter((x) => Number.isFinite(x.steadyStateC));
  const pick = p.length <= MAX_CURVE_POINTS ? p : Array.from({ length: MAX_CURVE_POINTS }, (_, i) => p[Math.round((i * (p.length - 1)) / (MAX_CURVE_POINTS - 1))]);
  return pick.map((x) => ({ outPercent: x.outPercent, temperatureC: x.steadyStateC }));
}

const sameController = (a: ControllerConfig, b: ControllerConfig) => JSON.stringify(controllerConfigSchema.parse(a)) === JSON.stringify(controllerConfigSchema.parse(b));

export interface RecordInputs {
  plantRef: string;
  origin: "physical" | "twin";
  tuningSet: { id: string; name: string; controller: ControllerConfig };
  title: string;
  notes: string;
  findings: BenchFindings;
  powerCurve: BenchState["powerCurve"];
  /** keys of the proof runs to include, in the order shown */
  proofKeys: string[];
}

/** A proof run's tuning as the record names it: the tuning set's name when it ran exactly that set. */
export function tuningLabelOf(run: ProofRun, set: RecordInputs["tuningSet"]): string {
  return sameController(run.controller, set.controller) ? set.name.slice(0, 80) : run.tuningLabel;
}

export function buildRecordRequest(i: RecordInputs): RecordRequest {
  const f = i.findings;
  // a twin's own identified model is filled in by the server; otherwise the bump model the tuning came from, or the last one
  const model = i.origin === "twin" ? null : f.applied?.source === "bump" && f.applied.model ? f.applied.model : f.bumpModel;
  const points = i.powerCurve ? curvePoints(i.powerCurve) : [];
  const chosen = i.proofKeys.map((k) => f.proofRuns.find((r) => r.key === k)).filter((r): r is ProofRun => !!r);
  return {
    plantRef: i.plantRef,
    tuningSetId: i.tuningSet.id,
    title: i.title.trim(),
    notes: i.notes.trim(),
    model: model ? recordModelOf(model) : null,
    powerCurve: points.length >= 2 ? { kind: "power-curve", points } : null,
    // the relay result goes on the record with the rule that was applied to it, or not at all
    relay:
      f.relay && f.relayRule
        ? { kind: "relay", ultimateGain: f.relay.ku, ultimatePeriodS: f.relay.puS, pvAmplitudeC: f.relay.amplitudeC, relayAmplitudePercent: f.relay.dPercent, rule: f.relayRule }
        : null,
    proofTests: chosen.map((r) => ({
      kind: "proof",
      label: r.label,
      tuningLabel: tuningLabelOf(r, i.tuningSet),
      drill: r.drill,
      drillVersion: r.drillVersion,
      controller: r.controller,
      seed: r.seed,
    })),
  };
}
