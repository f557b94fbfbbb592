/**
 * AMIGO rules for an FOPDT model (gain K, time constant T, delay L): K. J. Åström, T. Hägglund,
 * "Revisiting the Ziegler–Nichols step response method for PID control", J. Process Control 14(6),
 * 2004, and Advanced PID Control, ISA 2006, ch. 7 (standard form):
 *   PI:  Kc = 0.15/K + (0.35 − LT/(L + T)²)·T/(K L),  Ti = 0.35L + 13 L T²/(T² + 12 L T + 7 L²)
 *   PID: Kc = (0.2 + 0.45 T/L)/K,  Ti = L(0.4L + 0.8T)/(L + 0.1T),  Td = 0.5 L T/(0.3L + T)
 * Design target: the largest integral gain with a maximum sensitivity Ms of about 1.4.
 */
import type { FopdtModel } from "../models";
import { notDefined, tuning, type ControllerType, type RuleResult } from "./tuning";
import { checkFopdt } from "./validate";

export const AMIGO = "amigo";
const SOURCE = "Åström & Hägglund 2004 / Advanced PID Control 2006, ch. 7 (AMIGO)";

export function amigo(m: FopdtModel, controller: ControllerType): RuleResult {
  const bad = checkFopdt(AMIGO, m, true);
  if (bad) return bad;
  const { gainCPerPercent: k, timeConstantS: t, deadTimeS: l } = m;
  const notes = ["robust design (Ms ≈ 1.4)", "Åström & Hägglund suggest setpoint weight b = 0 for lag-dominant loops (from memory)"];
  switch (controller) {
    case "P":
      return notDefined(AMIGO, "AMIGO defines PI and PID settings only");
    case "PI": {
      const kc = 0.15 / k + (0.35 - (l * t) / ((l + t) * (l + t))) * (t / (k * l));
      const ti = 0.35 * l + (13 * l * t * t) / (t * t + 12 * l * t + 7 * l * l);
      return tuning(AMIGO, "PI", "standard", kc, ti, 0, SOURCE, notes);
    }
    case "PID":
      return tuning(AMIGO, "PID", "standard", (0.2 + (0.45 * t) / l) / k, (l * (0.4 * l + 0.8 * t)) / (l + 0.1 * t), (0.5 * l * t) / (0.3 * l + t), SOURCE, notes);
  }
}
