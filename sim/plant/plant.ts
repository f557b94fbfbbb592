/**
 * What the runner needs from any plant (an enclosure or a transfer-function model). The heater
 * input is the fraction (0–1) of the heater's rating requested by the drive; the plant applies
 * the supply-voltage factor (V/V_nom)² itself. The plant also carries the two sensor-element lags:
 * the controller's sensor element and the cutout's own sensor element.
 */
import type { ColdLoad, PlantConditions } from "./conditions";

export type InitialTemperatures =
  | { kind: "ambient" }
  | { kind: "steady"; outPercent: number }
  | { kind: "temperatures"; airC: number; wallC?: number; heaterC?: number; contentsC?: number; sensorC?: number };

export interface Plant {
  readonly kind: "enclosure" | "transfer-function";
  /** plant clock, s */
  readonly time: number;
  /** advance by h seconds with the heater at a constant fraction of its rating */
  advance(h: number, heaterFraction: number): void;
  /** make steps of this length cheap (precomputed transition coefficients) */
  prepareStep(h: number): void;
  airTemperatureC(): number;
  sensorTemperatureC(): number;
  cutoutSensorTemperatureC(): number;
  /** heater power at the present supply voltage for a drive fraction, W */
  heaterPowerW(heaterFraction: number): number;
  conditions(): PlantConditions;
  setConditions(c: Partial<PlantConditions>): void;
  placeColdLoad(load: ColdLoad): void;
  removeColdLoad(): void;
  initialize(init: InitialTemperatures): void;
  /** ∫ heater power dt since construction, J */
  readonly heaterEnergyJ: number;
  /** full state (for tests and snapshots) */
  stateVector(): Float64Array;
}
