import { describe, expect, it } from "vitest";
import { disturbanceMetrics, heaterEnergyKWh, outputTravel, timeAbove } from "../../../sim/results";
import { constant, sampled } from "./analytic";

describe("disturbance: peak deviation and recovery into the band", () => {
  it("for a deviation A·s·e^(−s/τ) after the event: peak A·τ/e at s = τ, recovery where it falls below the band", () => {
    const A = 2;
    const tau = 30;
    const t0 = 100;
    const h = 0.05;
    const n = Math.round(600 / h) + 1;
    const dev = (tt: number) => (tt < t0 ? 0 : -A * (tt - t0) * Math.exp(-(tt - t0) / tau)); // a cold load: PV dips
    const { t, y } = sampled(n, h, (tt) => 70 + dev(tt));
    const sp = constant(n, 70);
    const band = 0.5;
    const first = Math.round(t0 / h);
    const m = disturbanceMetrics(t, y, sp, first, n - 1, t0, band);
    expect(m.peakDeviationC).toBeCloseTo((-A * tau) / Math.E, 4);
    expect(m.peakDeviationTimeS!).toBeCloseTo(tau, 1);
    // Independent root by bisection of A·s·e^(−s/τ) = band for s > τ.
    let lo = tau;
    let hi = 600;
    for (let k = 0; k < 100; k++) {
      const mid = (lo + hi) / 2;
      if (A * mid * Math.exp(-mid / tau) > band) lo = mid;
      else hi = mid;
    }
    expect(m.recoveryTimeS!).toBeCloseTo(lo, 3);
  });

  it("never leaving the band gives recovery 0; ending outside gives null", () => {
    const { t, y } = sampled(101, 1, () => 70.1);
    const sp = constant(101, 70);
    expect(disturbanceMetrics(t, y, sp, 0, 100, 0, 0.5).recoveryTimeS).toBe(0);
    expect(disturbanceMetrics(t, y, sp, 0, 100, 0, 0.05).recoveryTimeS).toBeNull();
  });
});

describe("effort measures", () => {
  it("output travel Σ|ΔOUT|", () => {
    const out = Float64Array.from([10, 20, 15, 15, 40, 0]);
    expect(outputTravel(out, 0, 5)).toBe(10 + 5 + 0 + 25 + 40);
    expect(outputTravel(out, 2, 4)).toBe(25);
  });

  it("heater energy: 1 kW for one hour is 1 kWh (rectangle rule on per-interval mean power)", () => {
    const { t } = sampled(3601, 1, () => 0);
    const p = constant(3601, 1000);
    expect(heaterEnergyKWh(t, p, 0, 3600)).toBeCloseTo(1, 12);
    // The last sample's power belongs to the interval after the window: it is not counted.
    const spike = constant(3601, 1000);
    spike[3600] = 1e9;
    expect(heaterEnergyKWh(t, spike, 0, 3600)).toBeCloseTo(1, 12);
    // Uneven sampling: 2 kW for 0.5 s steps and 0 W for 1.5 s steps → 25 % duty of 2 kW for 1 h = 0.5 kWh.
    const tt: number[] = [];
    const pw: number[] = [];
    for (let k = 0, time = 0; time < 3600; k++) {
      tt.push(time);
      pw.push(k % 2 === 0 ? 2000 : 0);
      time += k % 2 === 0 ? 0.5 : 1.5;
    }
    tt.push(3600);
    pw.push(0);
    expect(heaterEnergyKWh(tt, pw, 0, tt.length - 1)).toBeCloseTo(0.5, 12);
  });

  it("time above a cutout point with interpolated crossings: a triangle 0→10→0 over 20 s is above 5 for 10 s", () => {
    const { t, y } = sampled(21, 1, (tt) => (tt <= 10 ? tt : 20 - tt));
    expect(timeAbove(t, y, 5, 0, 20)).toBeCloseTo(10, 12);
    expect(timeAbove(t, y, 5.5, 0, 20)).toBeCloseTo(9, 12);
    expect(timeAbove(t, y, 11, 0, 20)).toBe(0);
  });
});
