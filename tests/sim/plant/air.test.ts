import { describe, expect, it } from "vitest";
import { AIR_GAS_CONSTANT_J_PER_KG_K, AIR_SPECIFIC_HEAT_J_PER_KG_K, airDensity, inletMassFlow } from "@/sim/plant/air";

describe("air properties", () => {
  it("gas constant is R̄/M (Çengel Table A-1; references §12)", () => {
    expect(8.314462618 / 0.0289647).toBeCloseTo(AIR_GAS_CONSTANT_J_PER_KG_K, 2);
  });

  // Çengel & Ghajar Table A-9 [CONFIRMED], references §12: ρ at 1 atm
  const cengel: [number, number][] = [
    [20, 1.204], [25, 1.184], [30, 1.164], [35, 1.145], [40, 1.127], [45, 1.109], [50, 1.092],
  ];
  it.each(cengel)("ideal-gas density at %d °C matches Çengel Table A-9 (%f kg/m³) within 0.1 %", (t, rho) => {
    expect(Math.abs(airDensity(t) / rho - 1)).toBeLessThan(1e-3);
  });

  it("reproduces the references' ideal-gas check values to 4 digits (references §12)", () => {
    expect(airDensity(20)).toBeCloseTo(1.2041, 4);
    expect(airDensity(50)).toBeCloseTo(1.0923, 4);
  });

  it("cp is 1007 J/(kg·K) (Çengel & Ghajar Table A-9)", () => {
    expect(AIR_SPECIFIC_HEAT_J_PER_KG_K).toBe(1007);
  });

  it("mass flow uses the inlet density: ṁ = ρ(T_inlet)·V̇", () => {
    expect(inletMassFlow(3600, 20)).toBeCloseTo(airDensity(20), 12);
    expect(inletMassFlow(3600, 50)).toBeLessThan(inletMassFlow(3600, 20));
  });
});
