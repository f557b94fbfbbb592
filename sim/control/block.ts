/**
 * The controller block the runner calls once per sample: PV filter → (PID or on/off) → output
 * limits, with auto/manual, setpoint tracking and bad-PV handling around it.
 *
 * Bumpless transfer (Åström & Hägglund 1995, ch. 3 "bumpless parameter changes" and mode
 * switching by integrator tracking): whenever OUT has been imposed from outside (start-up,
 * manual, bad PV, retune), the first automatic sample sets I = OUT_prev − P − D, so OUT continues
 * from where it was and only then moves with the error.
 *
 * Policies fixed here:
 * - manual: OUT = the manual output, clamped to the output limits; no rate limit (the operator
 *   moves it). A bad PV does not override manual. setManualOutput() in auto is ignored;
 *   switching to manual starts from the current OUT.
 * - bad PV in auto: "hold" keeps the last OUT; "safe-output" goes to safeOutputPct at once (no
 *   rate limit: it is a safety action). The PV filter holds while PV is bad and restarts from the
 *   first good sample (the held value is stale); derivative history restarts too.
 * - on/off ignores the rate limit (a relay cannot ramp) but respects the output limits.
 */
import type { ControllerConfig, ControllerMode, ControllerState } from "./config";
import { DiscretePid, clamp } from "./pid";
import { OnOffSwitch } from "./onoff";
import { PvFilter } from "./pv-filter";

export interface ControllerInit {
  out: number;
  mode: ControllerMode;
  sp: number;
  pv: number;
}

export class ControllerBlock {
  private cfg: ControllerConfig;
  private pid: DiscretePid | null = null;
  private relay: OnOffSwitch | null = null;
  private readonly filter: PvFilter;
  private manualOut: number;
  /** Next automatic sample re-initialises the integral (bumpless). */
  private reinit = true;
  /** Previous sample had a bad PV: restart filter and derivative on the next good one. */
  private wasBad = false;
  private readonly st: ControllerState;

  constructor(cfg: ControllerConfig, init: ControllerInit) {
    this.cfg = cfg;
    const out = clamp(init.out, cfg.outMinPct, cfg.outMaxPct);
    this.filter = new PvFilter(cfg.pvFilterTauS, cfg.sampleTimeS, init.pv);
    this.manualOut = out;
    this.st = { out, pvFiltered: init.pv, sp: init.sp, mode: init.mode, pvBad: false, p: 0, i: out, d: 0 };
    this.buildCore(init.sp, init.pv, out);
  }

  /** Live state of the block (updated in place every sample; copy it to keep a snapshot). */
  get state(): Readonly<ControllerState> {
    return this.st;
  }

  get config(): Readonly<ControllerConfig> {
    return this.cfg;
  }

  private buildCore(sp: number, pv: number, out: number): void {
    const cfg = this.cfg;
    if (cfg.kind === "pid") {
      this.relay = null;
      this.pid = new DiscretePid(cfg, sp, pv);
      this.pid.integral = out;
    } else {
      this.pid = null;
      this.relay = new OnOffSwitch(cfg.hysteresisC, cfg.action === "reverse", out > (cfg.outOnPct + cfg.outOffPct) / 2);
    }
  }

  /** One sample: returns OUT (%) for this sample. */
  update(pvMeasured: number, pvBad: boolean): number {
    const cfg = this.cfg;
    const st = this.st;
    st.pvBad = pvBad;
    if (!pvBad) {
      if (this.wasBad) {
        this.filter.reset(pvMeasured);
        if (this.pid) this.pid.resyncDerivative(st.sp, pvMeasured);
      } else {
        this.filter.update(pvMeasured);
      }
      st.pvFiltered = this.filter.value;
    }
    const y = st.pvFiltered;
    let u: number;

    if (st.mode === "manual") {
      if (cfg.spTrackInManual && !pvBad) st.sp = y;
      u = this.manualOut;
      if (this.pid) {
        if (pvBad) this.pid.holdAt(u);
        else this.pid.track(st.sp, y, u);
      }
      if (this.relay) this.relay.on = u > (cfg.outOnPct + cfg.outOffPct) / 2;
      this.reinit = true;
    } else if (pvBad) {
      u = cfg.badPvPolicy === "hold" ? st.out : cfg.safeOutputPct;
      if (this.pid) this.pid.holdAt(u);
      this.reinit = true;
    } else if (this.pid) {
      u = this.pid.step(st.sp, y, st.out, this.reinit);
      this.reinit = false;
    } else {
      const on = this.relay!.update(st.sp, y);
      u = clamp(on ? cfg.outOnPct : cfg.outOffPct, cfg.outMinPct, cfg.outMaxPct);
      this.reinit = false;
    }

    this.wasBad = pvBad;
    st.out = u;
    if (this.pid) {
      st.p = this.pid.proportional;
      st.d = this.pid.derivative;
      st.i = this.pid.integralUsed; // P + I + D is the unlimited output; it exceeds OUT when limited (windup shows here)
    } else {
      st.p = 0;
      st.i = 0;
      st.d = 0;
    }
    return u;
  }

  setSetpoint(sp: number): void {
    this.st.sp = sp;
  }

  /** Switch mode, bumpless both ways: to manual keeps the current OUT; to auto re-initialises the integral. */
  setMode(mode: ControllerMode): void {
    if (mode === this.st.mode) return;
    if (mode === "manual") this.manualOut = this.st.out;
    else this.reinit = true;
    this.st.mode = mode;
  }

  /** Set OUT in manual (clamped to the output limits); ignored in auto. */
  setManualOutput(out: number): void {
    if (this.st.mode !== "manual") return;
    this.manualOut = clamp(out, this.cfg.outMinPct, this.cfg.outMaxPct);
  }

  /** New tuning, bumpless: the next automatic sample re-initialises the integral so OUT does not jump. */
  retune(cfg: ControllerConfig): void {
    const kindChanged = cfg.kind !== this.cfg.kind;
    this.cfg = cfg;
    this.filter.reconfigure(cfg.pvFilterTauS, cfg.sampleTimeS);
    this.manualOut = clamp(this.manualOut, cfg.outMinPct, cfg.outMaxPct);
    if (kindChanged) this.buildCore(this.st.sp, this.st.pvFiltered, this.st.out);
    else if (this.pid) this.pid.reconfigure(cfg);
    else this.relay!.reconfigure(cfg.hysteresisC, cfg.action === "reverse");
    this.reinit = true;
  }
}
