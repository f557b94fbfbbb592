import { describe, expect, it } from "vitest";
import { runDrill } from "@/sim/drill";
import { firstOrderPlant, makeDrill, QUIET_SENSOR } from "./drills";

// Exact limit cycle of an ideal (or hysteresis) relay on an FOPDT, references §1:
//   a = K·h − (K·h − ε)·e^{−θ/τ},  Th = θ + τ·ln((K·h + a)/(K·h − ε))
// (closed forms [MEMORY] for the publication, verified numerically in references §1 with an exact
// ZOH step). Here the relay is the on/off controller (OUT 100/0 around u_op = 50 %, so h = 50 %;
// ε = hysteresisC/2) on the transfer-function plant with exact dead time. K = 1 °C/%, τ = 10 s,
// θ = 2 s. Sampled at 1 ms, so each switch may come up to one sample late: tolerance 0.2 % on a
// and 2 ms on Th.
describe("relay limit cycle on an FOPDT (exact dead time in closed loop)", () => {
  it.each([
    [0, 9.063462, 3.665895],
    [5, 11.1103, 4.519505],
  ])("hysteresis %f °C: amplitude %f °C, half period %f s", (hyst, aRef, thRef) => {
    const K = 1, tau = 10, theta = 2, h = 50, eps = hyst / 2;
    const a = K * h - (K * h - eps) * Math.exp(-theta / tau);
    const th = theta + tau * Math.log((K * h + a) / (K * h - eps));
    expect(a).toBeCloseTo(aRef, 3);
    expect(th).toBeCloseTo(thRef, 5);
    const drill = makeDrill({
      durationS: 80,
      plant: firstOrderPlant(K, tau, theta),
      initialState: { temperatures: { kind: "steady", outPercent: 50 }, mode: "auto", setpointC: 50, outPercent: 100 },
      referenceTuning: { kind: "onoff", hysteresisC: hyst, sampleTimeS: 0.001 },
      sensor: QUIET_SENSOR,
      drive: { kind: "continuous" },
      cutout: { enabled: false, tripPointC: 500 },
    });
    const tr = runDrill(drill).trace;
    let lo = Infinity, hi = -Infinity;
    const rises: number[] = [];
    for (let k = 1; k < tr.length; k++) {
      if (tr.timeS[k] < 40) continue;
      lo = Math.min(lo, tr.trueC[k]);
      hi = Math.max(hi, tr.trueC[k]);
      if (tr.outPercent[k] > tr.outPercent[k - 1]) rises.push(tr.timeS[k]);
    }
    const amp = (hi - lo) / 2;
    const period = (rises[rises.length - 1] - rises[0]) / (rises.length - 1);
    expect(Math.abs(amp / a - 1)).toBeLessThan(2e-3);
    expect(Math.abs(period / 2 - th)).toBeLessThan(2e-3);
  });
});
