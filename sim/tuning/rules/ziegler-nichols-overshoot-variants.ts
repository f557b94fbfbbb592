/**
 * Less aggressive PID variants of the ultimate-cycle table, widely reprinted as Ziegler–Nichols
 * "some overshoot" (Kc = Ku/3, Ti = Pu/2, Td = Pu/3) and "no overshoot" (Kc = Ku/5, Ti = Pu/2,
 * Td = Pu/3). FROM MEMORY: they are not in Ziegler & Nichols 1942 and we have not read them in a
 * primary source (they are commonly credited to later textbook tables); treat them as trade
 * practice. Note Ti/Td = 1.5 < 4: they have complex zeros and no series-form equivalent.
 */
import { notDefined, tuning, type ControllerType, type RuleResult } from "./tuning";
import { checkUltimate, type UltimatePoint } from "./validate";

export const ZN_SOME_OVERSHOOT = "ziegler-nichols-some-overshoot";
export const ZN_NO_OVERSHOOT = "ziegler-nichols-no-overshoot";
const SOURCE = "ultimate-cycle PID variants as commonly reprinted (from memory, no primary source read)";

function variant(rule: string, kcFactor: number, u: UltimatePoint, controller: ControllerType): RuleResult {
  const bad = checkUltimate(rule, u);
  if (bad) return bad;
  if (controller !== "PID") return notDefined(rule, "this variant defines PID settings only");
  return tuning(rule, "PID", "standard", kcFactor * u.ku, u.puS / 2, u.puS / 3, SOURCE, [
    "Ti < 4·Td: not representable in the series form",
  ]);
}

export function zieglerNicholsSomeOvershoot(u: UltimatePoint, controller: ControllerType): RuleResult {
  return variant(ZN_SOME_OVERSHOOT, 1 / 3, u, controller);
}

export function zieglerNicholsNoOvershoot(u: UltimatePoint, controller: ControllerType): RuleResult {
  return variant(ZN_NO_OVERSHOOT, 1 / 5, u, controller);
}
