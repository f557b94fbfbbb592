/**
 * Cohen–Coon rules for an FOPDT model, r = θ/τ: G. H. Cohen, G. A. Coon, "Theoretical
 * consideration of retarded control", Trans. ASME 75, 1953; as in Bequette 2003, Table 6-4
 * (standard form; design target quarter-decay ratio):
 *   P:   Kc = (τ/(Kθ))(1 + r/3)
 *   PI:  Kc = (τ/(Kθ))(0.9 + r/12),  Ti = θ(30 + 3r)/(9 + 20r)
 *   PID: Kc = (τ/(Kθ))(4/3 + r/4),   Ti = θ(32 + 6r)/(13 + 8r),  Td = 4θ/(11 + 2r)
 */
import type { FopdtModel } from "../models";
import { tuning, type ControllerType, type RuleResult } from "./tuning";
import { checkFopdt } from "./validate";

export const COHEN_COON = "cohen-coon";
const SOURCE = "Cohen & Coon 1953, as tabulated in Bequette 2003, Table 6-4";

export function cohenCoon(m: FopdtModel, controller: ControllerType): RuleResult {
  const bad = checkFopdt(COHEN_COON, m, true);
  if (bad) return bad;
  const { gainCPerPercent: k, timeConstantS: tau, deadTimeS: theta } = m;
  const r = theta / tau;
  const base = tau / (k * theta);
  const notes = ["quarter-decay design: aggressive"];
  switch (controller) {
    case "P":
      return tuning(COHEN_COON, "P", "standard", base * (1 + r / 3), 0, 0, SOURCE, notes);
    case "PI":
      return tuning(COHEN_COON, "PI", "standard", base * (0.9 + r / 12), (theta * (30 + 3 * r)) / (9 + 20 * r), 0, SOURCE, notes);
    case "PID":
      return tuning(COHEN_COON, "PID", "standard", base * (4 / 3 + r / 4), (theta * (32 + 6 * r)) / (13 + 8 * r), (4 * theta) / (11 + 2 * r), SOURCE, notes);
  }
}
