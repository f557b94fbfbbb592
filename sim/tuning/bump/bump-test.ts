/**
 * An open-loop bump test on the engine's stepping API: the loop is held in manual at its present
 * OUT (switched bumplessly if it was in auto), a stretch before the step is logged to show it was
 * steady, OUT is stepped, and the response is logged until the record is long enough; then the
 * record goes to identify/ and the loop is handed back (manual at the starting OUT, original mode).
 *
 * Logging is dense at first and sparser later (every sample for a while, then no closer than 2 %
 * of the time since the step): the fast part of the response, where the dead time is, keeps full
 * resolution, while a record several time constants long stays a few hundred rows. The
 * identification handles the irregular spacing exactly.
 * The PV logged is the one the controller sees (after the PV filter) unless `pvSignal: "raw"`, so
 * the identified model includes the filter the tuning has to live with.
 */
import type { Simulation } from "../../drill/simulation";
import { dominantTimeConstantS } from "../../plant/derived-figures";
import { identifyStepResponse, type Identification } from "../identify/identify-step";
import type { IdentifyRefusal } from "../identify/step-record";
import { propose, type Proposal } from "../proposal";
import type { BlockForm } from "../rules/form-conversion";
import type { ControllerType } from "../rules/tuning";
import { recommendSampleTimeAndFilter, type SampleTimeAndFilter } from "../rules/sample-time-and-filter";

export interface BumpTestOptions {
  /** OUT step, % (negative steps down); default +10, reversed if it would pass 100 % */
  stepPercent?: number;
  /** logged before the step, s; default max(60 s, 30 samples) */
  preStepS?: number;
  /** logged after the step, s; default 6 × the plant's dominant time constant, at most 12 h */
  responseS?: number;
  pvSignal?: "filtered" | "raw";
  rule?: string;
  controller?: ControllerType;
  form?: BlockForm;
}

export type BumpPhase = "pre-step" | "response" | "returning" | "done";

export interface BumpRecord {
  t: number[];
  out: number[];
  pv: number[];
}

export interface BumpProgress {
  phase: BumpPhase;
  timeS: number;
  rows: number;
  /** fraction of the planned record done, 0–1 */
  fraction: number;
}

export type BumpOutcome =
  | {
      ok: true;
      record: BumpRecord;
      stepPercent: number;
      identification: Identification;
      proposal: Proposal;
      /** for the identified model and the record's noise (filtered PV: the noise left after the present filter) */
      sampleTimeAndFilter: SampleTimeAndFilter;
      returned: { outPercent: number; mode: "auto" | "manual" };
    }
  | { ok: false; record: BumpRecord; refusal: IdentifyRefusal };

export class BumpTest {
  private phaseValue: BumpPhase = "pre-step";
  private readonly rec: BumpRecord = { t: [], out: [], pv: [] };
  private readonly out0: number;
  private readonly mode0: "auto" | "manual";
  private readonly sp0: number;
  private readonly preS: number;
  private readonly respS: number;
  private readonly t0: number;
  private readonly step0: number;
  private tStep = NaN;
  private lastLogged = -Infinity;
  private outcomeValue: BumpOutcome | null = null;
  private returnStage = 0;

  constructor(readonly sim: Simulation, private readonly o: BumpTestOptions = {}) {
    const st = sim.controllerState;
    this.out0 = st.out;
    this.mode0 = st.mode;
    this.sp0 = st.sp;
    this.t0 = sim.timeS;
    this.preS = o.preStepS ?? Math.max(60, 30 * sim.sampleTimeS);
    this.respS = o.responseS ?? Math.min(12 * 3600, 6 * dominantTimeConstantS(sim.plantDefinition));
    let s = o.stepPercent ?? 10;
    if (this.out0 + s > 100 && o.stepPercent === undefined) s = -s;
    this.step0 = s;
    if (st.mode === "auto") sim.act({ type: "mode", mode: "manual" });
  }

  get phase(): BumpPhase {
    return this.phaseValue;
  }
  get finished(): boolean {
    return this.phaseValue === "done";
  }
  get outcome(): BumpOutcome | null {
    return this.outcomeValue;
  }
  get record(): BumpRecord {
    return this.rec;
  }
  get progress(): BumpProgress {
    const elapsed = this.sim.timeS - this.t0;
    return { phase: this.phaseValue, timeS: this.sim.timeS, rows: this.rec.t.length, fraction: Math.min(1, elapsed / (this.preS + this.respS)) };
  }

  private log(force: boolean): void {
    const s = this.sim.snapshot();
    const since = Number.isFinite(this.tStep) ? s.timeS - this.tStep : 0;
    const spacing = Number.isFinite(this.tStep) ? Math.max(this.sim.sampleTimeS, 0.02 * since) : Math.max(this.sim.sampleTimeS, this.preS / 30);
    if (!force && s.timeS - this.lastLogged < spacing - 1e-9) return;
    this.rec.t.push(s.timeS);
    this.rec.out.push(s.outPercent);
    this.rec.pv.push(this.o.pvSignal === "raw" ? s.pvRawC : s.pvFilteredC);
    this.lastLogged = s.timeS;
  }

  step(): BumpPhase {
    const sim = this.sim;
    switch (this.phaseValue) {
      case "pre-step": {
        sim.step();
        this.log(this.rec.t.length === 0);
        if (sim.timeS - this.t0 >= this.preS) {
          sim.act({ type: "manual-output", outPercent: this.out0 + this.step0 });
          this.tStep = sim.timeS;
          this.phaseValue = "response";
        }
        break;
      }
      case "response": {
        sim.step();
        const s = sim.snapshot();
        // log the sample where the new OUT first shows, and the one before it, at full resolution
        this.log(s.timeS - this.tStep < 1e-9 + sim.sampleTimeS);
        if (sim.timeS - this.tStep >= this.respS) {
          this.log(true);
          sim.act({ type: "manual-output", outPercent: this.out0 });
          this.phaseValue = "returning";
        }
        break;
      }
      case "returning": {
        sim.step();
        if (this.returnStage === 0 && this.mode0 === "auto") {
          // SP tracking in manual may have moved SP with the PV: back to the operator's SP
          if (sim.controllerConfig.spTrackInManual) sim.act({ type: "setpoint", setpointC: this.sp0 });
          sim.act({ type: "mode", mode: "auto" });
        }
        if (this.returnStage++ >= 1) this.finish();
        break;
      }
      case "done":
        break;
    }
    return this.phaseValue;
  }

  run(onProgress?: (p: BumpProgress) => void, progressEverySamples = 1000): BumpOutcome {
    let n = 0;
    while (!this.finished) {
      this.step();
      if (onProgress && ++n % progressEverySamples === 0) onProgress(this.progress);
    }
    return this.outcomeValue!;
  }

  private finish(): void {
    const id = identifyStepResponse(this.rec);
    if (!id.ok) {
      this.outcomeValue = { ok: false, record: this.rec, refusal: id };
    } else {
      const model = id.preferred === "sopdt" && id.sopdt ? id.sopdt.model : id.fopdt.model;
      const cfg = this.sim.controllerConfig;
      const proposal = propose({
        model,
        rule: this.o.rule,
        controller: this.o.controller,
        form: this.o.form,
        base: cfg,
        // a record of the filtered PV already contains the filter, the sensor, sampling and the heater's cycle; a raw-PV record misses the filter
        extraLags: this.o.pvSignal === "raw" ? { pvFilterTauS: cfg.pvFilterTauS } : {},
      });
      const sensorLag = this.sim.plantDefinition.sensorTimeConstantS;
      const sampleTimeAndFilter = recommendSampleTimeAndFilter({ model, noiseSigmaC: id.noiseSigmaC, sensorLagS: sensorLag > 0 ? sensorLag : undefined, sampleTimeS: cfg.sampleTimeS });
      this.outcomeValue = { ok: true, record: this.rec, stepPercent: this.step0, identification: id, proposal, sampleTimeAndFilter, returned: { outPercent: this.out0, mode: this.mode0 } };
    }
    this.phaseValue = "done";
  }
}
