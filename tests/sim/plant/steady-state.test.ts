import { describe, expect, it } from "vitest";
import { EnclosurePlant } from "@/sim/plant/enclosure-plant";
import { enclosureParamsSchema } from "@/sim/plant/enclosure-params";
import { AIR_SPECIFIC_HEAT_J_PER_KG_K, airDensity } from "@/sim/plant/air";
import { steadyStateTemperatureC } from "@/sim/plant/derived-figures";
import { findPreset } from "@/sim/plant/presets";

const cabinet = findPreset("benchtop-curing-cabinet")!.plant;

describe("enclosure steady state", () => {
  it("obeys its own heat balance P = (ṁ·cp + U·A)(T − T_amb) (the model's own equations; ṁ = ρ(T_inlet)·V̇, references §12)", () => {
    const p = cabinet;
    const mcp = ((airDensity(p.ambientC) * p.inletAirflowM3PerH) / 3600) * AIR_SPECIFIC_HEAT_J_PER_KG_K;
    const ua = p.wallUValueWPerM2K * p.wallAreaM2;
    for (const out of [0, 25, 60, 100]) {
      const expected = p.ambientC + (p.heaterRatingW * out) / 100 / (mcp + ua);
      expect(steadyStateTemperatureC(p, out)).toBeCloseTo(expected, 9);
    }
  });

  it("is reached by integrating the exact stepper for many time constants", () => {
    const plant = new EnclosurePlant(cabinet, { cutoutSensorTimeConstantS: 10 });
    plant.initialize({ kind: "ambient" });
    plant.prepareStep(60);
    for (let k = 0; k < 60 * 20; k++) plant.advance(60, 0.5);
    expect(plant.airTemperatureC()).toBeCloseTo(steadyStateTemperatureC(cabinet, 50), 6);
    expect(plant.sensorTemperatureC()).toBeCloseTo(plant.airTemperatureC(), 6);
  });

  it("matches the ventilation rule of thumb V̇ ≈ 3.1·P/ΔT (common practice, references §12; ρ·cp from Çengel Table A-9 [CONFIRMED])", () => {
    // A well-insulated box whose loss is almost all ventilation, inlet air at 33 °C (where
    // 3600/(ρ·cp) ≈ 3.1, references §12). 500 W, 155 m³/h → ΔT ≈ 10 K by the rule.
    const p = enclosureParamsSchema.parse({
      kind: "enclosure", volumeM3: 1, wallAreaM2: 6, wallUValueWPerM2K: 1e-6, wallHeatCapacityJPerK: 1e4,
      heaterRatingW: 500, heaterHeatCapacityJPerK: 100, heaterTimeConstantS: 20, inletAirflowM3PerH: 155,
      ambientC: 33, sensorTimeConstantS: 5,
    });
    const dT = steadyStateTemperatureC(p, 100) - p.ambientC;
    const ruleFlow = (3.1 * 500) / dT;
    expect(Math.abs(ruleFlow / 155 - 1)).toBeLessThan(0.01);
    // the physics behind the factor: 3600/(ρ·cp) with Çengel's ρ(35 °C) = 1.145 → 3.122
    expect(3600 / (1.145 * 1007)).toBeCloseTo(3.122, 3);
    expect(3600 / (airDensity(33) * AIR_SPECIFIC_HEAT_J_PER_KG_K)).toBeCloseTo(3.1, 1);
  });

  it("blocking the inlet raises the temperature at the same output (references §16, common practice)", () => {
    const plant = new EnclosurePlant(cabinet, { cutoutSensorTimeConstantS: 10 });
    plant.setConditions({ inletBlockagePercent: 80 });
    const blocked = plant.steadyNodeTemperatures(0.5)[plant.network.airNode];
    expect(blocked).toBeGreaterThan(steadyStateTemperatureC(cabinet, 50) + 5);
  });

  it("heater power goes with the square of the supply voltage", () => {
    const plant = new EnclosurePlant(cabinet, { cutoutSensorTimeConstantS: 10 });
    plant.setConditions({ supplyVoltageV: 0.9 * cabinet.nominalVoltageV });
    expect(plant.heaterPowerW(1)).toBeCloseTo(0.81 * cabinet.heaterRatingW, 9);
  });
});
