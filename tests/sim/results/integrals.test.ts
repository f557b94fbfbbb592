import { describe, expect, it } from "vitest";
import { errorIntegrals } from "../../../sim/results";
import { constant, sampled } from "./analytic";

describe("IAE, ISE, ITAE (trapezoid rule)", () => {
  it("for an exponential error e = E·e^(−t/τ) they equal the analytic integrals", () => {
    const E = 4;
    const tau = 7;
    const T = 60;
    const h = 0.01;
    const n = Math.round(T / h) + 1;
    const { t, y } = sampled(n, h, (tt) => 50 - E * Math.exp(-tt / tau));
    const sp = constant(n, 50);
    const r = errorIntegrals(t, y, sp, 0, n - 1, 0);
    const q = Math.exp(-T / tau);
    expect(r.iae).toBeCloseTo(E * tau * (1 - q), 4); // ∫E e^(−t/τ) = Eτ(1 − e^(−T/τ))
    expect(r.ise).toBeCloseTo(((E * E * tau) / 2) * (1 - q * q), 3);
    expect(r.itae).toBeCloseTo(E * tau * tau * (1 - q * (1 + T / tau)), 3); // ∫t E e^(−t/τ)
  });

  it("time in ITAE counts from the window start, not from t = 0 of the run", () => {
    const n = 2001;
    const { t } = sampled(n, 0.01, () => 0);
    const y = constant(n, 49); // constant error 1
    const sp = constant(n, 50);
    // Window 10…20 s: ∫(t − 10)·1 dt over 10 s = 50.
    const first = 1000;
    const last = 2000;
    const r = errorIntegrals(t, y, sp, first, last, 10);
    expect(r.iae).toBeCloseTo(10, 9);
    expect(r.ise).toBeCloseTo(10, 9);
    expect(r.itae).toBeCloseTo(50, 9);
  });
});
