import { describe, expect, it } from "vitest";
import { runDrill } from "@/sim/drill";
import { firstOrderPlant, makeDrill, QUIET_SENSOR } from "./drills";

// First-order plant K/(τs+1) under PI with setpoint weight b = 0 (P acts on −y only):
//   y/r = (K·Kc/(τ·Ti)) / (s² + s(1 + K·Kc)/τ + K·Kc/(τ·Ti))   — a pure 2nd-order loop, no zero.
// K = 1 °C/%, τ = 100 s, Kc = 1 %/°C, Ti = 25 s → ωn = 0.02 rad/s, ζ = 0.5.
// Ogata, Modern Control Engineering 5th ed. ch. 5 (references §9, formulas [CONFIRMED-2nd]): Mp = 100·exp(−ζπ/√(1−ζ²)) = 16.3034 %,
// tp = π/ωd = π/(ωn√(1−ζ²)) = 181.380 s. Sample time 0.05 s (Ts·ωn = 0.001), no noise;
// tolerance: Mp within 0.3 percentage points, tp within 1 s (the sampled PI adds ≈ Ts/2 of delay).
describe("first-order plant under PI with b = 0 (Ogata second-order step response)", () => {
  it("matches the analytic overshoot and peak time for ζ = 0.5", () => {
    const K = 1, tau = 100, kc = 1, ti = 25;
    const wn = Math.sqrt((K * kc) / (tau * ti));
    const zeta = (1 + K * kc) / (2 * tau * wn);
    expect(zeta).toBeCloseTo(0.5, 12);
    const mp = 100 * Math.exp((-zeta * Math.PI) / Math.sqrt(1 - zeta * zeta));
    const tp = Math.PI / (wn * Math.sqrt(1 - zeta * zeta));
    expect(mp).toBeCloseTo(16.3034, 3); // references §9 table
    const stepAt = 10;
    const drill = makeDrill({
      durationS: 1200,
      plant: firstOrderPlant(K, tau),
      initialState: { temperatures: { kind: "steady", outPercent: 50 }, mode: "auto", setpointC: 50, outPercent: 50 },
      events: [{ type: "setpoint", timeS: stepAt, setpointC: 55 }],
      referenceTuning: { kind: "pid", kc, ti, td: 0, setpointWeightB: 0, sampleTimeS: 0.05, antiWindup: "none", outMinPct: -100, outMaxPct: 200 },
      sensor: QUIET_SENSOR,
      drive: { kind: "continuous" },
      cutout: { enabled: false, tripPointC: 500 },
    });
    const run = runDrill(drill);
    const tr = run.trace;
    let peak = -Infinity, tPeak = 0;
    for (let i = 0; i < tr.length; i++) if (tr.trueC[i] > peak) { peak = tr.trueC[i]; tPeak = tr.timeS[i]; }
    const overshootPct = ((peak - 55) / 5) * 100;
    expect(Math.abs(overshootPct - mp)).toBeLessThan(0.3);
    expect(Math.abs(tPeak - stepAt - tp)).toBeLessThan(1);
  });
});
