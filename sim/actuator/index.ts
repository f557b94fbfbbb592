export * from "./drive-config";
export * from "./heater-drive";
export * from "./continuous-drive";
export * from "./time-proportioning";
import type { DriveConfig } from "./drive-config";
import { ContinuousDrive } from "./continuous-drive";
import { TimeProportioningDrive } from "./time-proportioning";
import type { HeaterDrive } from "./heater-drive";

export function createDrive(cfg: DriveConfig): HeaterDrive {
  return cfg.kind === "continuous" ? new ContinuousDrive() : new TimeProportioningDrive(cfg);
}
