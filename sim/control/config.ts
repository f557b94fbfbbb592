/**
 * Controller configuration, validated with zod. Units in field names: Kc in % output per °C,
 * times in seconds, temperatures in °C, outputs in %.
 *
 * Conventions (documented once, here):
 * - `ti = 0` means no integral action (JSON cannot carry Infinity); `td = 0` no derivative action.
 * - form "standard" (ISA ideal): u = Kc[e + (1/Ti)∫e dt + Td de/dt], using kc, ti, td.
 *   form "series" (interacting): u = Kc(1 + 1/(Ti s))(1 + Td s) e, using kc, ti, td.
 *   form "parallel": u = Kp e + Ki ∫e dt + Kd de/dt, using kc as Kp, ki (%/(°C·s)) and kd (%·s/°C);
 *   ti and td are ignored in this form.
 * - action "reverse" (heating): OUT rises when PV < SP, error e = SP − PV; "direct": e = PV − SP.
 * - derivativeOn "pv": D acts on −PV only (c = 0, no derivative kick); "error": D acts on c·SP − PV.
 * - anti-windup "back-calculation" with tracking time `trackingTimeS` (0 = default √(Ti·Td) for
 *   PID, Ti for PI, after Åström & Hägglund); "conditional": integration stops while the output
 *   is limited and the error would drive it further; "none": the integral winds up.
 * - deadband: errors with |SP − PV| ≤ deadbandC give no proportional or integral action beyond the
 *   band (the error is passed through a dead zone), so OUT stops drifting on small errors.
 * - on/off (reverse): OUT = outOnPct when PV < SP − hysteresisC/2, outOffPct when PV > SP + hysteresisC/2,
 *   unchanged in between (band centred on SP). Direct action mirrors this.
 */
import { z } from "zod";

export const controllerKindSchema = z.enum(["pid", "onoff"]);
export const pidFormSchema = z.enum(["standard", "parallel", "series"]);
export const controllerActionSchema = z.enum(["reverse", "direct"]);
export const antiWindupSchema = z.enum(["back-calculation", "conditional", "none"]);
export const badPvPolicySchema = z.enum(["hold", "safe-output"]);

export const controllerConfigSchema = z
  .object({
    kind: controllerKindSchema.default("pid").describe("PID or on/off control"),
    form: pidFormSchema.default("standard").describe("PID form: standard (ISA ideal), parallel (independent gains) or series (interacting)"),
    kc: z.number().min(0).max(1e4).default(2).describe("gain Kc, % output per °C (parallel form: Kp)"),
    ti: z.number().min(0).max(1e6).default(120).describe("integral (reset) time Ti, s; 0 = no integral action"),
    td: z.number().min(0).max(1e5).default(0).describe("derivative (rate) time Td, s; 0 = no derivative action"),
    ki: z.number().min(0).max(1e4).default(0).describe("parallel form only: integral gain, % per (°C·s)"),
    kd: z.number().min(0).max(1e6).default(0).describe("parallel form only: derivative gain, %·s per °C"),
    action: controllerActionSchema.default("reverse").describe("reverse (heating): OUT rises when PV < SP; direct: OUT rises when PV > SP"),
    derivativeOn: z.enum(["pv", "error"]).default("pv").describe("derivative on PV (no kick on SP changes) or on the weighted error c·SP − PV"),
    derivativeFilterN: z.number().min(1).max(100).default(10).describe("derivative filter: time constant Td/N"),
    setpointWeightB: z.number().min(0).max(1).default(1).describe("setpoint weight b in the P term"),
    setpointWeightC: z.number().min(0).max(1).default(1).describe("setpoint weight c in the D term (derivativeOn 'error' only)"),
    antiWindup: antiWindupSchema.default("back-calculation").describe("integrator anti-windup"),
    trackingTimeS: z.number().min(0).max(1e6).default(0).describe("back-calculation tracking time Tt, s; 0 = default"),
    outMinPct: z.number().min(-1e6).max(1e6).default(0).describe("lower output limit, % (wide limits allowed for textbook checks)"),
    outMaxPct: z.number().min(-1e6).max(1e6).default(100).describe("upper output limit, %"),
    outRateLimitPctPerS: z.number().min(0).default(0).describe("maximum |dOUT/dt| in auto, %/s; 0 = off"),
    deadbandC: z.number().min(0).default(0).describe("error deadband, °C"),
    pvFilterTauS: z.number().min(0).max(1e5).default(0).describe("first-order PV filter time constant, s; 0 = off"),
    sampleTimeS: z.number().positive().max(3600).default(0.1).describe("controller sample time h, s"),
    spTrackInManual: z.boolean().default(false).describe("in manual, SP follows the filtered PV"),
    badPvPolicy: badPvPolicySchema.default("hold").describe("on a bad PV (NE 43 failure level) in auto: hold the last OUT or go to safeOutputPct"),
    safeOutputPct: z.number().default(0).describe("OUT while PV is bad with policy 'safe-output', %"),
    hysteresisC: z.number().min(0).default(1).describe("on/off: total width of the switching band, °C"),
    outOnPct: z.number().default(100).describe("on/off: OUT when on, %"),
    outOffPct: z.number().default(0).describe("on/off: OUT when off, %"),
  })
  .refine((c) => c.outMaxPct > c.outMinPct, { message: "outMaxPct must exceed outMinPct", path: ["outMaxPct"] })
  .refine((c) => c.badPvPolicy !== "safe-output" || (c.safeOutputPct >= c.outMinPct && c.safeOutputPct <= c.outMaxPct), {
    message: "safeOutputPct must lie within the output limits",
    path: ["safeOutputPct"],
  })
  .refine((c) => !(c.form === "parallel" && c.kc === 0 && (c.ki > 0 || c.kd > 0)), {
    message: "parallel form needs Kp (kc) > 0 to express integral or derivative action in the standard form",
    path: ["kc"],
  });

export type ControllerConfig = z.infer<typeof controllerConfigSchema>;
/** What an author writes (every field optional). */
export type ControllerConfigInput = z.input<typeof controllerConfigSchema>;
export type ControllerMode = "auto" | "manual";

export interface ControllerState {
  /** OUT this sample, %. */
  out: number;
  /** PV after the PV filter, °C. */
  pvFiltered: number;
  sp: number;
  mode: ControllerMode;
  pvBad: boolean;
  /**
   * Proportional, integral and derivative terms this sample, % (0 for on/off). Their sum is the
   * unlimited output; OUT differs from it while the output is limited, so a winding-up integral
   * is visible in `i`. While OUT is imposed (manual, bad PV), i tracks OUT − P − D.
   */
  p: number;
  i: number;
  d: number;
}
