import { describe, expect, it } from "vitest";
import { runDrill, type StampedAction } from "@/sim/drill";
import { firstOrderPlant, makeDrill, QUIET_SENSOR } from "./drills";

describe("bumpless transfer through the runner (Åström & Hägglund 1995, integrator tracking; section from memory)", () => {
  it("|ΔOUT| stays small over the samples after manual → auto and auto → manual", () => {
    const drill = makeDrill({
      durationS: 900,
      initialState: { temperatures: { kind: "steady", outPercent: 25 }, mode: "manual", setpointC: 62, outPercent: 25 },
      referenceTuning: { kind: "pid", kc: 6, ti: 400, sampleTimeS: 0.5 },
      sensor: QUIET_SENSOR,
    });
    const k1 = 200, k2 = 1200;
    const actions: StampedAction[] = [{ sample: k1, type: "mode", mode: "auto" }, { sample: k2, type: "mode", mode: "manual" }];
    const out = runDrill(drill, null, actions).trace.outPercent;
    // without bumpless transfer the P term alone would jump Kc·(SP − PV) ≈ 6·2.7 = 16 %
    const N = 20;
    for (let k = k1; k < k1 + N; k++) expect(Math.abs(out[k] - out[k - 1])).toBeLessThan(0.5);
    for (let k = k2; k < k2 + N; k++) expect(Math.abs(out[k] - out[k - 1])).toBeLessThan(1e-9);
  });
});

describe("integral windup (references §13 back-calculation [CONFIRMED-2nd]; common practice)", () => {
  it("is visible without anti-windup and bounded with back-calculation", () => {
    const mk = (antiWindup: "none" | "back-calculation") =>
      makeDrill({
        durationS: 3000,
        plant: firstOrderPlant(0.5, 300, 20),
        initialState: { temperatures: { kind: "steady", outPercent: 50 }, mode: "auto", setpointC: 50, outPercent: 50 },
        events: [{ type: "setpoint", timeS: 10, setpointC: 70 }],
        referenceTuning: { kind: "pid", kc: 4, ti: 120, sampleTimeS: 0.5, antiWindup },
        sensor: QUIET_SENSOR,
        drive: { kind: "continuous" },
        cutout: { enabled: false, tripPointC: 500 },
      });
    const peak = (d: ReturnType<typeof mk>) => {
      const r = runDrill(d);
      let p = -Infinity;
      let satSamples = 0;
      for (let k = 0; k < r.trace.length; k++) {
        p = Math.max(p, r.trace.trueC[k]);
        if (r.trace.outPercent[k] >= 100) satSamples++;
      }
      return { overshoot: p - 70, satSamples };
    };
    const wound = peak(mk("none"));
    const guarded = peak(mk("back-calculation"));
    expect(wound.satSamples).toBeGreaterThan(guarded.satSamples);
    expect(wound.overshoot).toBeGreaterThan(3 * Math.max(guarded.overshoot, 0.5));
    expect(guarded.overshoot).toBeLessThan(3);
  });
});

describe("on/off control (common practice)", () => {
  it("switches at the edges of its hysteresis band and keeps cycling", () => {
    const h = 2;
    const drill = makeDrill({
      durationS: 3600,
      initialState: { temperatures: { kind: "steady", outPercent: 25 }, mode: "auto", setpointC: 70, outPercent: 0 },
      referenceTuning: { kind: "onoff", hysteresisC: h, sampleTimeS: 0.5 },
      sensor: QUIET_SENSOR,
      drive: { kind: "continuous" },
    });
    const tr = runDrill(drill).trace;
    let switches = 0;
    for (let k = 1; k < tr.length; k++) {
      if (tr.outPercent[k] === tr.outPercent[k - 1]) continue;
      switches++;
      const pv = tr.pvFilteredC[k];
      const prev = tr.pvFilteredC[k - 1];
      if (tr.outPercent[k] > tr.outPercent[k - 1]) {
        expect(pv).toBeLessThan(70 - h / 2); // on below the band
        expect(prev).toBeGreaterThanOrEqual(70 - h / 2 - 1e-9); // … at its first sample beyond it
      } else {
        expect(pv).toBeGreaterThan(70 + h / 2);
        expect(prev).toBeLessThanOrEqual(70 + h / 2 + 1e-9);
      }
    }
    expect(switches).toBeGreaterThanOrEqual(6);
    // after the first switch the PV never leaves the band by more than the lags' overshoot
    const first = tr.outPercent.findIndex((o, i) => i > 0 && o !== tr.outPercent[i - 1]);
    let lo = Infinity, hi = -Infinity;
    for (let k = first; k < tr.length; k++) { lo = Math.min(lo, tr.pvFilteredC[k]); hi = Math.max(hi, tr.pvFilteredC[k]); }
    expect(hi - lo).toBeGreaterThan(h); // lag-upon-lag: the swing exceeds the band
    expect(hi - lo).toBeLessThan(6 * h);
  });
});
