import { describe, expect, it } from "vitest";
import { Simulation } from "@/sim/drill";
import { BumpTest } from "@/sim/tuning/bump";
import { drill, fopdtPlant } from "./drills";

const rel = (x: number, ref: number) => Math.abs(x / ref - 1);

describe("bump test on the engine", () => {
  it("FOPDT plant (K 1.5 °C/%, τ 300 s, θ 40 s) with the default noisy sensor, continuous drive: identified within 5 %", () => {
    const sim = new Simulation(
      drill({
        durationS: 100,
        plant: fopdtPlant(1.5, 300, 40),
        initialState: { temperatures: { kind: "steady", outPercent: 50 }, mode: "auto", setpointC: 50, outPercent: 50 },
        referenceTuning: { kind: "pid", kc: 1, ti: 300, sampleTimeS: 0.5 },
        drive: { kind: "continuous" },
      }),
    );
    const test = new BumpTest(sim, { stepPercent: 10, responseS: 2400 });
    const fractions: number[] = [];
    const r = test.run((p) => fractions.push(p.fraction), 500);
    expect(fractions.length).toBeGreaterThan(3);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.record.t.length).toBeLessThan(1000); // dense-then-sparse logging
    const m = r.identification.fopdt.model;
    expect(rel(m.gainCPerPercent, 1.5)).toBeLessThan(0.05);
    expect(rel(m.timeConstantS, 300)).toBeLessThan(0.05);
    expect(rel(m.deadTimeS, 40)).toBeLessThan(0.05);
    expect(r.identification.fopdt.quality.r2).toBeGreaterThan(0.999);
    expect(r.identification.warnings.map((w) => w.code)).not.toContain("dead-time-few-samples");
    const rec = r.proposal.recommended;
    expect("refused" in rec).toBe(false);
    // handed back: auto at the starting OUT
    expect(sim.controllerState.mode).toBe("auto");
    expect(r.returned.outPercent).toBe(50);
  }, 30_000);

  it("benchtop cabinet with a 2 s SSR cycle: fitted with R² > 0.98, SOPDT never worse than FOPDT, and a tuning proposed", () => {
    const sim = new Simulation(
      drill({
        durationS: 100,
        plant: { kind: "preset", presetId: "benchtop-curing-cabinet" },
        initialState: { temperatures: { kind: "steady", outPercent: 25 }, mode: "manual", setpointC: 60, outPercent: 25 },
        referenceTuning: { kind: "pid", kc: 6, ti: 400, sampleTimeS: 0.5 },
        drive: { kind: "time-proportioning", cycleTimeS: 2 },
      }),
    );
    const r = new BumpTest(sim, { stepPercent: 10 }).run();
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const id = r.identification;
    // the cabinet's response is two time scales (a quick rise of the air, then the walls creeping
    // up): neither model is exact, both explain about 99 % of the variation
    expect(id.fopdt.quality.r2).toBeGreaterThan(0.98);
    expect(id.sopdt!.quality.sse).toBeLessThan(1.01 * id.fopdt.quality.sse);
    expect(id.warnings.map((w) => w.code)).not.toContain("not-steady-before-step");
    // static gain against the engine's steady state (the power curve's slope, linear plant)
    expect(rel(id.fopdt.model.gainCPerPercent, 1.5)).toBeLessThan(0.25);
    const rec = r.proposal.recommended;
    if ("refused" in rec) throw new Error(rec.reason);
    expect(rec.controllerConfig?.sampleTimeS).toBe(0.5);
    expect(rec.tuning.rule).toBe("imc-lambda"); // AMIGO needs θ > 0; the fit found none, so IMC is next in line
    expect(rec.assessment?.verdict).toBe("robust");
  }, 60_000);

  it("a record with no response (zero gain) comes back as a refusal, not an exception", () => {
    const sim = new Simulation(
      drill({
        durationS: 100,
        plant: fopdtPlant(0, 300, 40),
        initialState: { temperatures: { kind: "steady", outPercent: 50 }, mode: "manual", setpointC: 50, outPercent: 50 },
        referenceTuning: { kind: "pid", kc: 1, ti: 300, sampleTimeS: 0.5 },
      }),
    );
    const r = new BumpTest(sim, { responseS: 600 }).run();
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.refusal.message).toMatch(/no response|flat/);
  }, 30_000);
});
