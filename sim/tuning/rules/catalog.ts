/** The rules by name, for the CLI and the Bench: which need the ultimate point, which a model. */
import type { FopdtModel, ProcessModel } from "../models";
import { amigo, AMIGO } from "./amigo";
import { cohenCoon, COHEN_COON } from "./cohen-coon";
import { imcLambda, IMC_LAMBDA, type ImcOptions } from "./imc-lambda";
import { simc, SIMC, type SimcOptions } from "./simc";
import { refuse, type ControllerType, type RuleResult } from "./tuning";
import { tyreusLuyben, TYREUS_LUYBEN } from "./tyreus-luyben";
import type { UltimatePoint } from "./validate";
import { zieglerNicholsNoOvershoot, zieglerNicholsSomeOvershoot, ZN_NO_OVERSHOOT, ZN_SOME_OVERSHOOT } from "./ziegler-nichols-overshoot-variants";
import { zieglerNicholsReactionCurve, ZN_REACTION_CURVE } from "./ziegler-nichols-reaction-curve";
import { zieglerNicholsUltimate, ZN_ULTIMATE } from "./ziegler-nichols-ultimate";

export const ULTIMATE_RULES = [ZN_ULTIMATE, TYREUS_LUYBEN, ZN_SOME_OVERSHOOT, ZN_NO_OVERSHOOT] as const;
export const MODEL_RULES = [SIMC, IMC_LAMBDA, COHEN_COON, AMIGO, ZN_REACTION_CURVE] as const;
export type UltimateRuleName = (typeof ULTIMATE_RULES)[number];
export type ModelRuleName = (typeof MODEL_RULES)[number];
export type RuleName = UltimateRuleName | ModelRuleName;
export const ALL_RULES: readonly RuleName[] = [...ULTIMATE_RULES, ...MODEL_RULES];
export const CONTROLLER_TYPES: readonly ControllerType[] = ["P", "PI", "PID"];

export function isUltimateRule(name: string): name is UltimateRuleName {
  return (ULTIMATE_RULES as readonly string[]).includes(name);
}
export function isModelRule(name: string): name is ModelRuleName {
  return (MODEL_RULES as readonly string[]).includes(name);
}

export function tuneFromUltimate(rule: UltimateRuleName, u: UltimatePoint, controller: ControllerType): RuleResult {
  switch (rule) {
    case ZN_ULTIMATE:
      return zieglerNicholsUltimate(u, controller);
    case TYREUS_LUYBEN:
      return tyreusLuyben(u, controller);
    case ZN_SOME_OVERSHOOT:
      return zieglerNicholsSomeOvershoot(u, controller);
    case ZN_NO_OVERSHOOT:
      return zieglerNicholsNoOvershoot(u, controller);
  }
}

export interface ModelRuleOptions {
  simc?: SimcOptions;
  imc?: ImcOptions;
}

/** SOPDT → FOPDT by Skogestad's half rule (Skogestad 2003), for the rules defined on FOPDT. */
export function toFopdt(m: ProcessModel): FopdtModel {
  if (m.kind === "fopdt") return m;
  return { kind: "fopdt", gainCPerPercent: m.gainCPerPercent, timeConstantS: m.timeConstant1S + m.timeConstant2S / 2, deadTimeS: m.deadTimeS + m.timeConstant2S / 2 };
}

export function tuneFromModel(rule: ModelRuleName, m: ProcessModel, controller: ControllerType, o: ModelRuleOptions = {}): RuleResult {
  switch (rule) {
    case SIMC:
      return simc(m, controller, o.simc);
    case IMC_LAMBDA:
      return imcLambda(toFopdt(m), controller, o.imc);
    case COHEN_COON:
      return cohenCoon(toFopdt(m), controller);
    case AMIGO:
      return amigo(toFopdt(m), controller);
    case ZN_REACTION_CURVE:
      return zieglerNicholsReactionCurve(toFopdt(m), controller);
  }
}

/** Every rule and controller type that applies, from whichever inputs are known. */
export function allTunings(inp: { ultimate?: UltimatePoint; model?: ProcessModel; options?: ModelRuleOptions }): RuleResult[] {
  const out: RuleResult[] = [];
  for (const c of CONTROLLER_TYPES) {
    if (inp.ultimate) for (const r of ULTIMATE_RULES) out.push(tuneFromUltimate(r, inp.ultimate, c));
    if (inp.model) for (const r of MODEL_RULES) out.push(tuneFromModel(r, inp.model, c, inp.options));
  }
  return out.filter((r) => !("refused" in r && r.notDefined));
}

export function tuneByName(rule: string, controller: ControllerType, inp: { ultimate?: UltimatePoint; model?: ProcessModel; options?: ModelRuleOptions }): RuleResult {
  if (isUltimateRule(rule)) return inp.ultimate ? tuneFromUltimate(rule, inp.ultimate, controller) : refuse(rule, "this rule needs the ultimate gain and period (a relay test)");
  if (isModelRule(rule)) return inp.model ? tuneFromModel(rule, inp.model, controller, inp.options) : refuse(rule, "this rule needs a process model (a bump test)");
  return refuse(rule, `unknown rule "${rule}"; known rules: ${ALL_RULES.join(", ")}`);
}
