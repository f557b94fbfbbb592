// Window feedback (sim/drill/feedback.ts). Sources: the verdict bands and the reference's 50 are
// the score's own definition (sim/drill/score.ts); the hints are the trade's rules of thumb for
// PID tuning (common practice); the FOPDT test plant's reference tuning is the SIMC rule
// (Skogestad 2003: Kc = τ/(K(θ+τc)), Ti = min(τ, 4(θ+τc)), τc = θ → Kc 2.5, Ti 100 s).
import { describe, expect, it } from "vitest";
import { drillSchema, feedbackFromRuns, HINTS, runDrill, scoreAttempt, verdictOf, windowFeedback, type RunResults } from "@/sim/drill";

const fopdtDrill = drillSchema.parse({
  formatVersion: 1,
  id: "fopdt-feedback",
  title: "FOPDT step and cold ambient",
  plant: { kind: "transfer-function", gainCPerPercent: 1, timeConstantsS: [100], deadTimeS: 20, operatingPoint: { outPercent: 0, temperatureC: 20 }, ambientC: 20 },
  initialState: { temperatures: { kind: "steady", outPercent: 30 }, setpointC: 50, outPercent: 30 },
  events: [{ type: "setpoint", timeS: 100, setpointC: 60 }, { type: "ambient", timeS: 1200, temperatureC: 15 }],
  scoring: { windows: [{ id: "step", label: "50 → 60 °C", kind: "setpoint", startS: 100, endS: 1200 }, { id: "cold", kind: "disturbance", startS: 1200, endS: 2400 }] },
  referenceTuning: { kind: "pid", form: "standard", kc: 2.5, ti: 100, td: 0, sampleTimeS: 1 },
  drive: { kind: "continuous" },
  cutout: { enabled: true, tripPointC: 150, sensorTimeConstantS: 10, resetMarginC: 5 },
  durationS: 2400,
});
const ref = runDrill(fopdtDrill).results;
function feedbackFor(tuning: Record<string, number>) {
  const a = runDrill(fopdtDrill, { ...fopdtDrill.referenceTuning, ...tuning }).results;
  const s = scoreAttempt(fopdtDrill, a, ref);
  return windowFeedback(fopdtDrill, a, ref, s);
}

describe("windowFeedback", () => {
  it("the reference tuning itself: score 50 and verdict close in every window (score.ts definition)", () => {
    const s = scoreAttempt(fopdtDrill, ref, ref);
    const f = windowFeedback(fopdtDrill, ref, ref, s);
    expect(f.map((w) => w.windowId)).toEqual(["step", "cold"]);
    for (const w of f) {
      expect(w.score).toBe(50);
      expect(w.verdict).toBe("close");
      expect(w.measured).toEqual(w.reference);
      expect(w.finding).toMatch(/^On a par with the reference/);
    }
    expect(f[0].label).toBe("50 → 60 °C");
    expect(f[1].label).toBe("cold"); // label defaults to the id
  });

  it("verdict bands: better ≥ 55, close 45–55, worse < 45 (around the reference's 50, score.ts)", () => {
    expect(verdictOf(55)).toBe("better");
    expect(verdictOf(54.99)).toBe("close");
    expect(verdictOf(45)).toBe("close");
    expect(verdictOf(44.99)).toBe("worse");
  });

  it("a higher gain overshoots: worse, an overshoot finding with numbers and units, the smaller-gain hint (common practice)", () => {
    const [step] = feedbackFor({ kc: 3.5 });
    expect(step.verdict).toBe("worse");
    expect(step.measured.peak).toBeGreaterThan(2 * step.reference.peak);
    expect(step.finding).toMatch(/^Overshoot \d+\.\d °C against the reference's \d+\.\d °C\.$/);
    expect(step.hint).toBe(HINTS.overshoot);
    expect(step.hint).toMatch(/smaller gain/);
  });

  it("a gain near the ultimate gain: overshoot and long settling → close to oscillating (common practice)", () => {
    const [step] = feedbackFor({ kc: 6 });
    expect(step.verdict).toBe("worse");
    expect(step.finding).toMatch(/^Overshoot/);
    expect(step.hint).toBe(HINTS.oscillating);
  });

  it("a sluggish tuning: no overshoot, slow → larger gain or shorter Ti; slow disturbance rejection (common practice)", () => {
    const [step, cold] = feedbackFor({ kc: 0.8, ti: 300 });
    expect(step.verdict).toBe("worse");
    expect(step.measured.peak).toBeLessThan(step.reference.peak);
    expect(step.hint).toBe(HINTS.sluggish);
    expect(cold.verdict).toBe("worse");
    expect([HINTS.disturbancePeak, HINTS.recovery]).toContain(cold.hint);
    const [, coldSlow] = feedbackFor({ kc: 1.5 });
    expect(coldSlow.hint).toBe(HINTS.recovery);
  });

  it("a window clearly better than the reference gets 'well done' naming what is better", () => {
    const [, cold] = feedbackFor({ kc: 4 });
    expect(cold.verdict).toBe("better");
    expect(cold.hint).toMatch(/^well done: .* than the reference$/);
    expect(cold.finding).toMatch(/^Better than the reference/);
  });

  it("ratios and window score are the score's own (score.ts)", () => {
    const a = runDrill(fopdtDrill, { ...fopdtDrill.referenceTuning, kc: 3.5 }).results;
    const s = scoreAttempt(fopdtDrill, a, ref);
    const f = windowFeedback(fopdtDrill, a, ref, s);
    f.forEach((w, i) => {
      expect(w.score).toBe(s.windows[i].score);
      expect(w.ratios).toEqual(s.windows[i].ratios);
    });
  });

  it("a cutout trip in the window gives the safety message first (common practice: safety before tuning)", () => {
    const tripped: RunResults = { ...ref, safetyTrips: [{ timeS: 1500, cause: "over-temperature", sensorC: 151 }] as RunResults["safetyTrips"] };
    const f = windowFeedback(fopdtDrill, tripped, ref, scoreAttempt(fopdtDrill, tripped, ref));
    expect(f[1].hint).toBe(HINTS.trip);
    expect(f[1].finding).toMatch(/cutout tripped/);
    expect(f[0].hint).not.toBe(HINTS.trip); // 1500 s is after the step window
  });

  it("an OUT that travels far more than the reference's reads as noise → filter hint (common practice)", () => {
    const noisy: RunResults = {
      ...ref,
      windows: ref.windows.map((w) => ({ ...w, trueTemperature: { ...w.trueTemperature, outputTravelPct: w.trueTemperature.outputTravelPct * 10 + 100 } })),
    };
    const f = windowFeedback(fopdtDrill, noisy, ref, scoreAttempt(fopdtDrill, noisy, ref));
    for (const w of f) {
      expect(w.hint).toBe(HINTS.noisy);
      expect(w.finding).toMatch(/output moved \d+ % in total against the reference's \d+ %/);
    }
  });

  it("feedbackFromRuns runs attempt and reference on the same seed (convenience)", () => {
    const r = feedbackFromRuns(fopdtDrill, { ...fopdtDrill.referenceTuning, kc: 3.5 });
    expect(r.feedback).toEqual(feedbackFor({ kc: 3.5 }));
  });
});
