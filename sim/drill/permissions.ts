/**
 * What a trainee may change (drill.trainee.mayChange): tuning always; the PV filter and the
 * sample time only if the drill allows. Everything else (action, limits, bad-PV policy, …) must
 * equal the reference tuning's value.
 */
import type { ControllerConfig } from "../control/config";
import type { Drill } from "./schema";

/** Fields that count as "tuning". */
export const TUNING_FIELDS: readonly (keyof ControllerConfig)[] = [
  "kind", "form", "kc", "ti", "td", "ki", "kd", "derivativeOn", "derivativeFilterN", "setpointWeightB", "setpointWeightC",
  "antiWindup", "trackingTimeS", "hysteresisC", "deadbandC", "outRateLimitPctPerS",
];

/** Names of the fields changed against the rules; empty when the configuration is allowed. */
export function controllerViolations(drill: Drill, cfg: ControllerConfig): string[] {
  const ref = drill.referenceTuning;
  const allowed = new Set<string>(TUNING_FIELDS);
  if (drill.trainee.mayChange.pvFilter) allowed.add("pvFilterTauS");
  if (drill.trainee.mayChange.sampleTime) allowed.add("sampleTimeS");
  const bad: string[] = [];
  for (const key of Object.keys(ref) as (keyof ControllerConfig)[]) {
    if (allowed.has(key)) continue;
    if (cfg[key] !== ref[key]) bad.push(String(key));
  }
  return bad;
}
