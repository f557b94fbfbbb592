export { ControllerBlock } from "./block";
export type { ControllerInit } from "./block";
export {
  controllerConfigSchema,
  controllerKindSchema,
  pidFormSchema,
  controllerActionSchema,
  antiWindupSchema,
  badPvPolicySchema,
} from "./config";
export type { ControllerConfig, ControllerConfigInput, ControllerMode, ControllerState } from "./config";
export { DiscretePid, pidCoefficients, defaultTrackingTime, deadZone, clamp } from "./pid";
export type { PidCoefficients } from "./pid";
export { seriesToIdeal, idealToSeries, parallelToIdeal, idealToParallel, toIdeal } from "./forms";
export type { IdealPidParams } from "./forms";
export { OnOffSwitch } from "./onoff";
export { PvFilter, pvFilterAlpha } from "./pv-filter";
