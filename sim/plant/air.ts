/**
 * Dry-air properties used by the ventilation loss.
 * Ideal gas ρ = p/(R·T) with R = R̄/M = 8.314462618/0.0289647 = 287.055 J/(kg·K) (Çengel Table A-1);
 * cp = 1007 J/(kg·K), constant over 20–50 °C at 1 atm (Çengel & Ghajar Table A-9).
 */
export const AIR_GAS_CONSTANT_J_PER_KG_K = 287.055;
export const AIR_SPECIFIC_HEAT_J_PER_KG_K = 1007;
export const STANDARD_PRESSURE_PA = 101325;
export const ZERO_CELSIUS_K = 273.15;

/** Air density in kg/m³ at temperature tC (°C) and pressure p (Pa), ideal-gas law. */
export function airDensity(tC: number, pressurePa: number = STANDARD_PRESSURE_PA): number {
  return pressurePa / (AIR_GAS_CONSTANT_J_PER_KG_K * (tC + ZERO_CELSIUS_K));
}

/** Mass flow ṁ = ρ(T_inlet)·V̇ in kg/s for a volume flow in m³/h measured at the inlet. */
export function inletMassFlow(volumeFlowM3PerH: number, inletC: number, pressurePa?: number): number {
  return (airDensity(inletC, pressurePa) * volumeFlowM3PerH) / 3600;
}

/** Ventilation conductance ṁ·cp in W/K (the loss is ṁ·cp·(T_air − T_inlet)). */
export function ventilationConductance(volumeFlowM3PerH: number, inletC: number, pressurePa?: number): number {
  return inletMassFlow(volumeFlowM3PerH, inletC, pressurePa) * AIR_SPECIFIC_HEAT_J_PER_KG_K;
}
