// The Bench worker's test runner (sim/worker/bench-tests.ts) on the Bench's own free-run drill:
// the noisy-sensor cabinet's relay test stops at the noise warning when asked to, aborts with the
// noise reason without a PV filter when started past it, and completes with a PV filter of about a
// quarter of the sensor lag (references §16, common practice); progress advances, the time budget
// is respected, and cancelling hands the loop back.
import { describe, expect, it } from "vitest";
import { BENCH_START_TUNING, benchDrill } from "@/components/bench/bench-drill";
import { findPreset } from "@/sim/plant/presets";
import { BenchSession } from "@/sim/worker/bench-session";
import { BenchTests } from "@/sim/worker/bench-tests";
import { traceFingerprint } from "@/sim/drill/trace-hash";

const PRESET = "relay-practice-noisy-cabinet";
const SEED = 20261201;
const sensorLagS = findPreset(PRESET)!.plant.sensorTimeConstantS;

/** The Bench's run on the noisy cabinet at 60 °C, in auto, one sample in (as after a load). */
function bench(pvFilterTauS: number) {
  const drill = benchDrill({ plant: { kind: "preset", presetId: PRESET }, title: "noisy", setpointC: 60, reference: BENCH_START_TUNING, seed: SEED });
  const session = new BenchSession(drill, { ...BENCH_START_TUNING, pvFilterTauS }, SEED);
  session.stepSamples(1);
  return session;
}

function runToEnd(t: BenchTests) {
  let guard = 0;
  while (t.active && guard++ < 1_000_000) t.advance(100);
  return t.outcome;
}

describe("BenchTests: relay test on the noisy-sensor cabinet", () => {
  const eps = 0.5; // above 3σ of the filtered PV (≈ 0.44 °C), below 3σ of the raw one (≈ 0.96 °C)

  it("with stopOnNoiseWarning it stops at the warning before the relay switches", () => {
    const s = bench(0);
    const t = new BenchTests(s);
    t.startRelay({ hysteresisC: eps, stopOnNoiseWarning: true });
    const o = runToEnd(t);
    expect(o?.test).toBe("relay");
    if (o?.test !== "relay" || o.outcome.ok) throw new Error("expected an abort");
    expect(o.outcome.code).toBe("noise-warning");
    expect(o.outcome.message).toMatch(/less than 3σ of the PV noise/);
    expect(o.outcome.progress.crossings).toBe(0); // the relay never switched
    expect(s.simulation.controllerState.mode).toBe("auto"); // handed back
  });

  it("without a PV filter, started past the warning, it aborts with the noise reason", () => {
    const s = bench(0);
    const t = new BenchTests(s);
    t.startRelay({ hysteresisC: eps, stopOnNoiseWarning: false });
    const o = runToEnd(t);
    if (o?.test !== "relay" || o.outcome.ok) throw new Error("expected an abort");
    expect(o.outcome.code).toBe("noise");
    expect(o.outcome.message).toMatch(/Add a PV filter.*widen the hysteresis/);
    expect(s.simulation.controllerState.mode).toBe("auto");
    expect(s.simulation.controllerConfig.kind).toBe("pid"); // the original tuning is back
  });

  it("with a PV filter of a quarter of the sensor lag it completes; progress fields advance", () => {
    const s = bench(sensorLagS / 4);
    const t = new BenchTests(s);
    t.startRelay({ hysteresisC: eps, stopOnNoiseWarning: true });
    const seen: { phase: string; crossings: number; halfPeriods: number; cycles: number }[] = [];
    let guard = 0;
    while (t.active && guard++ < 100_000) {
      t.advance(20);
      const p = t.progress;
      if (p?.test !== "relay") throw new Error("relay progress expected");
      seen.push({ phase: p.progress.phase, crossings: p.progress.crossings, halfPeriods: p.progress.halfPeriodsS.length, cycles: p.progress.cyclesMeasured });
    }
    const o = t.outcome;
    if (o?.test !== "relay" || !o.outcome.ok) throw new Error(`expected a result, got ${JSON.stringify(o?.outcome)}`);
    expect(o.outcome.ku).toBeGreaterThan(0);
    expect(o.outcome.puS).toBeGreaterThan(4 * sensorLagS);
    expect(o.base.pvFilterTauS).toBe(sensorLagS / 4);
    // progress: quiet first, then the relay; crossings and half-periods never go back and grow to the end
    expect(seen[0].phase).toBe("quiet");
    expect(seen.some((x) => x.phase === "relay")).toBe(true);
    for (let i = 1; i < seen.length; i++) {
      expect(seen[i].crossings).toBeGreaterThanOrEqual(seen[i - 1].crossings);
      expect(seen[i].halfPeriods).toBeGreaterThanOrEqual(seen[i - 1].halfPeriods);
    }
    expect(seen.at(-1)!.crossings).toBeGreaterThanOrEqual(2 * (o.outcome.settlingCyclesUsed + 3) + 1);
    expect(seen.at(-1)!.cycles).toBe(3);
    expect(t.takeOutcome()).toBe(o);
    expect(t.takeOutcome()).toBeNull(); // posted once
  });
});

describe("BenchTests: stepping, budget, progress pace, cancel", () => {
  it("advance() steps one sample per call of the test and stops at the outcome", () => {
    const s = bench(1);
    const t = new BenchTests(s);
    const k0 = s.simulation.sampleIndex;
    t.startRelay({ hysteresisC: 0.5 });
    expect(t.advance(10)).toBe(10);
    expect(s.simulation.sampleIndex).toBe(k0 + 10);
    runToEnd(t);
    expect(t.advance(10)).toBe(0);
  });

  it("runFor() stays within the budget of a fake clock", () => {
    const s = bench(1);
    const t = new BenchTests(s);
    t.startRelay({ hysteresisC: 0.5 });
    let clock = 0;
    const now = () => (clock += 1); // every look at the clock costs 1 ms
    // start at 1 ms; batches of 10 samples at 2, 3, 4, 5 ms; at 6 ms the 5 ms budget is spent
    expect(t.runFor(5, now, 10)).toBe(40);
  });

  it("takeProgress posts at most every 100 ms, and at once on a phase change", () => {
    const s = bench(1);
    const t = new BenchTests(s);
    t.startRelay({ hysteresisC: 0.5 });
    expect(t.takeProgress(0)).not.toBeNull();
    t.advance(1);
    expect(t.takeProgress(50)).toBeNull();
    expect(t.takeProgress(100)).not.toBeNull();
  });

  it("cancelling a relay test hands the loop back in auto at the operator's SP", () => {
    const s = bench(1);
    const t = new BenchTests(s);
    t.startRelay({ hysteresisC: 0.5 });
    t.advance(200);
    t.cancel();
    runToEnd(t);
    const o = t.outcome;
    if (o?.test !== "relay" || o.outcome.ok) throw new Error("expected an abort");
    expect(o.outcome.code).toBe("cancelled");
    expect(s.simulation.controllerState.mode).toBe("auto");
    expect(s.simulation.controllerState.sp).toBe(60);
  });

  it("cancelling a bump test hands the loop back at its starting OUT and mode", () => {
    const s = bench(1);
    const out0 = s.simulation.controllerState.out;
    const t = new BenchTests(s);
    t.startBump({ stepPercent: 10 });
    t.advance(400); // past the pre-step stretch (60 s = 120 samples)
    expect(s.simulation.controllerState.out).toBeCloseTo(out0 + 10, 6);
    t.cancel();
    expect(t.advance(10)).toBe(2);
    const o = t.outcome;
    if (o?.test !== "bump" || o.outcome.ok) throw new Error("expected a cancelled bump test");
    expect("cancelled" in o.outcome && o.outcome.cancelled).toBe(true);
    expect(s.simulation.controllerState.mode).toBe("auto");
    expect(t.progress?.progress.phase).toBe("returning");
  });

  it("a bump test from steady state identifies a model", () => {
    const s = bench(1);
    const t = new BenchTests(s);
    t.startBump({ stepPercent: 10 });
    const o = runToEnd(t);
    if (o?.test !== "bump" || !o.outcome.ok) throw new Error(`expected a model, got ${JSON.stringify(o?.outcome).slice(0, 300)}`);
    expect(o.outcome.identification.fopdt.quality.r2).toBeGreaterThan(0.95);
    expect(s.simulation.controllerState.mode).toBe("auto");
  });

  it("a test still running when the Bench run reaches its end is handed back and says why", () => {
    const s = bench(1);
    const sim = s.simulation;
    s.stepSamples(sim.lastSample - sim.sampleIndex - 50); // 25 s before the end of the run
    const t = new BenchTests(s);
    t.startRelay({ hysteresisC: 0.5 });
    runToEnd(t);
    const o = t.outcome;
    if (o?.test !== "relay" || o.outcome.ok) throw new Error("expected an abort");
    expect(o.outcome.code).toBe("cancelled");
    expect(o.outcome.message).toMatch(/the Bench run reached its end before the relay test finished/);
    expect(sim.controllerState.mode).toBe("auto");
  });

  it("a run with a relay test replays from its drill, seed and action log to the same trace (a saved run reopens with the test in it)", () => {
    const s = bench(1);
    const t = new BenchTests(s);
    t.startRelay({ hysteresisC: 0.5 });
    runToEnd(t);
    s.stepSamples(100);
    const sim = s.simulation;
    const drill = benchDrill({ plant: { kind: "preset", presetId: PRESET }, title: "noisy", setpointC: 60, reference: BENCH_START_TUNING, seed: SEED });
    const replay = new BenchSession(drill, { ...BENCH_START_TUNING, pvFilterTauS: 1 }, SEED, sim.actionLog);
    replay.stepSamples(sim.sampleIndex);
    expect(sim.actionLog.length).toBeGreaterThan(3); // manual, kick, on/off tuning, auto, hand-back
    expect(traceFingerprint(replay.simulation.trace())).toBe(traceFingerprint(sim.trace()));
  });
});
