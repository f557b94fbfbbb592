/**
 * Discrete PID in the standard (ideal) form with setpoint weights, derivative filter and
 * anti-windup, after Åström & Hägglund (PID Controllers: Theory, Design, and Tuning, 2nd ed.,
 * ISA 1995, ch. 3; also Åström & Wittenmark, Computer-Controlled Systems):
 *
 *   P(k)   = Kc (b·r − y)
 *   D(k)   = ad·D(k−1) + bd·[(c·r(k) − y(k)) − (c·r(k−1) − y(k−1))],
 *            ad = Td/(Td + N h), bd = Kc Td N/(Td + N h)        (backward difference, filter Td/N)
 *   v(k)   = P + I + D,   u(k) = limits(v(k))
 *   I(k+1) = I(k) + (Kc h/Ti) e(k) + (h/Tt)(u(k) − v(k))       (integral updated after the output;
 *            the last term is back-calculation; e = r − y)
 *
 * (The discrete form is as recalled from A&H; references §13 tags it MEMORY. Its coefficients are
 * checked in the tests against the computed values for Kc = 2, Td = 1, N = 10, h = 0.1.)
 *
 * Signs: every term is multiplied by the action sign (+1 reverse, −1 direct).
 * Deadband: the error in P and I passes through a dead zone of ±deadband (continuous, no jump).
 */
import type { ControllerConfig } from "./config";
import { toIdeal } from "./forms";

/** Coefficients of the discrete law, from a configuration (pure; exported for tests and display). */
export interface PidCoefficients {
  sign: number;
  kc: number;
  ti: number;
  td: number;
  /** Integral increment per unit error: Kc h / Ti (0 without integral action). */
  bi: number;
  /** Derivative filter pole: Td / (Td + N h). */
  ad: number;
  /** Derivative gain per unit change: Kc Td N / (Td + N h). */
  bd: number;
  /** Back-calculation gain h / Tt, capped at 1 (a larger value would over-correct within one sample). */
  br: number;
  /** Tracking time used, s (Infinity when back-calculation is inactive). */
  tt: number;
  b: number;
  c: number;
}

/** Default tracking time: √(Ti·Td) for PID, Ti for PI (Åström & Hägglund 1995: Td < Tt < Ti). */
export function defaultTrackingTime(ti: number, td: number): number {
  if (ti === 0) return Infinity;
  return td > 0 ? Math.sqrt(ti * td) : ti;
}

/** Discrete-law coefficients for a configuration (A&H 1995, ch. 3 discretisation). */
export function pidCoefficients(cfg: ControllerConfig): PidCoefficients {
  const { kc, ti, td } = toIdeal(cfg.form, cfg);
  const h = cfg.sampleTimeS;
  const n = cfg.derivativeFilterN;
  const ad = td > 0 ? td / (td + n * h) : 0;
  const bd = td > 0 ? (kc * td * n) / (td + n * h) : 0;
  const bi = ti > 0 ? (kc * h) / ti : 0;
  let tt = Infinity;
  if (cfg.antiWindup === "back-calculation" && ti > 0) tt = cfg.trackingTimeS > 0 ? cfg.trackingTimeS : defaultTrackingTime(ti, td);
  const br = Number.isFinite(tt) ? Math.min(1, h / tt) : 0;
  return {
    sign: cfg.action === "reverse" ? 1 : -1,
    kc,
    ti,
    td,
    bi,
    ad,
    bd,
    br,
    tt,
    b: cfg.setpointWeightB,
    c: cfg.derivativeOn === "pv" ? 0 : cfg.setpointWeightC,
  };
}

/** Dead zone: 0 inside ±db, shifted toward 0 by db outside (continuous). */
export function deadZone(e: number, db: number): number {
  if (db <= 0) return e;
  return e > db ? e - db : e < -db ? e + db : 0;
}

/** Clamp to [lo, hi]. */
export function clamp(x: number, lo: number, hi: number): number {
  return x < lo ? lo : x > hi ? hi : x;
}

/**
 * The PID law with its state (I, D, previous derivative signal). The controller block decides
 * mode, bad-PV and setpoint handling and calls one of step() or track() each sample.
 */
export class DiscretePid {
  private k: PidCoefficients;
  private antiWindup: ControllerConfig["antiWindup"];
  private outMin: number;
  private outMax: number;
  private rateStep: number;
  private deadband: number;
  /** Integral state, % of output: I(k+1) after step(), i.e. what the next sample will use. */
  integral = 0;
  /** Integral term used in the last sample's output, % (so P + I + D = the unlimited output v). */
  integralUsed = 0;
  /** Derivative term D(k), %. */
  derivative = 0;
  /** Proportional term of the last sample, %. */
  proportional = 0;
  /** c·r − y at the previous sample (the derivative's input). */
  private dInputOld: number;

  constructor(cfg: ControllerConfig, sp: number, pv: number) {
    this.k = pidCoefficients(cfg);
    this.antiWindup = cfg.antiWindup;
    this.outMin = cfg.outMinPct;
    this.outMax = cfg.outMaxPct;
    this.rateStep = cfg.outRateLimitPctPerS * cfg.sampleTimeS;
    this.deadband = cfg.deadbandC;
    this.dInputOld = this.k.c * sp - pv;
  }

  get coefficients(): Readonly<PidCoefficients> {
    return this.k;
  }

  /** New parameters; I, D and the derivative history are kept (the block re-initialises I for bumpless retune). */
  reconfigure(cfg: ControllerConfig): void {
    this.k = pidCoefficients(cfg);
    this.antiWindup = cfg.antiWindup;
    this.outMin = cfg.outMinPct;
    this.outMax = cfg.outMaxPct;
    this.rateStep = cfg.outRateLimitPctPerS * cfg.sampleTimeS;
    this.deadband = cfg.deadbandC;
  }

  /** P term: Kc·sign·(dz(e) + (b − 1)·r), which is Kc·sign·(b·r − y) without deadband. */
  private proportionalTerm(r: number, y: number): number {
    const k = this.k;
    return k.sign * k.kc * (deadZone(r - y, this.deadband) + (k.b - 1) * r);
  }

  /** Filtered backward-difference derivative (A&H 1995, ch. 3). Updates the derivative state. */
  private derivativeTerm(r: number, y: number): number {
    const k = this.k;
    const dIn = k.c * r - y;
    this.derivative = k.ad * this.derivative + k.sign * k.bd * (dIn - this.dInputOld);
    this.dInputOld = dIn;
    return this.derivative;
  }

  /** Forget derivative history (after a gap in valid PV) so the first valid sample gives no kick. */
  resyncDerivative(r: number, y: number): void {
    this.dInputOld = this.k.c * r - y;
    this.derivative = 0;
  }

  /**
   * One automatic sample. `uPrev` is last sample's OUT (for the rate limit and bumpless
   * re-initialisation); with `reinit` the integral is set so that v = uPrev before limiting.
   */
  step(r: number, y: number, uPrev: number, reinit: boolean): number {
    const k = this.k;
    const p = this.proportionalTerm(r, y);
    const d = this.derivativeTerm(r, y);
    this.proportional = p;
    if (reinit) this.integral = uPrev - p - d;
    this.integralUsed = this.integral;
    const v = p + this.integral + d;
    let u = clamp(v, this.outMin, this.outMax);
    if (this.rateStep > 0) u = clamp(u, uPrev - this.rateStep, uPrev + this.rateStep);
    // Integral after the output (A&H): forward increment, then anti-windup.
    const di = k.sign * k.bi * deadZone(r - y, this.deadband);
    switch (this.antiWindup) {
      case "back-calculation":
        this.integral += di + k.br * (u - v);
        break;
      case "conditional":
        // Integrate unless the output is limited and this increment pushes further into the limit.
        if (!((v > u && di > 0) || (v < u && di < 0))) this.integral += di;
        break;
      case "none":
        this.integral += di;
        break;
    }
    return u;
  }

  /** A sample without a usable PV: P and D keep their last values, I tracks u − P − D. */
  holdAt(u: number): void {
    this.integral = u - this.proportional - this.derivative;
    this.integralUsed = this.integral;
  }

  /**
   * A sample while OUT is imposed from outside (manual): P and D follow the PV so that
   * the derivative has no stale history, and I is back-calculated as u − P − D (tracking).
   */
  track(r: number, y: number, u: number): void {
    this.proportional = this.proportionalTerm(r, y);
    this.derivativeTerm(r, y);
    this.integral = u - this.proportional - this.derivative;
    this.integralUsed = this.integral;
  }
}
