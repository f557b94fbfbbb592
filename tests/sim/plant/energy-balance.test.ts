import { describe, expect, it } from "vitest";
import { EnclosurePlant } from "@/sim/plant/enclosure-plant";
import { findPreset } from "@/sim/plant/presets";

// First law for the lumped model: ∫P dt + E_loads = ΔΣC·T + ∫(ventilation + wall loss) dt.
// The losses are integrated independently along the trajectory (composite Simpson on a 0.5 s grid
// inside each constant-input interval), not taken from the stepper.
function run(lossModel: "linear" | "nonlinear") {
  const params = { ...findPreset("benchtop-curing-cabinet")!.plant, lossModel };
  const plant = new EnclosurePlant(params, { cutoutSensorTimeConstantS: 10, odexTolerance: 1e-10 });
  plant.initialize({ kind: "ambient" });
  const e0 = plant.storedEnergyJ();
  let lost = 0;
  const sub = 0.5;
  const lossNow = () => {
    const l = plant.lossesW();
    return l.ventilationW + l.wallW;
  };
  const interval = (h: number, fraction: number) => {
    const steps = Math.round(h / sub);
    for (let k = 0; k < steps; k += 2) {
      const a = lossNow();
      plant.advance(sub, fraction);
      const m = lossNow();
      plant.advance(sub, fraction);
      const b = lossNow();
      lost += ((2 * sub) / 6) * (a + 4 * m + b);
    }
  };
  for (let c = 0; c < 300; c++) {
    interval(6, 1); // time-proportioning-like: 6 s on, 14 s off
    interval(14, 0);
  }
  plant.setConditions({ inletBlockagePercent: 60, ambientC: 25 });
  for (let c = 0; c < 100; c++) {
    interval(10, 1);
    interval(10, 0);
  }
  plant.placeColdLoad({ massKg: 2, specificHeatJPerKgK: 900, temperatureC: 4, airCouplingWPerK: 6 });
  for (let c = 0; c < 50; c++) {
    interval(12, 1);
    interval(8, 0);
  }
  plant.placeColdLoad({ massKg: 1, specificHeatJPerKgK: 500, temperatureC: -10, airCouplingWPerK: 3 }); // mixes into the lump
  for (let c = 0; c < 50; c++) {
    interval(12, 1);
    interval(8, 0);
  }
  plant.removeColdLoad();
  for (let c = 0; c < 20; c++) interval(20, c % 2 === 0 ? 1 : 0);
  // energy carried in (+) and out (−) with the loads enters the balance as a boundary term
  return { heater: plant.heaterEnergyJ + plant.loadEnergyJ, stored: plant.storedEnergyJ() - e0, lost };
}

describe("energy balance along a switched trajectory", () => {
  it.each(["linear", "nonlinear"] as const)("%s losses: heater energy = stored + lost within 0.1 %%", (mode) => {
    const r = run(mode);
    expect(r.heater).toBeGreaterThan(0);
    expect(Math.abs(r.heater - (r.stored + r.lost)) / r.heater).toBeLessThan(1e-3);
  });
});
