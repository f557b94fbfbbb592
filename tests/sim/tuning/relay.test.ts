import { describe, expect, it } from "vitest";
import { Simulation } from "@/sim/drill";
import { steadyStateTemperatureC, findPreset } from "@/sim/plant";
import {
  RelayTest, fopdtRelayLimitCycle, fopdtUltimatePoint, fopdtFromUltimate, hysteresisRelayUltimateGain, idealRelayUltimateGain,
  negativeInverseDescribingFunction, relayDescribingFunction, type RelayResult, type RelayOutcome,
} from "@/sim/tuning/relay";
import { drill, fopdtPlant, QUIET } from "./drills";

function done(r: RelayOutcome): RelayResult {
  if (!r.ok) throw new Error(`${r.code}: ${r.message}`);
  return r;
}
const rel = (x: number, ref: number) => Math.abs(x / ref - 1);

describe("describing function (references §1)", () => {
  it("ideal relay Ku = 4d/(πa): Bequette 2003 §11.3 example h = 0.05, a = 0.019 → 3.35063", () => {
    expect(idealRelayUltimateGain(0.05, 0.019)).toBeCloseTo(3.35063, 5);
  });
  it("relay with hysteresis (python-control descfcn.py / FBS2e Ex. 10.12): d = 1, ε = 0.05, a = 0.2 → N = 6.16404 − 1.59155j, −1/N = −0.152092 − 0.039270j", () => {
    const n = relayDescribingFunction(1, 0.2, 0.05);
    expect(n.re).toBeCloseTo(6.16404, 5);
    expect(n.im).toBeCloseTo(-1.59155, 5);
    const m = negativeInverseDescribingFunction(1, 0.2, 0.05);
    expect(m.re).toBeCloseTo(-0.152092, 6);
    expect(m.im).toBeCloseTo(-0.03927, 6);
    // Loopwright's convention: Ku = 1/|Re(−1/N)| = 4d/(π√(a² − ε²))
    expect(hysteresisRelayUltimateGain(1, 0.2, 0.05)).toBeCloseTo(1 / 0.152092, 4);
    expect(hysteresisRelayUltimateGain(1, 0.2, 0)).toBe(idealRelayUltimateGain(1, 0.2));
  });
});

describe("exact FOPDT relations (references §1)", () => {
  it("ultimate point of K=1, τ=10, θ=2 from θω + atan(τω) = π: Ku 8.50243, Pu 7.44152, ωu 0.844341", () => {
    const u = fopdtUltimatePoint(1, 10, 2);
    expect(u.ku).toBeCloseTo(8.50243, 4);
    expect(u.puS).toBeCloseTo(7.44152, 4);
    expect(u.omegaU).toBeCloseTo(0.844341, 5);
  });
  it("exact relay limit cycle (closed forms, references §1; book source from memory): a 0.181269, Th 3.665895; with ε = 0.05: a 0.222206, Th 4.519505", () => {
    const a = fopdtRelayLimitCycle(1, 10, 2, 1, 0);
    expect(a.amplitude).toBeCloseTo(0.181269, 6);
    expect(a.halfPeriodS).toBeCloseTo(3.665895, 6);
    const b = fopdtRelayLimitCycle(1, 10, 2, 1, 0.05);
    expect(b.amplitude).toBeCloseTo(0.222206, 6);
    expect(b.halfPeriodS).toBeCloseTo(4.519505, 6);
  });
  it("FOPDT from the exact ultimate point and the gain returns the FOPDT (derived from its frequency response)", () => {
    const f = fopdtFromUltimate(1, 8.50243, 7.44152);
    expect(f.ok && f.model.timeConstantS).toBeCloseTo(10, 3);
    expect(f.ok && f.model.deadTimeS).toBeCloseTo(2, 3);
    expect(fopdtFromUltimate(0.1, 5, 10).ok).toBe(false); // K·Ku ≤ 1
  });
});

// FOPDT K = 1 °C/%, τ = 10 s, θ = 2 s around (50 %, 50 °C), relay ±10 % (h = 10, so a and ε scale by 10)
function fopdtSim(sampleTimeS = 0.005, out = 50, mode: "auto" | "manual" = "manual", extra: Record<string, unknown> = {}, noiseSdMa = 0) {
  return new Simulation(
    drill({
      durationS: 100,
      plant: fopdtPlant(1, 10, 2),
      initialState: { temperatures: { kind: "steady", outPercent: out }, mode, setpointC: 50 + (out - 50), outPercent: out },
      sensor: { ...QUIET, noise: { sdMa: noiseSdMa } },
      referenceTuning: { kind: "pid", kc: 2, ti: 10, sampleTimeS, ...extra },
    }),
  );
}

describe("relay test on the engine: FOPDT", () => {
  it.each([
    [0, 1.81269, 3.665895],
    [0.5, 2.22206, 4.519505],
  ])("ε = %f °C: amplitude and half-period match the exact limit cycle (a %f, Th %f) within 0.5 %", (eps, a, th) => {
    const r = done(new RelayTest(fopdtSim(), { hysteresisC: eps }).run());
    expect(rel(r.amplitudeC, a)).toBeLessThan(5e-3);
    expect(rel(r.highHalfPeriodS, th)).toBeLessThan(5e-3);
    expect(rel(r.lowHalfPeriodS, th)).toBeLessThan(5e-3);
    expect(r.dPercent).toBe(10);
    expect(r.biasPercent).toBeCloseTo(0, 9);
  });

  it("ideal relay: Ku and Pu within the describing-function error of the exact ultimate point (Ku −17 %, Pu −1.5 %, references §1)", () => {
    const r = done(new RelayTest(fopdtSim(), { hysteresisC: 0 }).run());
    expect(rel(r.ku, 7.02402)).toBeLessThan(5e-3); // 4h/(πa) at the exact limit cycle
    expect(rel(r.puS, 7.33179)).toBeLessThan(5e-3);
    expect(r.ku / 8.50243).toBeGreaterThan(0.8);
    expect(r.ku / 8.50243).toBeLessThan(0.85);
    expect(r.puS / 7.44152).toBeGreaterThan(0.97);
    expect(r.puS / 7.44152).toBeLessThan(1);
    // gain from the power curve: the engine's steady state gives K = 1 exactly for this plant
    expect(r.fopdt.model?.gainCPerPercent).toBeCloseTo(1, 9);
    if (r.fopdt.model) expect(r.fopdt.gainSource).toBe("power-curve");
    expect(r.proposal.recommended).toHaveProperty("tuning.rule", "tyreus-luyben");
    expect(r.proposal.tunings.length).toBeGreaterThan(10);
  });

  it("third-order plant 1/((3s+1)(2s+1)(s+1)) (the third lag as the sensor's): relay a 0.13089·h, P 6.388, Ku 9.727 vs exact 10 (references §1/§2)", () => {
    const sim = new Simulation(
      drill({
        durationS: 100,
        plant: { ...fopdtPlant(1, 3, 0, 1), timeConstantsS: [3, 2] },
        initialState: { temperatures: { kind: "steady", outPercent: 50 }, mode: "manual", setpointC: 50, outPercent: 50 },
        sensor: QUIET,
        referenceTuning: { kind: "pid", kc: 2, ti: 10, sampleTimeS: 0.002 },
      }),
    );
    const r = done(new RelayTest(sim, { hysteresisC: 0, sensorLagS: 0 }).run());
    expect(rel(r.amplitudeC, 1.3089)).toBeLessThan(5e-3);
    expect(rel(r.puS, 6.388)).toBeLessThan(5e-3);
    expect(rel(r.ku, 9.727)).toBeLessThan(5e-3);
    expect(r.ku).toBeLessThan(10); // the describing function underestimates Ku here too
    // without dead time the oscillation builds up from nothing: settling was extended automatically
    expect(r.settlingCyclesUsed).toBeGreaterThan(1);
  });

  it("stops before the relay when asked to, if the hysteresis is under 3σ of the noise (Bequette §11.3: ε ≥ 2–3σ)", () => {
    const sim = new Simulation(
      drill({
        durationS: 100,
        plant: fopdtPlant(1, 10, 2),
        initialState: { temperatures: { kind: "steady", outPercent: 50 }, mode: "manual", setpointC: 50, outPercent: 50 },
        sensor: { ...QUIET, noise: { sdMa: 0.02 } }, // 0.25 °C on a 200 °C span
        referenceTuning: { kind: "pid", kc: 2, ti: 10, sampleTimeS: 0.01 },
      }),
    );
    const r = new RelayTest(sim, { hysteresisC: 0.1, stopOnNoiseWarning: true }).run();
    expect(!r.ok && r.code).toBe("noise-warning");
    expect(!r.ok && r.message).toMatch(/less than 3σ/);
  });

  it("direct-acting loop (a cooled process, K = −1 °C/%): the same Ku and Pu", () => {
    const sim = new Simulation(
      drill({
        durationS: 100,
        plant: fopdtPlant(-1, 10, 2),
        initialState: { temperatures: { kind: "steady", outPercent: 50 }, mode: "manual", setpointC: 50, outPercent: 50 },
        sensor: QUIET,
        referenceTuning: { kind: "pid", kc: 2, ti: 10, sampleTimeS: 0.005, action: "direct" },
      }),
    );
    const r = done(new RelayTest(sim, { hysteresisC: 0 }).run());
    expect(rel(r.ku, 7.02402)).toBeLessThan(5e-3);
    expect(rel(r.puS, 7.33179)).toBeLessThan(5e-3);
    expect(r.fopdt.model?.gainCPerPercent).toBeCloseTo(1, 9); // the magnitude, for the rules
  });

  it("reports live progress: crossings, half-periods, amplitude and running estimates", () => {
    const test = new RelayTest(fopdtSim(0.01), { hysteresisC: 0 });
    const seen: number[] = [];
    test.run((p) => seen.push(p.crossings), 200);
    expect(seen.some((c) => c > 0 && c < 7)).toBe(true);
    const p = test.progress;
    expect(p.crossings).toBe(9); // 1 settling + 3 measured cycles: 2·4 + 1 switches
    expect(p.halfPeriodsS.length).toBe(8);
    expect(p.cyclesMeasured).toBe(3);
    expect(p.kuEstimate).toBeGreaterThan(6.9);
    expect(p.puEstimateS).toBeCloseTo(7.33, 1);
  });

  it("a clipped relay is asymmetric: d = (high − low)/2, Pu = sum of the two half-periods, bias reported", () => {
    const sim = fopdtSim(0.01, 95);
    const r = done(new RelayTest(sim, { hysteresisC: 0 }).run());
    expect(r.highPercent).toBe(100);
    expect(r.lowPercent).toBe(85);
    expect(r.dPercent).toBe(7.5);
    expect(r.biasPercent).toBeCloseTo(-2.5, 9);
    expect(r.highHalfPeriodS).not.toBeCloseTo(r.lowHalfPeriodS, 1);
    expect(r.puS).toBeCloseTo(r.highHalfPeriodS + r.lowHalfPeriodS, 12);
    expect(r.warnings.join(" ")).toMatch(/asymmetric.*bias/);
  });

  it("hands back bumplessly: manual at the mean relay OUT, the original tuning and mode (auto), SP restored", () => {
    const sim = fopdtSim(0.01, 50, "auto", { spTrackInManual: true }, 0.002); // 0.025 °C of noise: SP tracking moves SP
    const before = sim.controllerConfig;
    const r = done(new RelayTest(sim, { hysteresisC: 0.2 }).run());
    expect(r.start.setpointTracksPv).toBe(true);
    expect(r.warnings.join(" ")).toMatch(/SP tracks PV/);
    expect(sim.controllerState.mode).toBe("auto");
    expect(sim.controllerConfig).toEqual(before);
    expect(r.returned.outPercent).toBeCloseTo(r.meanOutPercent, 12);
    expect(sim.controllerState.sp).toBe(50);
    const outs: number[] = [];
    for (let i = 0; i < 20; i++) {
      sim.step();
      outs.push(sim.snapshot().outPercent);
    }
    expect(Math.abs(outs[0] - r.meanOutPercent)).toBeLessThan(2); // no jump to a relay level
  });

  it("aborts cleanly: time limit, cancel, a setpoint change during the test; the loop is handed back each time", () => {
    const slow = new RelayTest(fopdtSim(0.01), { hysteresisC: 0, timeLimitS: 10 }).run();
    expect(!slow.ok && slow.code).toBe("time-limit");
    const sim = fopdtSim(0.01);
    const t = new RelayTest(sim, { hysteresisC: 0 });
    for (let i = 0; i < 4000; i++) t.step();
    t.cancel();
    const c = t.run();
    expect(!c.ok && c.code).toBe("cancelled");
    expect(sim.controllerConfig.kind).toBe("pid");
    expect(sim.controllerState.mode).toBe("manual");
    const sim2 = fopdtSim(0.01);
    const t2 = new RelayTest(sim2, { hysteresisC: 0 });
    for (let i = 0; i < 4000; i++) t2.step();
    sim2.act({ type: "setpoint", setpointC: 55 });
    const c2 = t2.run();
    expect(!c2.ok && c2.code).toBe("setpoint-changed");
    expect(!c2.ok && c2.message).toMatch(/setpoint changed during the relay test/);
  });

  it("proposes a sample time and PV filter from the FOPDT estimate (common practice rules)", () => {
    const r = done(new RelayTest(fopdtSim(0.01), { hysteresisC: 0 }).run());
    expect(r.sampleTimeAndFilter?.sampleTimeS).toBe(0.01); // the configured one is kept and checked
    expect(r.sampleTimeAndFilter?.pvFilterTauS).toBe(0); // a quiet sensor needs no filter
  });

  it("warns when the loop is not near SP at the start (common practice: bring it there in manual first)", () => {
    const sim = fopdtSim(0.01, 50);
    const r = done(new RelayTest(sim, { hysteresisC: 0, setpointC: 53 }).run());
    expect(r.warnings.join(" ")).toMatch(/from SP .* bring the loop near its operating point in manual first/);
  });
});

describe("relay test on the noisy-sensor cabinet (references §16, common practice)", () => {
  const preset = findPreset("relay-practice-noisy-cabinet")!;
  // OUT that holds 60 °C, from the power curve (bisection on the engine's steady state)
  let lo = 0;
  let hi = 100;
  for (let i = 0; i < 50; i++) {
    const m = (lo + hi) / 2;
    if (steadyStateTemperatureC(preset.plant, m) < 60) lo = m;
    else hi = m;
  }
  const holdOut = lo;
  const cabinet = (pvFilterTauS: number) =>
    new Simulation(
      drill({
        durationS: 100,
        plant: { kind: "preset", presetId: "relay-practice-noisy-cabinet" },
        initialState: { temperatures: { kind: "steady", outPercent: holdOut }, mode: "manual", setpointC: 60, outPercent: holdOut },
        referenceTuning: { kind: "pid", kc: 6, ti: 400, sampleTimeS: 0.1, pvFilterTauS },
        drive: { kind: "time-proportioning", cycleTimeS: 2 },
      }),
    );
  const eps = 0.25;

  it("no PV filter, noise larger than the hysteresis: warns, then aborts with the noise message instead of numbers", () => {
    const r = new RelayTest(cabinet(0), { hysteresisC: eps, amplitudePercent: 15 }).run();
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.start!.noiseSigmaC).toBeGreaterThan(eps); // σ of the PV the controller sees exceeds ε
    expect(r.warnings.join(" ")).toMatch(/less than 3σ of the PV noise/);
    expect(r.code).toBe("noise");
    expect(r.message).toMatch(/noise is switching the relay.*Add a PV filter.*widen the hysteresis/);
    expect(r).not.toHaveProperty("ku");
  });

  it("with a PV filter of a quarter of the sensor lag: three clean cycles, and the proposed tuning holds a setpoint step without sustained oscillation", () => {
    const sensorLag = preset.plant.sensorTimeConstantS;
    const sim = cabinet(sensorLag / 4);
    const test = new RelayTest(sim, { hysteresisC: eps, amplitudePercent: 15 });
    const r = done(test.run());
    expect(test.progress.cyclesMeasured).toBe(3);
    for (const h of test.progress.halfPeriodsS) expect(h).toBeGreaterThan(4 * sensorLag); // no false crossings
    expect(r.start.noiseSigmaC).toBeLessThan(eps / 3);
    expect(r.warnings.join(" ")).not.toMatch(/less than 3σ/);
    const rec = r.proposal.recommended;
    if ("refused" in rec) throw new Error(rec.reason);
    expect(rec.controllerConfig).not.toBeNull();
    // apply the proposal, step SP 60 → 65 °C, and watch the true temperature
    sim.act({ type: "tuning", controller: rec.controllerConfig! });
    sim.act({ type: "mode", mode: "auto" });
    sim.act({ type: "setpoint", setpointC: 65 });
    const t0 = sim.timeS;
    const dev: { t: number; e: number }[] = [];
    while (sim.timeS < t0 + 3600) {
      sim.step();
      const s = sim.snapshot();
      dev.push({ t: s.timeS - t0, e: s.trueC - 65 });
    }
    const band = (from: number, to: number) => {
      const xs = dev.filter((d) => d.t >= from && d.t < to).map((d) => d.e);
      return (Math.max(...xs) - Math.min(...xs)) / 2;
    };
    const peak = Math.max(...dev.map((d) => d.e));
    expect(peak).toBeLessThan(5); // overshoot below 100 % of the step
    // no sustained oscillation: the last 20 minutes stay within ±0.3 °C and swing less than early on
    expect(band(2400, 3600)).toBeLessThan(0.3);
    const late = dev.filter((d) => d.t >= 2400).map((d) => Math.abs(d.e));
    expect(Math.max(...late)).toBeLessThan(0.5);
    // what is left is noise-driven wander, far smaller than the relay's own oscillation
    expect(band(2400, 3600)).toBeLessThan(r.amplitudeC);
  }, 60_000);
});
