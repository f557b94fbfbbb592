/**
 * The hand-over path's four stages and where each stands, read from the Bench's state alone
 * (no stage keeps its own idea of "done"): what the worker computed, what the tests found, what
 * was applied, run, saved and written.
 */
import type { BenchFindings, BenchState, SiteProof } from "@/components/bench/store";
import { RULE_LABELS } from "@/components/bench/tests/labels";
import { gainPerCelsiusToDisplay, temperatureToDisplay, type TemperatureUnit } from "@/sim/units";

export type StageId = "power-curve" | "relay" | "proof" | "record";
export type StageState = "open" | "under-way" | "done";

export interface Stage {
  id: StageId;
  title: string;
  state: StageState;
  summary: string;
}

export interface StageInputs {
  powerCurve: BenchState["powerCurve"];
  findings: BenchFindings;
  siteProof: SiteProof | null;
  savedTuningSet: { id: string; name: string } | null;
  /** tuning sets stored for this plant (saved earlier or now); null while unknown */
  tuningSetCount: number | null;
  /** the record written from this flow, if any */
  recordId: string | null;
  unit: TemperatureUnit;
}

const fmt = (x: number, d = 1) => x.toFixed(d);

export function handoverStages(i: StageInputs): Stage[] {
  const T = `°${i.unit}`;
  const temp = (c: number) => `${fmt(temperatureToDisplay(c, i.unit))} ${T}`;
  const f = i.findings;

  const pc = i.powerCurve;
  const power: Stage = !pc
    ? { id: "power-curve", title: "Power curve", state: "open", summary: "Not computed yet: the Bench computes it once the plant is loaded." }
    : pc.holding.ok
      ? { id: "power-curve", title: "Power curve", state: "done", summary: `OUT ${fmt(pc.holding.outPercent)} % holds SP ${temp(pc.setpointC)}.` }
      : { id: "power-curve", title: "Power curve", state: "under-way", summary: `Computed, but no OUT holds SP ${temp(pc.setpointC)}: ${pc.holding.reason}.` };

  const r = f.relay;
  const rule = f.relayRule ? (RULE_LABELS[f.relayRule] ?? f.relayRule) : null;
  const figures = r ? `Ku ${String(+gainPerCelsiusToDisplay(r.ku, i.unit).toPrecision(3))} %/${T}, Pu ${fmt(r.puS / 60)} min` : "";
  const relay: Stage = !r
    ? { id: "relay", title: "Relay test and rule", state: "open", summary: "No relay result yet." }
    : rule
      ? { id: "relay", title: "Relay test and rule", state: "done", summary: `${figures}; ${rule} applied.` }
      : { id: "relay", title: "Relay test and rule", state: "under-way", summary: `${figures}; choose a rule and apply its proposal.` };

  const runs = f.proofRuns;
  const sides = new Set(runs.map((x) => x.tuningLabel));
  const proof: Stage =
    runs.length > 0 && sides.has("PI") && sides.has("PID")
      ? { id: "proof", title: "Proof tests", state: "done", summary: `${runs.length} runs, PI and PID side by side; last: ${runs[runs.length - 1].label}.` }
      : runs.length > 0
        ? { id: "proof", title: "Proof tests", state: "under-way", summary: `${runs.length} run${runs.length === 1 ? "" : "s"}; compare PI with PID on the same test.` }
        : i.siteProof
          ? { id: "proof", title: "Proof tests", state: "under-way", summary: `Ready, not run yet: ${i.siteProof.label}.` }
          : { id: "proof", title: "Proof tests", state: "open", summary: "No proof test yet: build a setpoint ladder with the site's disturbances, or take a stored drill." };

  const record: Stage = i.recordId
    ? { id: "record", title: "Settle and record", state: "done", summary: "Tuning record written." }
    : i.savedTuningSet
      ? { id: "record", title: "Settle and record", state: "under-way", summary: `Tuning set "${i.savedTuningSet.name}" saved; write the tuning record.` }
      : i.tuningSetCount
        ? { id: "record", title: "Settle and record", state: "under-way", summary: `${i.tuningSetCount} tuning set${i.tuningSetCount === 1 ? "" : "s"} stored for this plant: save the one you settle on, or pick it on the record.` }
        : { id: "record", title: "Settle and record", state: "open", summary: "Save the tuning you settle on as a tuning set, then write the record." };

  return [power, relay, proof, record];
}
