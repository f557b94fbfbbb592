import { describe, expect, it } from "vitest";
import { EnclosurePlant } from "@/sim/plant/enclosure-plant";
import { findPreset } from "@/sim/plant/presets";
import { matrixExponential } from "@/sim/plant/matrix-exponential";
import { expDividedDifference } from "@/sim/plant/modal-stepper";

const presets = ["benchtop-curing-cabinet", "walk-in-drying-room"];

describe("exact modal stepping against odex (Hairer–Nørsett–Wanner ODEX, tolerance 1e-11: the accuracy reference)", () => {
  it.each(presets)("%s: open-loop step and switching agree within 0.01 °C", (id) => {
    const params = findPreset(id)!.plant;
    const exact = new EnclosurePlant(params, { cutoutSensorTimeConstantS: 12 });
    const ref = new EnclosurePlant(params, { cutoutSensorTimeConstantS: 12, integrator: "odex", odexTolerance: 1e-11 });
    for (const p of [exact, ref]) p.initialize({ kind: "ambient" });
    let worst = 0;
    // irregular switching: on/off pulses of uneven length, like a relay at changing duty
    for (let k = 0; k < 400; k++) {
      const on = 0.3 + 1.7 * ((k * 37) % 11) / 11;
      for (const p of [exact, ref]) {
        p.advance(on, 1);
        p.advance(3 - on, 0);
      }
      worst = Math.max(worst, Math.abs(exact.airTemperatureC() - ref.airTemperatureC()), Math.abs(exact.sensorTemperatureC() - ref.sensorTemperatureC()), Math.abs(exact.cutoutSensorTemperatureC() - ref.cutoutSensorTemperatureC()));
    }
    expect(worst).toBeLessThan(0.01);
    expect(worst).toBeLessThan(1e-6); // in practice both are near round-off
  });

  it("Padé scaling-and-squaring exponential matches scalar and 2×2 closed forms (Golub & Van Loan Alg. 9.3.1)", () => {
    expect(matrixExponential([-2], 1, 1.5)[0]).toBeCloseTo(Math.exp(-3), 14);
    // [[a,1],[0,a]] → e^{a h}[[1,h],[0,1]]
    const e = matrixExponential([-0.5, 1, 0, -0.5], 2, 3);
    expect(e[0]).toBeCloseTo(Math.exp(-1.5), 13);
    expect(e[1]).toBeCloseTo(3 * Math.exp(-1.5), 13);
    expect(e[2]).toBe(0);
  });

  it("the divided difference of exp is accurate at and near a repeated eigenvalue", () => {
    expect(expDividedDifference(-0.1, -0.1, 2)).toBeCloseTo(2 * Math.exp(-0.2), 15);
    const a = -0.1, b = -0.1 + 1e-9;
    expect(expDividedDifference(a, b, 2)).toBeCloseTo(2 * Math.exp(-0.2), 8);
  });
});
