/**
 * Excess-temperature cutout, independent of the controller (NFPA 86 excess-temperature limit
 * interlock, references §14 [MEMORY for the clause]): its own sensor (own lag, a plant state),
 * trips when that sensor reads above the trip point or has failed, latches the heater off, and
 * releases only on a manual reset — which is refused while the cause persists.
 * Fault detection: the limit's input sees an open element or broken lead as infinite resistance
 * and a shorted element as a resistance far below its range, so all three faults are failures.
 */
import type { SensorFault } from "../sensor/config";
import type { CutoutConfig } from "./cutout-config";

export type TripCause = "over-temperature" | "sensor-failure";

export interface SafetyTrip {
  timeS: number;
  cause: TripCause;
  /** the cutout sensor's temperature at the trip, °C */
  sensorC: number;
}

export class ExcessTemperatureCutout {
  private latched = false;
  readonly trips: SafetyTrip[] = [];

  constructor(readonly cfg: CutoutConfig) {}

  get tripped(): boolean {
    return this.latched;
  }

  /** Heater may be energised only while the cutout is healthy. */
  get heaterPermitted(): boolean {
    return !this.latched;
  }

  private cause(sensorC: number, fault: SensorFault): TripCause | null {
    if (!this.cfg.enabled) return null;
    if (fault !== "none") return "sensor-failure";
    if (sensorC > this.cfg.tripPointC) return "over-temperature";
    return null;
  }

  /** Supervise; returns the new trip if it tripped now. */
  check(timeS: number, sensorC: number, fault: SensorFault): SafetyTrip | null {
    if (this.latched) return null;
    const c = this.cause(sensorC, fault);
    if (!c) return null;
    this.latched = true;
    const trip = { timeS, cause: c, sensorC };
    this.trips.push(trip);
    return trip;
  }

  /** Manual reset: accepted (returns true) only if the sensor is healthy and below trip − margin. */
  reset(sensorC: number, fault: SensorFault): boolean {
    if (!this.latched) return true;
    if (fault !== "none") return false;
    if (this.cfg.enabled && sensorC > this.cfg.tripPointC - this.cfg.resetMarginC) return false;
    this.latched = false;
    return true;
  }
}
