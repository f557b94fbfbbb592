// The Bench's live results: one window per SP change, each ending before the next change, so a
// window's step is its own (common practice: one step per measurement window).
import { describe, expect, it } from "vitest";
import { BENCH_START_TUNING, benchDrill } from "@/components/bench/bench-drill";
import { benchWindows } from "@/components/bench/bench-results";
import { BenchSession } from "@/sim/worker/bench-session";

describe("benchWindows", () => {
  it("measures each SP step against its own target", () => {
    const session = new BenchSession(benchDrill({ plant: { kind: "preset", presetId: "benchtop-curing-cabinet" }, title: "t", setpointC: 60, reference: BENCH_START_TUNING, seed: 3 }));
    const ts = session.sampleTimeS;
    session.stepSamples(60 / ts);
    session.act({ type: "setpoint", setpointC: 70 });
    session.stepSamples(900 / ts);
    session.act({ type: "setpoint", setpointC: 80 });
    session.stepSamples(900 / ts);
    const w = benchWindows(session.simulation.trace(), session.simulation.events, 0.05, 150);
    expect(w.map((x) => x.label)).toEqual(["SP 60.0 → 70.0 °C", "SP 70.0 → 80.0 °C"]);
    expect(w[0].results.stepSizeC).toBeCloseTo(10, 0);
    expect(w[0].results.settlingTimeS).not.toBeNull();
    expect(w[1].results.stepSizeC).toBeCloseTo(10, 0);
  });
});
