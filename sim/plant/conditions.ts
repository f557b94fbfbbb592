/**
 * Operating conditions that disturbances change. Each is piecewise constant in time; the plant
 * re-derives its linear model when one changes (an event is a breakpoint of the integration).
 */
export interface PlantConditions {
  /** 0–100 %: airflow is reduced to (1 − b/100) of the rated inlet airflow (a clogging filter) */
  inletBlockagePercent: number;
  /** extra air exchange through an open door, m³/h (0 = door closed) */
  doorAirflowM3PerH: number;
  /** ambient (= inlet air) temperature, °C */
  ambientC: number;
  /** supply voltage at the heater, V; power ∝ (V/V_nom)² */
  supplyVoltageV: number;
}

/** A cold load placed inside: its own lumped mass at its own temperature, coupled to the air by h·A.
 * Placing a second load while one is inside mixes them into one lump: capacities add and the
 * temperature is the capacity-weighted mean (energy conserved). Removing the load takes its energy out. */
export interface ColdLoad {
  massKg: number;
  specificHeatJPerKgK: number;
  temperatureC: number;
  airCouplingWPerK: number;
}
