/**
 * SIMC rules: S. Skogestad, "Simple analytic rules for model reduction and PID controller
 * tuning", J. Process Control 13, 291–309, 2003.
 *   FOPDT → PI:   Kc = (1/K)·τ1/(τc + θ),  Ti = min(τ1, 4(τc + θ))            (standard form)
 *   SOPDT → PID:  the same Kc and Ti with τ1, and Td = τ2, in the SERIES form
 *                 c(s) = Kc(1 + 1/(Ti s))(Td s + 1).
 * The tuning parameter τc (closed-loop time constant) defaults to θ, the paper's "tight" choice
 * (gain margin about 3); a larger τc gives smoother, slower control.
 */
import type { FopdtModel, SopdtModel } from "../models";
import { notDefined, refuse, tuning, type ControllerType, type RuleResult } from "./tuning";
import { checkFopdt } from "./validate";

export const SIMC = "simc";
const SOURCE = "Skogestad 2003 (SIMC), J. Process Control 13, 291–309";

export interface SimcOptions {
  /** closed-loop time constant τc, s; default θ */
  tauCS?: number;
}

function tauC(theta: number, o: SimcOptions): number {
  return o.tauCS ?? theta;
}

/** PI from an FOPDT model (standard form). */
export function simcPi(m: FopdtModel, o: SimcOptions = {}): RuleResult {
  const bad = checkFopdt(SIMC, m, false);
  if (bad) return bad;
  const { gainCPerPercent: k, timeConstantS: tau1, deadTimeS: theta } = m;
  const tc = tauC(theta, o);
  if (!(tc + theta > 0)) return refuse(SIMC, "τc + θ must be above zero: with no dead time choose τc > 0");
  return tuning(SIMC, "PI", "standard", tau1 / (k * (tc + theta)), Math.min(tau1, 4 * (tc + theta)), 0, SOURCE, [
    `τc = ${tc} s${o.tauCS === undefined ? " (= θ, the tight setting; gain margin ≈ 3)" : ""}`,
  ]);
}

/** PID from an SOPDT model: series (interacting) form, Td = τ2. */
export function simcPid(m: SopdtModel, o: SimcOptions = {}): RuleResult {
  const asFirst: FopdtModel = { kind: "fopdt", gainCPerPercent: m.gainCPerPercent, timeConstantS: m.timeConstant1S, deadTimeS: m.deadTimeS };
  const pi = simcPi(asFirst, o);
  if ("refused" in pi) return pi;
  if (!(Number.isFinite(m.timeConstant2S) && m.timeConstant2S >= 0)) return refuse(SIMC, "the second time constant must be zero or positive");
  return tuning(SIMC, "PID", "series", pi.kc, pi.tiS, m.timeConstant2S, SOURCE, [...pi.notes, "series form: Td cancels the second lag τ2"]);
}

/** SIMC for whichever controller type: PI from FOPDT; PID needs an SOPDT model. */
export function simc(m: FopdtModel | SopdtModel, controller: ControllerType, o: SimcOptions = {}): RuleResult {
  if (controller === "P") return notDefined(SIMC, "SIMC is used here for PI and PID only");
  if (controller === "PID") {
    if (m.kind !== "sopdt") return notDefined(SIMC, "SIMC PID needs a second-order (SOPDT) model: Td is set to its second time constant");
    return simcPid(m, o);
  }
  // SOPDT → FOPDT by Skogestad's half rule: half of τ2 goes to τ1, the other half to θ
  const f: FopdtModel =
    m.kind === "fopdt"
      ? m
      : { kind: "fopdt", gainCPerPercent: m.gainCPerPercent, timeConstantS: m.timeConstant1S + m.timeConstant2S / 2, deadTimeS: m.deadTimeS + m.timeConstant2S / 2 };
  return simcPi(f, o);
}
