/**
 * The result every tuning rule returns. Times in seconds, Kc in % per °C.
 * Conventions (as in the controller block, sim/control/config.ts):
 * - form "standard" (ISA ideal): u = Kc[e + (1/Ti)∫e dt + Td de/dt];
 *   form "series" (interacting): u = Kc(1 + 1/(Ti s))(1 + Td s)·e.
 * - tiS = 0 means no integral action, tdS = 0 no derivative action (JSON carries no Infinity).
 */
export type ControllerType = "P" | "PI" | "PID";
export type TuningForm = "standard" | "series";

export interface Tuning {
  /** rule id, e.g. "ziegler-nichols-ultimate" */
  rule: string;
  controller: ControllerType;
  form: TuningForm;
  kc: number;
  tiS: number;
  tdS: number;
  /** a first-order filter the rule puts in series with the controller, s (IMC "PID + lag"); the
   *  block can realise it as its PV filter (the same lag, in the feedback path) */
  filterTauS?: number;
  /** publication the rule comes from */
  source: string;
  /** design target, choice of parameters, and anything to watch */
  notes: string[];
}

export function tuning(
  rule: string,
  controller: ControllerType,
  form: TuningForm,
  kc: number,
  tiS: number,
  tdS: number,
  source: string,
  notes: string[] = [],
): Tuning {
  return { rule, controller, form, kc, tiS, tdS, source, notes };
}

/** Refusal of a rule for a model it is not defined for (never NaN). */
export interface RuleRefusal {
  rule: string;
  refused: true;
  reason: string;
  /** the rule simply has no setting for this controller type (not an input problem) */
  notDefined?: true;
}

export type RuleResult = Tuning | RuleRefusal;

export function isRefusal(r: RuleResult): r is RuleRefusal {
  return (r as RuleRefusal).refused === true;
}

export function refuse(rule: string, reason: string): RuleRefusal {
  return { rule, refused: true, reason };
}

/** The rule has no setting for this controller type. */
export function notDefined(rule: string, reason: string): RuleRefusal {
  return { rule, refused: true, reason, notDefined: true };
}
