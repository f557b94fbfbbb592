/**
 * From what a test measured (ultimate point and/or a model) to tunings a technician can apply:
 * every rule that applies, one recommended tuning converted to the block's form, a complete
 * controller configuration (the present one with the new gains), and the recommended tuning's
 * margins on the model.
 */
import { controllerConfigSchema, type ControllerConfig } from "../control/config";
import type { ProcessModel } from "./models";
import { allTunings, tuneByName, type RuleName } from "./rules/catalog";
import { toBlockForm, type BlockForm, type FormConversion } from "./rules/form-conversion";
import { isRefusal, type ControllerType, type RuleResult, type Tuning } from "./rules/tuning";
import type { UltimatePoint } from "./rules/validate";
import { computeMargins, type Margins } from "./robustness/margins";
import { assessMargins, type RobustnessAssessment } from "./robustness/assessment";
import { controllerFromBlock, plantFromModel, type LoopLags } from "./robustness/loop";

export interface ProposalRequest {
  ultimate?: UltimatePoint;
  model?: ProcessModel;
  /** default: tyreus-luyben with an ultimate point, else simc (PI) / amigo (PID) */
  rule?: RuleName | string;
  /** default PID */
  controller?: ControllerType;
  /** default: the form of `base` */
  form?: BlockForm;
  /** the present controller configuration (sample time, filter, limits are kept) */
  base: ControllerConfig;
  /** lags the loop adds beyond the model, for the margins (the model may already contain some) */
  extraLags?: LoopLags;
}

export interface Recommendation {
  tuning: Tuning;
  conversion: FormConversion;
  /** the base configuration with the new tuning, ready for a "tuning" action (null if not representable) */
  controllerConfig: ControllerConfig | null;
  margins: Margins | null;
  assessment: RobustnessAssessment | null;
}

export interface Proposal {
  tunings: RuleResult[];
  recommended: Recommendation | { refused: true; reason: string };
}

/**
 * Rules tried in order when none is named: Tyreus–Luyben for an ultimate point (conservative);
 * from a model SIMC (PI, or PID on an SOPDT), then AMIGO, then IMC, which also copes with a
 * model without dead time (the first two divide by θ).
 */
export function defaultRules(req: Pick<ProposalRequest, "ultimate" | "model" | "controller">): string[] {
  const c = req.controller ?? "PID";
  const fromModel = c === "PID" && req.model?.kind !== "sopdt" ? ["amigo", "imc-lambda"] : ["simc", "amigo", "imc-lambda"];
  return [...(req.ultimate ? ["tyreus-luyben"] : []), ...(req.model ? fromModel : [])];
}

export function propose(req: ProposalRequest): Proposal {
  const inputs = { ultimate: req.ultimate, model: req.model };
  const tunings = allTunings(inputs);
  const controller = req.controller ?? "PID";
  const candidates = req.rule ? [req.rule] : defaultRules(req);
  if (!candidates.length) return { tunings, recommended: { refused: true, reason: "nothing to tune from: neither an ultimate point nor a model" } };
  let r: RuleResult = tuneByName(candidates[0], controller, inputs);
  for (const name of candidates.slice(1)) {
    if (!isRefusal(r)) break;
    r = tuneByName(name, controller, inputs);
  }
  if (isRefusal(r)) return { tunings, recommended: { refused: true, reason: `${r.rule}: ${r.reason}` } };
  const form = req.form ?? req.base.form;
  const conversion = toBlockForm(r, form);
  let controllerConfig: ControllerConfig | null = null;
  if (conversion.ok) {
    const t = conversion.tuning;
    controllerConfig = controllerConfigSchema.parse({
      ...req.base,
      kind: "pid",
      form: t.form,
      kc: t.kc,
      ti: t.ti,
      td: t.td,
      ki: t.ki,
      kd: t.kd,
      ...(t.pvFilterTauS !== undefined ? { pvFilterTauS: t.pvFilterTauS } : {}),
    });
  }
  let margins: Margins | null = null;
  if (req.model) {
    const ideal = toBlockForm(r, "standard");
    if (ideal.ok) {
      const c = controllerFromBlock({ ...ideal.tuning, derivativeFilterN: req.base.derivativeFilterN });
      margins = computeMargins({ plant: plantFromModel(req.model), controller: c, lags: { ...req.extraLags, pvFilterTauS: (req.extraLags?.pvFilterTauS ?? 0) + (ideal.tuning.pvFilterTauS ?? 0) } });
    }
  }
  return { tunings, recommended: { tuning: r, conversion, controllerConfig, margins, assessment: margins ? assessMargins(margins) : null } };
}
