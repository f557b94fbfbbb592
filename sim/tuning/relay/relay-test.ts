/**
 * A closed-loop relay test (Åström & Hägglund 1984) run on the engine's stepping API.
 *
 * Sequence, one controller sample per step():
 *  1. quiet window: the loop is held in manual at its present OUT (switched bumplessly if it was
 *     in auto) and the PV the controller sees (after the PV filter) is recorded; its detrended
 *     standard deviation σ is the noise the relay will face. Warnings: hysteresis ε < 3σ
 *     (Bequette §11.3 advises 2–3σ), PV not near SP, PV drifting.
 *  2. kick: OUT is set to the high level for one sample, so the relay starts "on".
 *  3. relay: the controller block itself is retuned to on/off between the high and low levels
 *     with a band of total width 2ε around SP, in auto. Using the block's own on/off (a "tuning"
 *     action) keeps the relay on the same PV, at the same sample instants, in the action log.
 *     Every OUT change is a switch; one settling cycle is discarded, then `cycles` cycles are
 *     measured. A half-period shorter than a few samples or than the sensor's lag is a
 *     noise-driven crossing: the test aborts and says so.
 *  4. return: manual at the mean relay OUT (the output that holds PV around SP) with the original
 *     tuning for one sample, then the original mode: the block re-initialises its integral from
 *     that OUT, so the hand-back is bumpless. The original SP is restored if SP tracking moved it.
 *
 * Results: d = (high − low)/2 (an asymmetric relay when a level is clipped; its bias is reported),
 * Pu = mean of (high half-period + low half-period), a = mean over cycles of (max − min)/2 of the
 * PV the controller sees, Ku by the hysteresis convention of describing-function.ts. The FOPDT
 * estimate takes its gain from the power curve (the engine's steady-state temperature at the
 * mean relay OUT ± 1 %) unless `gainSource: "test-means"`, which uses (mean PV − PV at start) /
 * (mean OUT − OUT at start) and needs an asymmetric relay to carry information.
 */
import { controllerConfigSchema, type ControllerConfig } from "../../control/config";
import type { Simulation, SampleSnapshot } from "../../drill/simulation";
import { steadyStateTemperatureC } from "../../plant/derived-figures";
import type { FopdtModel } from "../models";
import { detrendedSigma } from "../identify/noise-estimate";
import { propose, type Proposal } from "../proposal";
import type { BlockForm } from "../rules/form-conversion";
import type { ControllerType } from "../rules/tuning";
import { filterNoiseFactor, recommendSampleTimeAndFilter, type SampleTimeAndFilter } from "../rules/sample-time-and-filter";
import { hysteresisRelayUltimateGain, idealRelayUltimateGain } from "./describing-function";
import { fopdtFromUltimate } from "./fopdt-relations";

export interface RelayTestOptions {
  /** relay amplitude around the present OUT, %; default 10 */
  amplitudePercent?: number;
  /** explicit relay levels, % (override the amplitude) */
  highPercent?: number;
  lowPercent?: number;
  /** ε, °C: the relay switches when PV passes SP ± ε; default max(3σ of the quiet window, 0.05 °C) */
  hysteresisC?: number;
  /** cycles discarded before measuring; default 1. Settling is extended (up to maxSettlingCycles)
   *  while a cycle's period or amplitude still differs from the previous one's by more than 3 % / 5 %
   *  (an oscillation that is still building up, as on a plant with little dead time) */
  settlingCycles?: number;
  /** default 10 */
  maxSettlingCycles?: number;
  /** cycles measured and averaged; default 3 */
  cycles?: number;
  /** abort if the relay has not finished within this time, s; default 14400 */
  timeLimitS?: number;
  /** quiet window before the relay, s; default max(20 samples, 30 s) */
  quietWindowS?: number;
  /** stop before the relay when ε < 3σ; default false (warn and go on) */
  stopOnNoiseWarning?: boolean;
  /** a half-period shorter than this many samples is noise-driven; default 4 */
  minHalfPeriodSamples?: number;
  /** sensor element lag, s; default the plant definition's */
  sensorLagS?: number;
  /** |PV − SP| above this at the start gives a warning, °C; default max(4ε, 1) */
  nearSetpointC?: number;
  /** set this SP before the test */
  setpointC?: number;
  gainSource?: "power-curve" | "test-means";
  rule?: string;
  controller?: ControllerType;
  form?: BlockForm;
}

export type RelayPhase = "quiet" | "kick" | "relay" | "returning" | "done" | "aborted";
export type RelayAbortCode = "noise" | "noise-warning" | "time-limit" | "bad-pv" | "cutout" | "no-room" | "setpoint-changed" | "cancelled";

export interface RelayProgress {
  phase: RelayPhase;
  timeS: number;
  crossings: number;
  halfPeriodsS: number[];
  /** amplitude of the last complete cycle, °C */
  amplitudeC: number | null;
  /** running estimates from the cycles completed so far (settling cycle included until measured ones exist) */
  kuEstimate: number | null;
  puEstimateS: number | null;
  cyclesMeasured: number;
}

export interface RelayStart {
  timeS: number;
  mode: "auto" | "manual";
  setpointC: number;
  pvFilteredC: number;
  outPercent: number;
  /** SP follows PV in manual (spTrackInManual): the relay centre is the SP as tracked at the start */
  setpointTracksPv: boolean;
  /** the SP the relay switched around, °C */
  relayCentreC: number;
  /** σ of the PV the controller sees over the quiet window, °C */
  noiseSigmaC: number;
  driftCPerMin: number;
}

export interface RelayResult {
  ok: true;
  start: RelayStart;
  highPercent: number;
  lowPercent: number;
  /** d = (high − low)/2, % */
  dPercent: number;
  /** (high + low)/2 − OUT at start, %: non-zero when a level was clipped */
  biasPercent: number;
  hysteresisC: number;
  /** cycles discarded before the measured ones (more than asked when the oscillation was still building up) */
  settlingCyclesUsed: number;
  /** a, °C */
  amplitudeC: number;
  /** PV oscillation centre minus SP, °C (a biased relay shifts it) */
  centreOffsetC: number;
  highHalfPeriodS: number;
  lowHalfPeriodS: number;
  puS: number;
  /** Ku = 4d/(π√(a² − ε²)) */
  ku: number;
  /** 4d/(πa), the other convention */
  kuIdealFormula: number;
  kuConvention: string;
  meanOutPercent: number;
  meanPvC: number;
  fopdt: { model: FopdtModel; gainSource: "power-curve" | "test-means" } | { model: null; reason: string };
  proposal: Proposal;
  /** sample time and PV filter for the FOPDT estimate and the raw noise (the quiet window's σ
   *  with the present filter taken out); null without an FOPDT estimate */
  sampleTimeAndFilter: SampleTimeAndFilter | null;
  returned: { outPercent: number; mode: "auto" | "manual"; setpointC: number };
  warnings: string[];
  durationS: number;
}

export interface RelayAbort {
  ok: false;
  code: RelayAbortCode;
  message: string;
  start: RelayStart | null;
  progress: RelayProgress;
  warnings: string[];
}

export type RelayOutcome = RelayResult | RelayAbort;

function r3(x: number): string {
  return String(+x.toPrecision(3));
}

/** Round up to two significant digits (a default hysteresis must not fall below 3σ by rounding). */
function roundUp2(x: number): number {
  if (!(x > 0)) return 0;
  const e = 10 ** (Math.floor(Math.log10(x)) - 1);
  return Math.ceil(x / e - 1e-9) * e;
}

export class RelayTest {
  private phaseValue: RelayPhase = "quiet";
  private readonly o: Required<Pick<RelayTestOptions, "amplitudePercent" | "settlingCycles" | "maxSettlingCycles" | "cycles" | "timeLimitS" | "minHalfPeriodSamples">> & RelayTestOptions;
  /** index of the first measured cycle (cycle c spans half-periods 2c and 2c + 1) */
  private measureFrom: number;
  private readonly ts: number;
  private readonly originalConfig: ControllerConfig;
  private readonly mode0: "auto" | "manual";
  private readonly sp0: number;
  private readonly out0: number;
  private readonly t0: number;
  private readonly quietSamples: number;
  private readonly sensorLag: number;
  private quietT: number[] = [];
  private quietPv: number[] = [];
  private start: RelayStart | null = null;
  private high = 0;
  private low = 0;
  private eps = 0;
  private relayStartS = 0;
  private lastOut = NaN;
  private switchTimes: number[] = [];
  private switchRows: number[] = [];
  private rowT: number[] = [];
  private rowPv: number[] = [];
  private rowOut: number[] = [];
  private warnings: string[] = [];
  private returnStage = 0;
  private holdOut = 0;
  private outcomeValue: RelayOutcome | null = null;
  private pendingResult: Omit<RelayResult, "returned" | "durationS"> | null = null;
  private pendingAbort: Omit<RelayAbort, "progress"> | null = null;

  constructor(readonly sim: Simulation, options: RelayTestOptions = {}) {
    const defined = Object.fromEntries(Object.entries(options).filter(([, v]) => v !== undefined)) as RelayTestOptions;
    this.o = { amplitudePercent: 10, settlingCycles: 1, maxSettlingCycles: 10, cycles: 3, timeLimitS: 14400, minHalfPeriodSamples: 4, ...defined };
    this.measureFrom = this.o.settlingCycles;
    this.ts = sim.sampleTimeS;
    this.originalConfig = sim.controllerConfig;
    const st = sim.controllerState;
    this.mode0 = st.mode;
    this.sp0 = options.setpointC ?? st.sp;
    this.out0 = st.out;
    this.t0 = sim.timeS;
    this.quietSamples = Math.max(20, Math.ceil((options.quietWindowS ?? 30) / this.ts));
    this.sensorLag = options.sensorLagS ?? sim.plantDefinition.sensorTimeConstantS;
    if (st.mode === "auto") sim.act({ type: "mode", mode: "manual" });
    if (options.setpointC !== undefined) sim.act({ type: "setpoint", setpointC: options.setpointC });
  }

  get phase(): RelayPhase {
    return this.phaseValue;
  }
  get finished(): boolean {
    return this.phaseValue === "done" || this.phaseValue === "aborted";
  }
  get outcome(): RelayOutcome | null {
    return this.outcomeValue;
  }

  get progress(): RelayProgress {
    const hp = this.halfPeriods();
    const measuredFrom = 2 * this.measureFrom;
    const cycleCount = Math.floor(hp.length / 2);
    let amp: number | null = null;
    let ku: number | null = null;
    let pu: number | null = null;
    if (cycleCount > 0) {
      const c = cycleCount - 1;
      amp = this.cycleAmplitude(c);
      pu = hp[2 * c] + hp[2 * c + 1];
      ku = hysteresisRelayUltimateGain((this.high - this.low) / 2, amp, this.eps);
    }
    return {
      phase: this.phaseValue,
      timeS: this.sim.timeS,
      crossings: this.switchTimes.length,
      halfPeriodsS: hp,
      amplitudeC: amp,
      kuEstimate: ku,
      puEstimateS: pu,
      cyclesMeasured: Math.max(0, Math.floor((hp.length - measuredFrom) / 2)),
    };
  }

  /** Abandon the test and hand the loop back. */
  cancel(): void {
    if (this.finished || this.pendingAbort || this.pendingResult) return;
    this.beginAbort("cancelled", "relay test cancelled by the operator; the loop is handed back at its starting output");
  }

  /** Run to the end (or abort); returns the outcome. */
  run(onProgress?: (p: RelayProgress) => void, progressEverySamples = 1000): RelayOutcome {
    let n = 0;
    while (!this.finished) {
      this.step();
      if (onProgress && ++n % progressEverySamples === 0) onProgress(this.progress);
    }
    return this.outcomeValue!;
  }

  /** Process one controller sample. */
  step(): RelayPhase {
    switch (this.phaseValue) {
      case "quiet":
        this.stepQuiet();
        break;
      case "kick":
        this.stepKick();
        break;
      case "relay":
        this.stepRelay();
        break;
      case "returning":
        this.stepReturn();
        break;
      default:
        break;
    }
    return this.phaseValue;
  }

  private halfPeriods(): number[] {
    const s = this.switchTimes;
    const out: number[] = [];
    for (let i = 1; i < s.length; i++) out.push(s[i] - s[i - 1]);
    return out;
  }

  /** (max − min)/2 of the PV the controller sees over cycle c (half-periods 2c and 2c + 1). */
  private cycleAmplitude(c: number): number {
    const from = this.switchRows[2 * c];
    const to = this.switchRows[2 * c + 2];
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = from; i < to; i++) {
      lo = Math.min(lo, this.rowPv[i]);
      hi = Math.max(hi, this.rowPv[i]);
    }
    return (hi - lo) / 2;
  }

  /** Cycles a and b agree within 3 % in period and 5 % in amplitude. */
  private similarCycles(a: number, b: number): boolean {
    const hp = this.halfPeriods();
    const pa = hp[2 * a] + hp[2 * a + 1];
    const pb = hp[2 * b] + hp[2 * b + 1];
    const aa = this.cycleAmplitude(a);
    const ab = this.cycleAmplitude(b);
    return Math.abs(pa - pb) <= 0.03 * pa && Math.abs(aa - ab) <= 0.05 * aa;
  }

  private stepQuiet(): void {
    this.sim.step();
    const s = this.sim.snapshot();
    this.quietT.push(s.timeS);
    this.quietPv.push(s.pvFilteredC);
    if (s.pvBad) return this.beginAbort("bad-pv", "the PV is bad (sensor failure level): a relay test needs a working sensor");
    if (this.quietT.length < this.quietSamples) return;

    const st = this.sim.controllerState;
    const noise = detrendedSigma(this.quietT, this.quietPv);
    const tracks = this.originalConfig.spTrackInManual;
    const centre = st.sp;
    this.eps = this.o.hysteresisC ?? Math.max(0.05, roundUp2(3 * noise.sigma));
    if (this.o.hysteresisC === undefined) this.warnings.push(`hysteresis ε set to ${r3(this.eps)} °C (3σ of the PV noise, at least 0.05 °C)`);
    const pvNow = s.pvFilteredC;
    this.start = {
      timeS: this.t0,
      mode: this.mode0,
      setpointC: this.sp0,
      pvFilteredC: pvNow,
      outPercent: this.out0,
      setpointTracksPv: tracks,
      relayCentreC: centre,
      noiseSigmaC: noise.sigma,
      driftCPerMin: noise.slope * 60,
    };
    if (tracks)
      this.warnings.push(`SP tracks PV in manual: the relay switches around the SP as tracked at the start, ${r3(centre)} °C (the PV then), not around ${r3(this.sp0)} °C`);
    const near = this.o.nearSetpointC ?? Math.max(4 * this.eps, 1);
    if (Math.abs(pvNow - centre) > near)
      this.warnings.push(
        `PV (${r3(pvNow)} °C) is ${r3(Math.abs(pvNow - centre))} °C from SP (${r3(centre)} °C): bring the loop near its operating point in manual first (the power curve gives the OUT that holds SP); the relay result belongs to the point where it oscillates`,
      );
    // a real trend (beyond 3 standard errors of the slope) that would move PV past the band in 10 min
    const driftOverWindow = Math.abs(noise.slope) * 600;
    if (Math.abs(noise.slope) > 3 * noise.slopeStdError && driftOverWindow > Math.max(near, 3 * noise.sigma)) this.warnings.push(`PV is drifting (${r3(noise.slope * 60)} °C/min): the process is not steady at the start`);
    if (this.eps < 3 * noise.sigma) {
      const msg = `hysteresis ε = ${r3(this.eps)} °C is less than 3σ of the PV noise (σ = ${r3(noise.sigma)} °C): noise may switch the relay; add a PV filter or widen the hysteresis to at least ${r3(3 * noise.sigma)} °C`;
      this.warnings.push(msg);
      if (this.o.stopOnNoiseWarning) return this.beginAbort("noise-warning", msg);
    }

    const cfg = this.originalConfig;
    const lo = Math.max(cfg.outMinPct, 0);
    const hi = Math.min(cfg.outMaxPct, 100);
    this.high = Math.min(hi, this.o.highPercent ?? this.out0 + this.o.amplitudePercent);
    this.low = Math.max(lo, this.o.lowPercent ?? this.out0 - this.o.amplitudePercent);
    if (!(this.high - this.low > 0.5))
      return this.beginAbort("no-room", `the relay has no room: high ${r3(this.high)} % and low ${r3(this.low)} % (OUT is at a limit); move OUT away from its limits first`);
    const bias = (this.high + this.low) / 2 - this.out0;
    if (Math.abs(bias) > 1e-9)
      this.warnings.push(`relay levels clipped to ${r3(this.low)}–${r3(this.high)} %: asymmetric around the starting OUT (bias ${r3(bias)} %); d = (high − low)/2 and Pu is the sum of the two half-periods`);
    this.sim.act({ type: "manual-output", outPercent: this.high });
    this.phaseValue = "kick";
  }

  private stepKick(): void {
    this.sim.step();
    const relayCfg = controllerConfigSchema.parse({
      ...this.originalConfig,
      kind: "onoff",
      outOnPct: this.high,
      outOffPct: this.low,
      hysteresisC: 2 * this.eps,
    });
    this.sim.act({ type: "tuning", controller: relayCfg });
    this.sim.act({ type: "mode", mode: "auto" });
    // with SP tracking, the kick sample (still manual) moved SP to the PV once more: pin it back
    this.sim.act({ type: "setpoint", setpointC: this.start!.relayCentreC });
    this.relayStartS = this.sim.timeS;
    this.lastOut = this.high;
    this.phaseValue = "relay";
  }

  private stepRelay(): void {
    this.sim.step();
    const s: SampleSnapshot = this.sim.snapshot();
    const row = this.rowT.length;
    this.rowT.push(s.timeS);
    this.rowPv.push(s.pvFilteredC);
    this.rowOut.push(s.outPercent);
    if (s.pvBad) return this.beginAbort("bad-pv", "the PV went bad during the relay test (sensor failure level): test abandoned");
    if (s.cutoutTripped) return this.beginAbort("cutout", "the excess-temperature cutout tripped during the relay test: lower the relay amplitude");
    if (s.setpointC !== this.start!.relayCentreC)
      return this.beginAbort(
        "setpoint-changed",
        `the setpoint changed during the relay test (${r3(this.start!.relayCentreC)} → ${r3(s.setpointC)} °C, by an event or an operator): the oscillation no longer belongs to one operating point; test abandoned`,
      );
    if (s.outPercent !== this.lastOut) {
      this.lastOut = s.outPercent;
      this.switchTimes.push(s.timeS);
      this.switchRows.push(row);
      const n = this.switchTimes.length;
      if (n >= 2) {
        const h = this.switchTimes[n - 1] - this.switchTimes[n - 2];
        const minH = this.o.minHalfPeriodSamples * this.ts;
        if (h < minH - 1e-9 || (this.sensorLag > 0 && h < this.sensorLag)) {
          const why = h < minH - 1e-9 ? `only ${Math.round(h / this.ts)} sample(s)` : `shorter than the sensor's own lag (${r3(this.sensorLag)} s)`;
          return this.beginAbort(
            "noise",
            `noise is switching the relay: a half-period lasted ${r3(h)} s, ${why}, far too short for this plant. ` +
              `The PV noise (σ ≈ ${r3(this.start?.noiseSigmaC ?? 0)} °C) crosses the hysteresis band (±${r3(this.eps)} °C), so the crossings are false and the numbers would be nonsense. ` +
              `Add a PV filter (about a quarter of the sensor lag is a good start) or widen the hysteresis beyond 3σ of the noise, then run the test again.`,
          );
        }
      }
      if (n % 2 === 1 && n >= 3) {
        const c = (n - 1) / 2 - 1; // the cycle that just completed
        if (c === this.measureFrom && c >= 1 && !this.similarCycles(c, c - 1)) {
          if (this.measureFrom < this.o.maxSettlingCycles) this.measureFrom++;
          else if (!this.warnings.some((w) => w.startsWith("the oscillation")))
            this.warnings.push(`the oscillation was still changing after ${this.measureFrom} settling cycles: Ku and Pu come from cycles that had not settled`);
        }
      }
      const needed = 2 * (this.measureFrom + this.o.cycles) + 1;
      if (n >= needed) return this.finishMeasurement();
    }
    if (s.timeS - this.relayStartS > this.o.timeLimitS)
      return this.beginAbort(
        "time-limit",
        `the relay did not complete ${this.o.cycles} cycles within ${r3(this.o.timeLimitS)} s (${this.switchTimes.length} crossings): raise the time limit or the relay amplitude, or check that OUT can move PV across SP`,
      );
  }

  private finishMeasurement(): void {
    const hp = this.halfPeriods();
    const first = 2 * this.measureFrom;
    const d = (this.high - this.low) / 2;
    let amp = 0;
    let highH = 0;
    let lowH = 0;
    // which half-periods are "high": the relay starts high, so switch 0 is high → low
    const startsHigh = this.rowOut[this.switchRows[0]] === this.low;
    for (let c = 0; c < this.o.cycles; c++) {
      const cc = this.measureFrom + c;
      amp += this.cycleAmplitude(cc) / this.o.cycles;
      const a = hp[2 * cc];
      const b = hp[2 * cc + 1];
      // half-period 2cc begins at switch 2cc: with startsHigh that switch goes to low
      if (startsHigh) {
        lowH += a / this.o.cycles;
        highH += b / this.o.cycles;
      } else {
        highH += a / this.o.cycles;
        lowH += b / this.o.cycles;
      }
    }
    const from = this.switchRows[first];
    const to = this.switchRows[first + 2 * this.o.cycles];
    let mo = 0;
    let mp = 0;
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = from; i < to; i++) {
      mo += this.rowOut[i] / (to - from);
      mp += this.rowPv[i] / (to - from);
      lo = Math.min(lo, this.rowPv[i]);
      hi = Math.max(hi, this.rowPv[i]);
    }
    const pu = highH + lowH;
    const ku = hysteresisRelayUltimateGain(d, amp, this.eps);
    const start = this.start!;
    const fopdt = this.estimateFopdt(ku, pu, mo, mp);
    const proposal = propose({
      ultimate: { ku, puS: pu },
      model: fopdt.model ?? undefined,
      rule: this.o.rule,
      controller: this.o.controller,
      form: this.o.form,
      base: this.originalConfig,
    });
    this.holdOut = mo;
    const cfg = this.originalConfig;
    const rawSigma = start.noiseSigmaC / filterNoiseFactor(cfg.pvFilterTauS, this.ts);
    const sampleTimeAndFilter = fopdt.model
      ? recommendSampleTimeAndFilter({ model: fopdt.model, noiseSigmaC: rawSigma, sensorLagS: this.sensorLag > 0 ? this.sensorLag : undefined, sampleTimeS: this.ts })
      : null;
    this.pendingResult = {
      ok: true,
      start,
      highPercent: this.high,
      lowPercent: this.low,
      dPercent: d,
      biasPercent: (this.high + this.low) / 2 - this.out0,
      hysteresisC: this.eps,
      settlingCyclesUsed: this.measureFrom,
      amplitudeC: amp,
      centreOffsetC: (hi + lo) / 2 - start.relayCentreC,
      highHalfPeriodS: highH,
      lowHalfPeriodS: lowH,
      puS: pu,
      ku,
      kuIdealFormula: idealRelayUltimateGain(d, amp),
      kuConvention: "Ku = 4d/(π√(a² − ε²)) (reciprocal of the real-axis projection of −1/N(a)); 4d/(πa) reported as kuIdealFormula",
      meanOutPercent: mo,
      meanPvC: mp,
      fopdt,
      proposal,
      sampleTimeAndFilter,
      warnings: this.warnings,
    };
    this.beginReturn();
  }

  private estimateFopdt(ku: number, pu: number, meanOut: number, meanPv: number): RelayResult["fopdt"] {
    const source = this.o.gainSource ?? "power-curve";
    let k: number;
    if (source === "power-curve") {
      const def = this.sim.plantDefinition;
      const u1 = Math.max(0, meanOut - 1);
      const u2 = Math.min(100, meanOut + 1);
      k = (steadyStateTemperatureC(def, u2) - steadyStateTemperatureC(def, u1)) / (u2 - u1);
    } else {
      const du = meanOut - this.out0;
      if (Math.abs(du) < 0.1 * ((this.high - this.low) / 2))
        return { model: null, reason: "the mean relay OUT equals the starting OUT (a symmetric relay carries no gain information); use the power curve" };
      k = (meanPv - (this.start?.pvFilteredC ?? meanPv)) / du;
    }
    if (this.originalConfig.action === "direct") k = -k;
    const f = fopdtFromUltimate(k, ku, pu);
    return f.ok ? { model: f.model, gainSource: source } : { model: null, reason: f.reason };
  }

  private beginAbort(code: RelayAbortCode, message: string): void {
    this.pendingAbort = { ok: false, code, message, start: this.start, warnings: this.warnings };
    this.holdOut = this.out0;
    this.beginReturn();
  }

  private beginReturn(): void {
    const sim = this.sim;
    sim.act({ type: "mode", mode: "manual" });
    sim.act({ type: "manual-output", outPercent: this.holdOut });
    if (sim.controllerConfig !== this.originalConfig) sim.act({ type: "tuning", controller: this.originalConfig });
    this.returnStage = 0;
    this.phaseValue = "returning";
  }

  private stepReturn(): void {
    const sim = this.sim;
    sim.step();
    if (this.returnStage === 0) {
      if (this.start?.setpointTracksPv && this.mode0 === "auto") sim.act({ type: "setpoint", setpointC: this.sp0 });
      if (this.mode0 === "auto") sim.act({ type: "mode", mode: "auto" });
      this.returnStage = 1;
      return;
    }
    const returned = { outPercent: this.holdOut, mode: this.mode0, setpointC: sim.controllerState.sp };
    if (this.pendingAbort) {
      this.outcomeValue = { ...this.pendingAbort, progress: this.progress };
      this.phaseValue = "aborted";
      this.outcomeValue.progress.phase = "aborted";
    } else if (this.pendingResult) {
      this.outcomeValue = { ...this.pendingResult, returned, durationS: sim.timeS - this.t0 };
      this.phaseValue = "done";
    }
  }
}
