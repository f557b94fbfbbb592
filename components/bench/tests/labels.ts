/** Names shown for the toolkit's tuning rules and the block's forms (the rules' own published names). */
import { ALL_RULES, MODEL_RULES, ULTIMATE_RULES } from "@/sim/tuning/rules/catalog";
import type { BlockForm } from "@/sim/tuning/rules/form-conversion";

export const RULE_LABELS: Record<string, string> = {
  "tyreus-luyben": "Tyreus–Luyben",
  "ziegler-nichols-ultimate": "Ziegler–Nichols, ultimate",
  "ziegler-nichols-some-overshoot": "Ziegler–Nichols, some overshoot",
  "ziegler-nichols-no-overshoot": "Ziegler–Nichols, no overshoot",
  simc: "SIMC (Skogestad)",
  "imc-lambda": "IMC (lambda)",
  "cohen-coon": "Cohen–Coon",
  amigo: "AMIGO",
  "ziegler-nichols-reaction-curve": "Ziegler–Nichols, reaction curve",
};

export const FORM_LABELS: Record<BlockForm, string> = { standard: "standard (ideal)", parallel: "parallel", series: "series (interacting)" };

/** Rules that can work from what a test gives: the ultimate point (relay) and/or a model. */
export function ruleChoices(has: { ultimate: boolean; model: boolean }): string[] {
  const u = ULTIMATE_RULES as readonly string[];
  const m = MODEL_RULES as readonly string[];
  return ALL_RULES.filter((r) => (has.ultimate && u.includes(r)) || (has.model && m.includes(r)));
}
