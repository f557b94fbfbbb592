// The tuning record's request from the Bench's findings: only the record schema's own fields,
// the power curve thinned to what the record holds, the relay result only with the rule applied
// to it, a twin's model left to the server, and a proof run named after the tuning set it became.
import { describe, expect, it } from "vitest";
import { recordRequestSchema } from "@/app/_lib/records/record-document";
import { BENCH_START_TUNING, benchDrill } from "@/components/bench/bench-drill";
import { NO_FINDINGS, type BenchState, type ProofRun } from "@/components/bench/store";
import { buildRecordRequest, curvePoints, MAX_CURVE_POINTS, recordModelOf, tuningLabelOf } from "@/components/commissioning/record-request";
import { controllerConfigSchema } from "@/sim/control/config";
import { findPreset } from "@/sim/plant/presets";
import { outputForSetpoint, powerCurve } from "@/sim/tuning/power-curve";

const def = findPreset("benchtop-curing-cabinet")!.plant;
const set = { id: "9d3e2f1a-0b4c-4e5d-8a6f-7b8c9d0e1f2a", name: "PID 4 s filter", controller: controllerConfigSchema.parse({ kc: 12, ti: 260, td: 40, pvFilterTauS: 4 }) };
const drill = benchDrill({ plant: { kind: "stored", definition: def, cutoutTripC: 110 }, title: "C-2", setpointC: 60, reference: BENCH_START_TUNING, seed: 3 });
const run = (key: string, tuningLabel: string, controller: unknown): ProofRun => ({ key, label: `ladder · ${tuningLabel}`, tuningLabel, drill, drillVersion: null, controller: controllerConfigSchema.parse(controller), seed: 3, iae: 100, overshootPct: 1 });
const pc = (outs: number[]): NonNullable<BenchState["powerCurve"]> => {
  const curve = powerCurve(def, { outputsPercent: outs });
  return { setpointC: 60, curve, holding: outputForSetpoint(curve, 60), staticGainCPerPercent: null, heatUp: { atFullOutputS: null, atHoldingOutputS: null } as never };
};

describe("record request", () => {
  it("thins a long power curve evenly, keeping both ends", () => {
    const outs = Array.from({ length: 101 }, (_, i) => i);
    const pts = curvePoints(pc(outs));
    expect(pts).toHaveLength(MAX_CURVE_POINTS);
    expect(pts[0].outPercent).toBe(0);
    expect(pts[pts.length - 1].outPercent).toBe(100);
    expect(curvePoints(pc([0, 50, 100])).map((p) => p.outPercent)).toEqual([0, 50, 100]);
  });

  it("keeps only a model's own figures", () => {
    expect(recordModelOf({ kind: "fopdt", gainCPerPercent: 1.1, timeConstantS: 600, deadTimeS: 30, extra: 1 } as never)).toEqual({ kind: "fopdt", gainCPerPercent: 1.1, timeConstantS: 600, deadTimeS: 30 });
  });

  it("names a proof run after the tuning set only when it ran exactly that set", () => {
    expect(tuningLabelOf(run("a", "PID", { kc: 12, ti: 260, td: 40, pvFilterTauS: 4 }), set)).toBe("PID 4 s filter");
    expect(tuningLabelOf(run("b", "PID", { kc: 12, ti: 260, td: 40 }), set)).toBe("PID");
  });

  it("carries the bump model for a physical plant, none for a twin, and the relay only with its rule", () => {
    const findings = { ...NO_FINDINGS, relay: { ku: 20, puS: 300, amplitudeC: 0.8, dPercent: 10 }, bumpModel: { kind: "fopdt" as const, gainCPerPercent: 1.1, timeConstantS: 600, deadTimeS: 30 }, proofRuns: [run("a", "PI", { kc: 9, ti: 300 }), run("b", "PID", { kc: 12, ti: 260, td: 40 })] };
    const base = { plantRef: "plant:0b6b0f0e-7d52-4c8e-9a51-4f3f1c2a9e11", tuningSet: set, title: " C-2 hand-over ", notes: "", findings, powerCurve: pc([0, 25, 50, 75, 100]), proofKeys: ["b"] };
    const physical = buildRecordRequest({ ...base, origin: "physical" });
    expect(recordRequestSchema.safeParse(physical).success).toBe(true);
    expect(physical.title).toBe("C-2 hand-over");
    expect(physical.model).toEqual(findings.bumpModel);
    expect(physical.relay).toBeNull(); // no rule applied to the relay result
    expect(physical.proofTests?.map((p) => p.tuningLabel)).toEqual(["PID"]);
    const twin = buildRecordRequest({ ...base, origin: "twin", findings: { ...findings, relayRule: "amigo" } });
    expect(recordRequestSchema.safeParse(twin).success).toBe(true);
    expect(twin.model).toBeNull();
    expect(twin.relay).toEqual({ kind: "relay", ultimateGain: 20, ultimatePeriodS: 300, pvAmplitudeC: 0.8, relayAmplitudePercent: 10, rule: "amigo" });
  });
});
