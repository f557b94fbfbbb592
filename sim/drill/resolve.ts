/** Turns a drill's references (preset id, optional sections) into concrete configurations. */
import { findPreset } from "../plant/presets";
import type { PlantDefinition } from "../plant/plant-definition";
import { sensorChainSchema, type SensorChainConfig } from "../sensor/config";
import { cutoutConfigSchema, type CutoutConfig } from "../safety/cutout-config";
import type { Drill } from "./schema";

export function resolvePlant(drill: Drill): PlantDefinition {
  const p = drill.plant;
  if (p.kind !== "preset") return p;
  const pre = findPreset(p.presetId);
  if (!pre) throw new Error(`plant.presetId: unknown preset "${p.presetId}"`);
  return p.lossModel ? { ...pre.plant, lossModel: p.lossModel } : pre.plant;
}

export function resolveSensor(drill: Drill): SensorChainConfig {
  if (drill.sensor) return drill.sensor;
  const pre = drill.plant.kind === "preset" ? findPreset(drill.plant.presetId) : undefined;
  return sensorChainSchema.parse(pre?.sensor ?? {});
}

export function resolveCutout(drill: Drill): CutoutConfig {
  if (drill.cutout) return drill.cutout;
  const pre = drill.plant.kind === "preset" ? findPreset(drill.plant.presetId) : undefined;
  if (!pre) throw new Error("cutout: required when the plant is defined in full");
  return cutoutConfigSchema.parse({ tripPointC: pre.cutoutTripC });
}

/** Standard deviation of the configured loop-current noise, in °C of the transmitter span. */
export function noiseSigmaC(s: SensorChainConfig): number {
  return (s.noise.sdMa * (s.transmitter.rangeHighC - s.transmitter.rangeLowC)) / 16;
}
