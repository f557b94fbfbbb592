import { describe, expect, it } from "vitest";
import { OnOffSwitch } from "../../../sim/control";
import { block, firstOrderPlant } from "./helpers";

describe("on/off control (band centred on SP: on below SP − H/2, off above SP + H/2; common practice)", () => {
  it("switches exactly at SP ± hysteresis/2 and holds in between", () => {
    const b = block({ kind: "onoff", hysteresisC: 2, outOnPct: 100, outOffPct: 0 }, { out: 0, sp: 50, pv: 50 });
    const seq: [number, number][] = [
      [50, 0],
      [49.1, 0], // inside the band: stays off
      [48.9, 100], // below 49: on
      [50.5, 100], // inside: stays on
      [51.0, 100], // at the edge: not yet
      [51.01, 0], // above 51: off
      [49.5, 0],
    ];
    for (const [pv, want] of seq) expect(b.update(pv, false)).toBe(want);
    expect(b.state.p).toBe(0);
  });

  it("direct action mirrors it, and outputs respect the limits", () => {
    const b = block({ kind: "onoff", action: "direct", hysteresisC: 1, outOnPct: 100, outOffPct: 0, outMaxPct: 80 }, { out: 0, sp: 10, pv: 10 });
    expect(b.update(10.6, false)).toBe(80);
    expect(b.update(9.6, false)).toBe(80);
    expect(b.update(9.4, false)).toBe(0);
  });

  it("in closed loop on a first-order plant the PV cycles within the hysteresis band plus the overshoot of one sample", () => {
    const plant = firstOrderPlant(1, 20, 0.1, 30); // 100 % → 100 °C steady state
    const b = block({ kind: "onoff", hysteresisC: 2 }, { out: 0, sp: 60, pv: 30 });
    let lo = Infinity;
    let hi = -Infinity;
    let switches = 0;
    let prev = 0;
    for (let k = 0; k < 6000; k++) {
      const u = b.update(plant.y, false);
      if (u !== prev) switches++;
      prev = u;
      plant.step(u);
      if (k > 1000) {
        lo = Math.min(lo, plant.y);
        hi = Math.max(hi, plant.y);
      }
    }
    // Per sample the PV moves at most (1 − e^(−h/τ))·|K·u − y| ≈ 0.005·70 = 0.35 °C beyond the switch point.
    expect(lo).toBeGreaterThan(59 - 0.4);
    expect(hi).toBeLessThan(61 + 0.4);
    expect(hi - lo).toBeGreaterThan(1.9);
    expect(switches).toBeGreaterThan(20);
  });
});

describe("OnOffSwitch alone", () => {
  it("with zero hysteresis switches on below SP and off above SP, holding at SP exactly", () => {
    const s = new OnOffSwitch(0, true, false);
    expect(s.update(50, 49.99)).toBe(true);
    expect(s.update(50, 50)).toBe(true);
    expect(s.update(50, 50.01)).toBe(false);
    expect(s.update(50, 50)).toBe(false);
  });
});
