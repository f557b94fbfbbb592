/**
 * Ziegler–Nichols step-response (reaction-curve) rules from an FOPDT model, with a = Kθ/τ:
 * Ziegler & Nichols 1942, as tabulated in Bequette 2003, Table 6-3 (standard form).
 *   P: Kc = τ/(Kθ);  PI: 0.9 τ/(Kθ), Ti = 3.3θ;  PID: 1.2 τ/(Kθ), Ti = 2θ, Td = 0.5θ.
 */
import type { FopdtModel } from "../models";
import { tuning, type ControllerType, type RuleResult } from "./tuning";
import { checkFopdt } from "./validate";

export const ZN_REACTION_CURVE = "ziegler-nichols-reaction-curve";
const SOURCE = "Ziegler & Nichols 1942 (reaction curve), as tabulated in Bequette 2003, Table 6-3";

export function zieglerNicholsReactionCurve(m: FopdtModel, controller: ControllerType): RuleResult {
  const bad = checkFopdt(ZN_REACTION_CURVE, m, true);
  if (bad) return bad;
  const { gainCPerPercent: k, timeConstantS: tau, deadTimeS: theta } = m;
  const base = tau / (k * theta);
  const notes = ["quarter-decay design: aggressive"];
  switch (controller) {
    case "P":
      return tuning(ZN_REACTION_CURVE, "P", "standard", base, 0, 0, SOURCE, notes);
    case "PI":
      return tuning(ZN_REACTION_CURVE, "PI", "standard", 0.9 * base, 3.3 * theta, 0, SOURCE, notes);
    case "PID":
      return tuning(ZN_REACTION_CURVE, "PID", "standard", 1.2 * base, 2 * theta, 0.5 * theta, SOURCE, notes);
  }
}
