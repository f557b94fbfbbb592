import { describe, expect, it } from "vitest";
import { block, cfg, firstOrderPlant } from "./helpers";

/** Run a block in closed loop with a first-order plant; returns the OUT history. */
function loop(b: ReturnType<typeof block>, plant: ReturnType<typeof firstOrderPlant>, n: number, onSample?: (k: number) => void) {
  const outs: number[] = [];
  for (let k = 0; k < n; k++) {
    onSample?.(k);
    const u = b.update(plant.y, false);
    outs.push(u);
    plant.step(u);
  }
  return outs;
}

describe("bumpless transfer (Åström & Hägglund 1995, ch. 3: integrator tracking)", () => {
  it("manual → auto: OUT continues from the manual value although SP ≠ PV", () => {
    const plant = firstOrderPlant(0.8, 60, 0.1, 20);
    const b = block({ kc: 3, ti: 40, td: 5, sampleTimeS: 0.1 }, { out: 0, mode: "manual", sp: 70, pv: 20 });
    b.setManualOutput(35);
    loop(b, plant, 300);
    expect(b.state.out).toBe(35);
    const before = b.state.out;
    b.setMode("auto");
    const outs = loop(b, plant, 20);
    // First sample: exactly the manual OUT (I absorbs P + D); then only the integral's slope.
    expect(Math.abs(outs[0] - before)).toBeLessThan(1e-9);
    // Over the next 20 samples OUT moves at most by Kc/Ti·|e|·t plus P for the PV change: bounded, small.
    const e = 70 - plant.y;
    for (let k = 1; k < 20; k++) expect(Math.abs(outs[k] - outs[k - 1])).toBeLessThan(((3 * 0.1) / 40) * e + 0.05);
  });

  it("auto → manual: OUT holds its last automatic value until the operator moves it", () => {
    const plant = firstOrderPlant(0.8, 60, 0.1, 20);
    const b = block({ kc: 3, ti: 40, sampleTimeS: 0.1 }, { out: 10, sp: 50, pv: 20 });
    loop(b, plant, 200);
    const last = b.state.out;
    b.setMode("manual");
    const outs = loop(b, plant, 10);
    for (const u of outs) expect(u).toBe(last);
    b.setManualOutput(12);
    expect(loop(b, plant, 1)[0]).toBe(12);
    b.setManualOutput(250);
    expect(loop(b, plant, 1)[0]).toBe(100); // clamped to outMaxPct
  });

  it("retune is bumpless: tripling Kc and halving Ti mid-transient does not jump OUT", () => {
    const plant = firstOrderPlant(0.8, 60, 0.1, 20);
    const b = block({ kc: 1, ti: 80, sampleTimeS: 0.1 }, { out: 0, sp: 45, pv: 20 });
    loop(b, plant, 150);
    const before = b.state.out;
    b.retune(cfg({ kc: 3, ti: 40, sampleTimeS: 0.1 }));
    const after = loop(b, plant, 1)[0];
    expect(Math.abs(after - before)).toBeLessThan(0.05);
    // Without re-initialisation the P change alone would have been (3 − 1)·e ≈ large:
    expect(2 * (45 - plant.y)).toBeGreaterThan(5);
  });

  it("spTrackInManual: in manual SP follows the filtered PV, so returning to auto has no error to act on", () => {
    const b = block({ kc: 2, ti: 30, spTrackInManual: true, pvFilterTauS: 0 }, { out: 20, mode: "manual", sp: 80, pv: 40 });
    b.update(41, false);
    expect(b.state.sp).toBe(41);
    b.update(43.5, false);
    expect(b.state.sp).toBe(43.5);
    b.setMode("auto");
    const u1 = b.update(43.5, false);
    const u2 = b.update(43.5, false);
    expect(u1).toBeCloseTo(20, 12);
    expect(u2).toBeCloseTo(20, 12);
  });
});

describe("integral windup (Åström & Hägglund 1995, ch. 3)", () => {
  function saturate(antiWindup: "none" | "back-calculation" | "conditional") {
    // Heater far too small: SP unreachable, OUT pinned at 100 % for 300 s.
    const b = block({ kc: 2, ti: 20, td: 0, sampleTimeS: 0.1, antiWindup }, { out: 0, sp: 100, pv: 20 });
    for (let k = 0; k < 3000; k++) b.update(20 + k * 1e-4, false);
    return b;
  }

  it("with 'none' the integral grows without bound while OUT sits at its limit", () => {
    const b = saturate("none");
    expect(b.state.out).toBe(100);
    // ∫ Kc/Ti·e dt ≈ 2/20 · 80 · 300 = 2400 %
    expect(b.state.i).toBeGreaterThan(2000);
  });

  it("with back-calculation or conditional integration the integral stays bounded near OUTmax − P", () => {
    for (const aw of ["back-calculation", "conditional"] as const) {
      const b = saturate(aw);
      expect(b.state.out).toBe(100);
      const pTerm = b.state.p;
      // back-calculation settles where Kc/Ti·e = (1/Tt)(v − u): v − 100 = Tt·Kc·e/Ti = 20·2·80/20 = 160.
      expect(b.state.i).toBeLessThan(100 - pTerm + 170);
      expect(b.state.i).toBeGreaterThan(-1000);
    }
  });

  it("the wound-up integral delays recovery: after the SP drops to PV, OUT stays at 100 % far longer with 'none'", () => {
    const samplesAtMax = (aw: "none" | "back-calculation" | "conditional") => {
      const b = saturate(aw);
      b.setSetpoint(20.3);
      let n = 0;
      for (let k = 0; k < 5000 && b.update(20.3, false) >= 100; k++) n++;
      return n;
    };
    expect(samplesAtMax("none")).toBeGreaterThan(1000);
    expect(samplesAtMax("back-calculation")).toBeLessThan(100);
    expect(samplesAtMax("conditional")).toBeLessThan(100);
  });
});

describe("output limits, rate limit, deadband", () => {
  it("OUT stays within [outMin, outMax] and moves at most outRateLimit·h per sample in auto", () => {
    const b = block({ kc: 8, ti: 10, td: 4, outMinPct: 5, outMaxPct: 85, outRateLimitPctPerS: 2, sampleTimeS: 0.5 }, { out: 40, sp: 50, pv: 50 });
    let prev = 40;
    let maxStep = 0;
    for (let k = 0; k < 2000; k++) {
      const pv = 50 + 10 * Math.sin(k / 15) + ((k * 7919) % 13) / 4; // rough, large swings
      const u = b.update(pv, false);
      expect(u).toBeGreaterThanOrEqual(5);
      expect(u).toBeLessThanOrEqual(85);
      maxStep = Math.max(maxStep, Math.abs(u - prev));
      prev = u;
    }
    expect(maxStep).toBeLessThanOrEqual(2 * 0.5 + 1e-12);
    expect(maxStep).toBeGreaterThan(0.99); // the limit is actually reached
  });

  it("inside the error deadband OUT stops changing; outside it acts on the error beyond the band", () => {
    const b = block({ kc: 2, ti: 20, deadbandC: 0.5, sampleTimeS: 0.1 }, { out: 30, sp: 60, pv: 60 });
    b.update(60.3, false);
    const held = b.update(60.3, false);
    for (let k = 0; k < 100; k++) expect(b.update(60.3 - 0.6 * (k % 2) * 0.5, false)).toBeCloseTo(held, 12);
    // 1.5 °C low: effective error 1.0, integral slope Kc·1.0/Ti = 0.1 %/s.
    const a = b.update(58.5, false);
    for (let k = 0; k < 99; k++) b.update(58.5, false);
    const c = b.update(58.5, false);
    expect((c - a) / 10).toBeCloseTo(0.1, 10);
    expect(a - held).toBeCloseTo(2 * 1.0, 10); // P on the effective error, continuous at the band edge
  });
});

describe("bad PV (NAMUR NE 43 failure level reported by the sensor chain)", () => {
  it("'hold' keeps the last OUT, sets pvBad, and resumes bumplessly", () => {
    const b = block({ kc: 2, ti: 30, td: 2, badPvPolicy: "hold" }, { out: 20, sp: 60, pv: 55 });
    for (let k = 0; k < 50; k++) b.update(55, false);
    const last = b.state.out;
    for (let k = 0; k < 30; k++) {
      expect(b.update(-2.5, true)).toBe(last); // garbage PV ignored
      expect(b.state.pvBad).toBe(true);
    }
    expect(b.state.pvFiltered).toBe(55);
    const resumed = b.update(57, false);
    expect(b.state.pvBad).toBe(false);
    expect(Math.abs(resumed - last)).toBeLessThan(1e-9);
  });

  it("'safe-output' goes to the safe output at once and resumes bumplessly from it", () => {
    const b = block({ kc: 2, ti: 30, badPvPolicy: "safe-output", safeOutputPct: 0, outRateLimitPctPerS: 1 }, { out: 60, sp: 60, pv: 55 });
    b.update(55, false);
    expect(b.update(0, true)).toBe(0);
    expect(b.update(0, true)).toBe(0);
    const resumed = b.update(55, false);
    expect(Math.abs(resumed - 0)).toBeLessThan(1e-9);
  });

  it("manual is not overridden by a bad PV", () => {
    const b = block({ badPvPolicy: "safe-output", safeOutputPct: 0 }, { out: 42, mode: "manual", sp: 60, pv: 55 });
    expect(b.update(0, true)).toBe(42);
    expect(b.state.pvBad).toBe(true);
  });
});

describe("closed loop: PI with b = 0 on a first-order plant is a second-order system (Ogata ch. 5)", () => {
  it("overshoot and peak time match Mp = 16.3 %, tp = π/ωd for ζ = 0.5, ωn = 0.5 rad/s", () => {
    // Plant K/(τs+1), u = −Kc·y + (Kc/Ti)∫(r − y): Y/R = KKc/(τTi s² + Ti(1 + KKc)s + KKc), no zero.
    // K = 1, τ = 10, Kc = 4 → 2ζωn = (1 + KKc)/τ = 0.5; Ti = KKc/(τωn²) = 1.6 s → ωn = 0.5, ζ = 0.5.
    const h = 0.005;
    const plant = firstOrderPlant(1, 10, h, 0);
    const b = block({ kc: 4, ti: 1.6, setpointWeightB: 0, sampleTimeS: h, outMinPct: -1e4, outMaxPct: 1e4 }, { out: 0, sp: 0, pv: 0 });
    b.setSetpoint(1);
    let peak = 0;
    let tPeak = 0;
    for (let k = 0; k < 40 / h; k++) {
      // y at sample k corresponds to time k·h; the control acts from t = 0.
      if (plant.y > peak) {
        peak = plant.y;
        tPeak = k * h;
      }
      plant.step(b.update(plant.y, false));
    }
    const mp = 100 * (peak - 1);
    expect(Math.abs(mp - 16.3034)).toBeLessThan(0.15); // Ogata Mp = 100·exp(−ζπ/√(1−ζ²)); references §9
    const tp = Math.PI / (0.5 * Math.sqrt(1 - 0.25)); // 7.2552 s
    expect(Math.abs(tPeak - tp)).toBeLessThan(0.05);
  });
});

describe("anti-windup equilibria (derived from the discrete law, A&H 1995, ch. 3)", () => {
  it("back-calculation settles where (Kc h/Ti)e = (h/Tt)(v − u): I → OUTmax − Kc·e + Kc·e·Tt/Ti", () => {
    // PI, Kc = 2, Ti = Tt = 20 s, e = 80 °C: v − u = Kc·e·Tt/Ti = 160, P = 160, so I → 100 + 160 − 160 = 100.
    const b = block({ kc: 2, ti: 20, sampleTimeS: 0.1, antiWindup: "back-calculation" }, { out: 0, sp: 100, pv: 20 });
    for (let k = 0; k < 6000; k++) b.update(20, false);
    expect(b.state.out).toBe(100);
    expect(b.state.p).toBeCloseTo(160, 12);
    expect(b.state.i).toBeCloseTo(100, 3);
  });

  it("conditional integration freezes the integral while the output is limited and the error pushes further", () => {
    // b = 0 so P = −Kc·PV carries no SP: with SP 100 and PV 20, P = −20 and I starts at 120 (OUT 100).
    const b = block({ kc: 1, ti: 20, setpointWeightB: 0, sampleTimeS: 0.1, antiWindup: "conditional" }, { out: 100, sp: 100, pv: 20 });
    b.update(20, false); // v = 100 = OUTmax: not yet limited, integrates once (+Kc·h/Ti·e = 0.005·80 = 0.4)
    b.update(20, false); // now v > OUTmax: frozen from here on
    const frozen = b.state.i;
    expect(frozen).toBeCloseTo(120.4, 12);
    for (let k = 0; k < 500; k++) b.update(20, false);
    expect(b.state.i).toBe(frozen);
    expect(b.state.out).toBe(100);
    // SP below PV while OUT is still limited high: this error drives OUT out of the limit, so it integrates.
    b.setSetpoint(10);
    const a = b.state.i;
    b.update(20, false);
    b.update(20, false);
    expect(b.state.i - a).toBeCloseTo(((1 * 0.1) / 20) * -10, 12);
  });
});

describe("mode and retune details", () => {
  it("setManualOutput is ignored in auto", () => {
    const b = block({ kc: 1, ti: 0 }, { out: 30, sp: 50, pv: 50 });
    b.update(50, false);
    b.setManualOutput(80);
    expect(b.update(50, false)).toBeCloseTo(30, 12);
  });

  it("retune to a new sample time changes the integral slope per sample (Kc·h/Ti)", () => {
    const b = block({ kc: 2, ti: 10, sampleTimeS: 0.1, outMaxPct: 1000 }, { out: 0, sp: 51, pv: 50 });
    b.update(50, false);
    b.retune(cfg({ kc: 2, ti: 10, sampleTimeS: 1, outMaxPct: 1000 }));
    const u0 = b.update(50, false);
    const u1 = b.update(50, false);
    expect(u1 - u0).toBeCloseTo(0.2, 12); // 2·1/10·1
  });

  it("retune PID → on/off → PID keeps OUT continuous where it can", () => {
    const b = block({ kc: 2, ti: 30 }, { out: 70, sp: 60, pv: 60 });
    b.update(60, false);
    b.retune(cfg({ kind: "onoff", hysteresisC: 2 }));
    expect(b.update(60, false)).toBe(100); // inside the band: keeps the state implied by 70 % (on)
    expect(b.update(62, false)).toBe(0);
    b.retune(cfg({ kc: 2, ti: 30 }));
    expect(b.update(62, false)).toBeCloseTo(0, 12); // bumpless from 0 %
    expect(b.state.p).toBeCloseTo(-4, 12);
  });

  it("the block is deterministic: the same PV sequence gives bit-identical OUT", () => {
    const run = () => {
      const b = block({ kc: 3, ti: 45, td: 8, pvFilterTauS: 1.5, outRateLimitPctPerS: 4 }, { out: 10, sp: 70, pv: 40 });
      const outs: number[] = [];
      for (let k = 0; k < 500; k++) outs.push(b.update(40 + 0.05 * k + 0.2 * Math.sin(k), false));
      return outs;
    };
    expect(run()).toEqual(run());
  });
});
