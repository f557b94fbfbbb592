import { describe, expect, it } from "vitest";
import { pvFilterAlpha, PvFilter } from "../../../sim/control";
import { block } from "./helpers";

describe("PV filter (exact discretisation of a first-order lag)", () => {
  it("α = 1 − e^(−h/τ); 0 = off", () => {
    expect(pvFilterAlpha(2, 0.1)).toBeCloseTo(1 - Math.exp(-0.05), 15);
    expect(pvFilterAlpha(0, 0.1)).toBe(1);
  });

  it("a unit step gives 1 − e^(−t/τ) at every sample (analytic first-order step response)", () => {
    const f = new PvFilter(3, 0.1, 0);
    for (let k = 1; k <= 100; k++) expect(f.update(1)).toBeCloseTo(1 - Math.exp((-k * 0.1) / 3), 12);
  });

  it("the block filters PV before the PID: pvFiltered lags the measured PV", () => {
    const b = block({ kc: 1, ti: 0, pvFilterTauS: 1, sampleTimeS: 0.1 }, { out: 50, sp: 50, pv: 50 });
    b.update(50, false);
    b.update(60, false);
    expect(b.state.pvFiltered).toBeCloseTo(50 + 10 * (1 - Math.exp(-0.1)), 12);
  });
});
