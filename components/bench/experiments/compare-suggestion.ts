/**
 * The PI and PID to compare, from what the tests found: the rule last applied, asked again for
 * each controller type on the same test result (relay Ku/Pu or the bump model), in the standard
 * form the comparison's fields use. Null when nothing was applied or the rule refuses one side.
 */
import { controllerConfigSchema, type ControllerConfig } from "@/sim/control/config";
import { propose } from "@/sim/tuning/proposal";
import type { BenchFindings } from "../store";

export interface ComparePair {
  pi: { kc: number; ti: number };
  pid: { kc: number; ti: number; td: number };
  /** the rule both came from */
  rule: string;
  source: "relay" | "bump";
}

const round = (x: number) => +x.toPrecision(3);

export function comparePair(f: BenchFindings, base: ControllerConfig): ComparePair | null {
  const applied = f.applied;
  if (!applied) return null;
  const ultimate = applied.source === "relay" && f.relay ? { ku: f.relay.ku, puS: f.relay.puS } : undefined;
  const model = applied.model ?? (applied.source === "bump" ? (f.bumpModel ?? undefined) : undefined) ?? undefined;
  if (!ultimate && !model) return null;
  const standard = controllerConfigSchema.parse({ ...base, form: "standard" });
  const one = (controller: "PI" | "PID") => {
    const rec = propose({ ultimate, model, rule: applied.rule, controller, form: "standard", base: standard }).recommended;
    return "refused" in rec || !rec.controllerConfig ? null : rec.controllerConfig;
  };
  const pi = one("PI");
  const pid = one("PID");
  if (!pi || !pid) return null;
  return { pi: { kc: round(pi.kc), ti: round(pi.ti) }, pid: { kc: round(pid.kc), ti: round(pid.ti), td: round(pid.td) }, rule: applied.rule, source: applied.source };
}
