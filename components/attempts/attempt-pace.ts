/**
 * A drill's rules as the attempt Bench applies them: the speeds and pause it offers
 * (drill.pace), the controller fields it locks (drill.trainee.mayChange, sim/drill/permissions.ts)
 * and their names in messages. Pure: no React.
 */
import type { ControllerConfig } from "@/sim/control/config";
import { TUNING_FIELDS } from "@/sim/drill/permissions";
import type { Drill } from "@/sim/drill/schema";

/** The drill's speeds (× real time), ascending, without repeats. */
export function offeredSpeeds(drill: Drill): number[] {
  return [...new Set(drill.pace.speeds)].sort((a, b) => a - b);
}

/** The speed selected at the start: ×60 when offered (the Bench's default), else the fastest below it, else the slowest. */
export function initialSpeed(drill: Drill): number {
  const speeds = offeredSpeeds(drill);
  if (speeds.includes(60)) return 60;
  const below = speeds.filter((s) => s < 60);
  return below.length ? below[below.length - 1] : speeds[0];
}

export const speedLabel = (s: number) => `×${Number.isInteger(s) ? s : s.toPrecision(3).replace(/\.?0+$/, "")}`;

/** Fields the trainee may change: tuning always, the PV filter and the sample time if the drill says so. */
export function changeableFields(drill: Drill): Set<keyof ControllerConfig> {
  const allowed = new Set<keyof ControllerConfig>(TUNING_FIELDS);
  if (drill.trainee.mayChange.pvFilter) allowed.add("pvFilterTauS");
  if (drill.trainee.mayChange.sampleTime) allowed.add("sampleTimeS");
  return allowed;
}

/** ControllerForm's `locked`: every field outside the rules; the sample time also once the run has begun. */
export function lockedFields(drill: Drill, config: ControllerConfig, runStarted: boolean): Partial<Record<keyof ControllerConfig, boolean>> {
  const allowed = changeableFields(drill);
  const locked: Partial<Record<keyof ControllerConfig, boolean>> = {};
  for (const key of Object.keys(config) as (keyof ControllerConfig)[]) if (!allowed.has(key)) locked[key] = true;
  if (runStarted) locked.sampleTimeS = true;
  return locked;
}

const FIELD_NAMES: Partial<Record<keyof ControllerConfig, string>> = {
  action: "the action (reverse / direct)",
  outMinPct: "the OUT low limit",
  outMaxPct: "the OUT high limit",
  badPvPolicy: "the bad-PV policy",
  safeOutputPct: "the safe OUT",
  spTrackInManual: "SP tracking in manual",
  pvFilterTauS: "the PV filter τf",
  sampleTimeS: "the sample time",
  outOnPct: "OUT when on",
  outOffPct: "OUT when off",
};

export const fieldName = (key: string) => FIELD_NAMES[key as keyof ControllerConfig] ?? key;

/** "a, b and c" */
export function listOf(items: string[]): string {
  if (items.length <= 1) return items.join("");
  return `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}
