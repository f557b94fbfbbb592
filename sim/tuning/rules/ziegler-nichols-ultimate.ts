/**
 * Ziegler–Nichols ultimate-cycle rules: J. G. Ziegler, N. B. Nichols, "Optimum settings for
 * automatic controllers", Trans. ASME 64, 1942; table as in Bequette 2003, Table 6-1 (standard form).
 *   P: Kc = 0.5 Ku;  PI: 0.45 Ku, Ti = Pu/1.2;  PID: 0.6 Ku, Ti = Pu/2, Td = Pu/8.
 * Design target: quarter-amplitude decay; aggressive (small stability margins).
 */
import { tuning, type ControllerType, type RuleResult } from "./tuning";
import { checkUltimate, type UltimatePoint } from "./validate";

export const ZN_ULTIMATE = "ziegler-nichols-ultimate";
const SOURCE = "Ziegler & Nichols 1942 (ultimate cycle), as tabulated in Bequette 2003, Table 6-1";

export function zieglerNicholsUltimate(u: UltimatePoint, controller: ControllerType): RuleResult {
  const bad = checkUltimate(ZN_ULTIMATE, u);
  if (bad) return bad;
  const notes = ["quarter-decay design: expect overshoot and little margin; consider a less aggressive rule"];
  switch (controller) {
    case "P":
      return tuning(ZN_ULTIMATE, "P", "standard", 0.5 * u.ku, 0, 0, SOURCE, notes);
    case "PI":
      return tuning(ZN_ULTIMATE, "PI", "standard", 0.45 * u.ku, u.puS / 1.2, 0, SOURCE, notes);
    case "PID":
      return tuning(ZN_ULTIMATE, "PID", "standard", 0.6 * u.ku, u.puS / 2, u.puS / 8, SOURCE, notes);
  }
}
