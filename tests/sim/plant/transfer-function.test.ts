import { describe, expect, it } from "vitest";
import { TransferFunctionPlant } from "@/sim/plant/transfer-function-plant";
import { transferFunctionParamsSchema } from "@/sim/plant/transfer-function-params";

function tf(timeConstantsS: number[], deadTimeS: number) {
  return transferFunctionParamsSchema.parse({
    kind: "transfer-function", gainCPerPercent: 0.8, timeConstantsS, deadTimeS,
    operatingPoint: { outPercent: 0, temperatureC: 20 }, ambientC: 20,
  });
}

describe("transfer-function plant, open loop", () => {
  it("FOPDT with θ = 0: step matches K·Δu·(1 − e^{−t/τ}) (analytic solution of τy' + y = Ku; FOPDT convention of references)", () => {
    const plant = new TransferFunctionPlant(tf([100], 0), { cutoutSensorTimeConstantS: 5 });
    for (let k = 1; k <= 600; k++) {
      plant.advance(1, 0.5);
      const t = k;
      const expected = 20 + 0.8 * 50 * (1 - Math.exp(-t / 100));
      expect(Math.abs(plant.airTemperatureC() - expected)).toBeLessThan(1e-9);
    }
  });

  it("dead time is exact for piecewise-constant input, also when θ is not a multiple of the step", () => {
    const theta = 7.3;
    const plant = new TransferFunctionPlant(tf([50], theta), { cutoutSensorTimeConstantS: 5 });
    for (let k = 1; k <= 300; k++) {
      plant.advance(0.5, 1);
      const t = k * 0.5;
      const expected = t <= theta ? 20 : 20 + 80 * (1 - Math.exp(-(t - theta) / 50));
      expect(Math.abs(plant.airTemperatureC() - expected)).toBeLessThan(1e-9);
    }
  });

  it("SOPDT with distinct and with equal time constants matches the analytic step response", () => {
    const t1 = 40, t2 = 15;
    const a = new TransferFunctionPlant(tf([t1, t2], 0), { cutoutSensorTimeConstantS: 5 });
    const b = new TransferFunctionPlant(tf([30, 30], 0), { cutoutSensorTimeConstantS: 5 });
    for (let k = 1; k <= 200; k++) {
      a.advance(1, 1);
      b.advance(1, 1);
      const t = k;
      const ya = 1 - (t1 * Math.exp(-t / t1) - t2 * Math.exp(-t / t2)) / (t1 - t2);
      const yb = 1 - (1 + t / 30) * Math.exp(-t / 30);
      expect(a.airTemperatureC()).toBeCloseTo(20 + 80 * ya, 9);
      expect(b.airTemperatureC()).toBeCloseTo(20 + 80 * yb, 9);
    }
  });

  it("sensor lag follows the output (first-order lag of the plant output)", () => {
    const p = { ...tf([100], 0), sensorTimeConstantS: 100 };
    const plant = new TransferFunctionPlant(p, { cutoutSensorTimeConstantS: 5 });
    plant.advance(100, 1);
    // two equal lags in series: 1 − (1 + t/τ)e^{−t/τ}
    expect(plant.sensorTemperatureC()).toBeCloseTo(20 + 80 * (1 - 2 * Math.exp(-1)), 9);
  });
});
