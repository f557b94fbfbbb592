/** Input checks shared by the rules: a rule refuses a model it cannot use instead of returning NaN. */
import type { FopdtModel } from "../models";
import { refuse, type RuleRefusal } from "./tuning";

export interface UltimatePoint {
  /** ultimate gain Ku, % per °C */
  ku: number;
  /** ultimate period Pu, s */
  puS: number;
}

export function checkUltimate(rule: string, u: UltimatePoint): RuleRefusal | null {
  if (!(Number.isFinite(u.ku) && u.ku > 0)) return refuse(rule, `the ultimate gain must be a positive number (got ${u.ku})`);
  if (!(Number.isFinite(u.puS) && u.puS > 0)) return refuse(rule, `the ultimate period must be a positive number of seconds (got ${u.puS})`);
  return null;
}

/** Gain must be positive: for a direct-acting loop give |K| and set the controller's action to direct. */
export function checkFopdt(rule: string, m: FopdtModel, needsDeadTime: boolean): RuleRefusal | null {
  const { gainCPerPercent: k, timeConstantS: tau, deadTimeS: theta } = m;
  if (!(Number.isFinite(k) && k > 0))
    return refuse(rule, `the process gain must be positive (got ${k} °C/%); for a direct-acting loop use |K| and set the action to direct`);
  if (!(Number.isFinite(tau) && tau > 0)) return refuse(rule, `the time constant must be positive (got ${tau} s)`);
  if (!(Number.isFinite(theta) && theta >= 0)) return refuse(rule, `the dead time must be zero or positive (got ${theta} s)`);
  if (needsDeadTime && theta <= 0) return refuse(rule, "this rule divides by the dead time: it needs a dead time above zero");
  return null;
}
