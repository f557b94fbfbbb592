/**
 * Tyreus–Luyben rules from the ultimate point: B. D. Tyreus, W. L. Luyben, "Tuning PI controllers
 * for integrator/dead time processes", Ind. Eng. Chem. Res. 31(11), 1992; as in Bequette 2003,
 * Table 6-2 (standard form).
 *   PI: Kc = Ku/3.2, Ti = 2.2 Pu;  PID: Kc = Ku/2.2, Ti = 2.2 Pu, Td = Pu/6.3.
 * Far less aggressive than Ziegler–Nichols; no P-only rule.
 */
import { notDefined, tuning, type ControllerType, type RuleResult } from "./tuning";
import { checkUltimate, type UltimatePoint } from "./validate";

export const TYREUS_LUYBEN = "tyreus-luyben";
const SOURCE = "Tyreus & Luyben 1992, as tabulated in Bequette 2003, Table 6-2";

export function tyreusLuyben(u: UltimatePoint, controller: ControllerType): RuleResult {
  const bad = checkUltimate(TYREUS_LUYBEN, u);
  if (bad) return bad;
  const notes = ["conservative: little overshoot, slower recovery from disturbances than Ziegler–Nichols"];
  switch (controller) {
    case "P":
      return notDefined(TYREUS_LUYBEN, "Tyreus–Luyben defines PI and PID settings only");
    case "PI":
      return tuning(TYREUS_LUYBEN, "PI", "standard", u.ku / 3.2, 2.2 * u.puS, 0, SOURCE, notes);
    case "PID":
      return tuning(TYREUS_LUYBEN, "PID", "standard", u.ku / 2.2, 2.2 * u.puS, u.puS / 6.3, SOURCE, notes);
  }
}
