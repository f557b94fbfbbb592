/**
 * The stepping simulation that serves the interactive Bench and runDrill.
 *
 * One controller sample k (time t_k = k·Ts, computed by multiplication so it never drifts):
 *   1. timeline changes due at or before t_k are applied (those strictly inside the previous
 *      interval were applied at their exact instant during integration);
 *   2. operator actions stamped k are applied, in log order;
 *   3. the sensor chain measures the controller's sensor element (a plant state) → PV raw, bad;
 *   4. the controller block updates → OUT;
 *   5. the row is recorded; the cutout supervises its own sensor;
 *   6. the plant is integrated to t_{k+1} in exact pieces: the drive's switching instants and the
 *      timeline changes are breakpoints, and the cutout is checked at every breakpoint, so at
 *      least once per sample (its scan; a trip cuts the heater from that instant).
 * The noise uses a SeededRandom stream forked from the seed, so the same inputs give the same
 * trace, and the true temperature does not depend on the seed in open loop.
 */
import { ENGINE_VERSION } from "../version";
import { createPlant, type PlantDefinition } from "../plant/plant-definition";
import type { IntegratorKind } from "../plant/enclosure-plant";
import type { Plant } from "../plant/plant";
import { createDrive } from "../actuator";
import { SAME_INSTANT_S, type HeaterDrive } from "../actuator/heater-drive";
import { ExcessTemperatureCutout, type SafetyTrip } from "../safety/cutout";
import type { CutoutConfig } from "../safety/cutout-config";
import { SensorChain } from "../sensor/chain";
import type { SensorChainConfig, SensorFault } from "../sensor/config";
import { ControllerBlock } from "../control/block";
import { controllerConfigSchema, type ControllerConfig, type ControllerConfigInput } from "../control/config";
import { SeededRandom } from "../random/seeded-random";
import type { Drill, DrillEvent } from "./schema";
import { expandTimeline, type TimedChange, type TimelineChange } from "./timeline";
import type { LiveDisturbance } from "./actions";
import { TraceRecorder, type Trace } from "./trace";
import type { OperatorAction, StampedAction } from "./actions";
import { resolveCutout, resolvePlant, resolveSensor } from "./resolve";

/** Stream numbers of the noise sources (fork of the run's seed). */
export const NOISE_STREAM_CONTROL_SENSOR = 1;

export interface SimEvent {
  timeS: number;
  sample: number;
  type: "timeline" | "action" | "action-refused" | "safety-trip" | "cutout-reset" | "cutout-reset-refused";
  detail: string;
}

export interface SimulationOptions {
  /** controller configuration; default the drill's reference tuning */
  controller?: ControllerConfig | ControllerConfigInput;
  /** noise seed; default the drill's noise.seed */
  seed?: number;
  integrator?: IntegratorKind;
  odexTolerance?: number;
  rk4MaxStepS?: number;
}

export interface SampleSnapshot {
  sample: number;
  timeS: number;
  setpointC: number;
  pvRawC: number;
  pvFilteredC: number;
  trueC: number;
  outPercent: number;
  mode: "auto" | "manual";
  pvBad: boolean;
  cutoutTripped: boolean;
}

export class Simulation {
  readonly engineVersion = ENGINE_VERSION;
  readonly drill: Drill;
  readonly plantDefinition: PlantDefinition;
  readonly sensorConfig: SensorChainConfig;
  readonly cutoutConfig: CutoutConfig;
  readonly sampleTimeS: number;
  readonly durationS: number;
  /** index of the last sample of the drill (t = durationS) */
  readonly lastSample: number;
  readonly seed: number;
  readonly plant: Plant;
  readonly cutout: ExcessTemperatureCutout;
  readonly actionLog: StampedAction[] = [];
  readonly events: SimEvent[] = [];
  private controllerCfg: ControllerConfig;
  private readonly controller: ControllerBlock;
  private readonly sensor: SensorChain;
  private readonly drive: HeaterDrive;
  private readonly recorder: TraceRecorder;
  private readonly changes: TimedChange[];
  private nextChange = 0;
  private pending: StampedAction[] = [];
  private k = 0;
  private controlFault: SensorFault = "none";
  private cutoutFault: SensorFault = "none";
  private extraNoiseSdMa = 0;

  constructor(drill: Drill, options: SimulationOptions = {}) {
    this.drill = drill;
    this.plantDefinition = resolvePlant(drill);
    this.sensorConfig = resolveSensor(drill);
    this.cutoutConfig = resolveCutout(drill);
    this.controllerCfg = controllerConfigSchema.parse(options.controller ?? drill.referenceTuning);
    this.sampleTimeS = this.controllerCfg.sampleTimeS;
    this.durationS = drill.durationS;
    this.lastSample = Math.round(drill.durationS / this.sampleTimeS);
    this.seed = (options.seed ?? drill.noise.seed) >>> 0;
    this.plant = createPlant(this.plantDefinition, {
      cutoutSensorTimeConstantS: this.cutoutConfig.sensorTimeConstantS,
      integrator: options.integrator,
      odexTolerance: options.odexTolerance,
      rk4MaxStepS: options.rk4MaxStepS,
    });
    const init = drill.initialState;
    this.plant.initialize(init.temperatures);
    this.plant.prepareStep(this.sampleTimeS);
    this.cutout = new ExcessTemperatureCutout(this.cutoutConfig);
    this.sensor = new SensorChain(this.sensorConfig, new SeededRandom(this.seed).fork(NOISE_STREAM_CONTROL_SENSOR));
    this.drive = createDrive(drill.drive);
    const out0 = init.outPercent ?? (init.temperatures.kind === "steady" ? init.temperatures.outPercent : 0);
    this.controller = new ControllerBlock(this.controllerCfg, { out: out0, mode: init.mode, sp: init.setpointC, pv: this.plant.sensorTemperatureC() });
    this.recorder = new TraceRecorder(this.lastSample + 1, ENGINE_VERSION);
    this.changes = expandTimeline(drill.events, this.plantDefinition, this.sampleTimeS);
  }

  /** index of the next sample to be processed */
  get sampleIndex(): number {
    return this.k;
  }
  /** time of the next sample, s */
  get timeS(): number {
    return this.k * this.sampleTimeS;
  }
  /** the drill's duration has been simulated (the Bench may keep going) */
  get finished(): boolean {
    return this.k > this.lastSample;
  }
  get controllerConfig(): ControllerConfig {
    return this.controllerCfg;
  }
  get controllerState() {
    return this.controller.state;
  }

  /** Apply an operator action at the next sample boundary; returns it stamped (for the log). */
  act(action: OperatorAction): StampedAction {
    const stamped = { ...action, sample: this.k } as StampedAction;
    // keep the queue in stamp order (a replayed log may already hold later actions), stable for equal stamps
    let i = this.pending.length;
    while (i > 0 && this.pending[i - 1].sample > stamped.sample) i--;
    this.pending.splice(i, 0, stamped);
    return stamped;
  }

  /** Queue recorded actions for replay (stamps at or after the current sample). */
  schedule(actions: readonly StampedAction[]): void {
    for (const a of actions) {
      if (a.sample < this.k) throw new Error(`action stamped ${a.sample} is in the past (now ${this.k})`);
      this.pending.push(a);
    }
    this.pending.sort((a, b) => a.sample - b.sample);
  }

  /** Simulate whole samples covering `seconds`; returns the number of samples processed. */
  advance(seconds: number): number {
    const n = Math.max(0, Math.round(seconds / this.sampleTimeS));
    for (let i = 0; i < n; i++) this.step();
    return n;
  }

  /** Run to the end of the drill (through the sample at durationS). */
  runToEnd(): void {
    while (this.k <= this.lastSample) this.step();
  }

  trace(): Trace {
    return this.recorder.view();
  }
  /** rows [from, to) copied, for streaming chunks to the Bench */
  traceChunk(from: number, to = this.recorder.length): Trace {
    return this.recorder.copy(from, to);
  }

  get safetyTrips(): readonly SafetyTrip[] {
    return this.cutout.trips;
  }

  snapshot(): SampleSnapshot {
    const i = this.recorder.length - 1;
    const r = this.recorder;
    const st = this.controller.state;
    return {
      sample: i, timeS: r.timeS[i], setpointC: r.setpointC[i], pvRawC: r.pvRawC[i], pvFilteredC: r.pvFilteredC[i],
      trueC: r.trueC[i], outPercent: r.outPercent[i], mode: st.mode, pvBad: st.pvBad, cutoutTripped: this.cutout.tripped,
    };
  }

  private log(type: SimEvent["type"], detail: string, timeS = this.k * this.sampleTimeS): void {
    this.events.push({ timeS, sample: this.k, type, detail });
  }

  /** A change applied at once (a live disturbance's start); logged with its action. */
  private applyDisturbanceChange(c: TimelineChange): string {
    return this.applyChangeQuietly(c);
  }

  private applyChange(c: TimelineChange, timeS: number, label: string): void {
    this.log("timeline", label + this.applyChangeQuietly(c), timeS);
  }

  /** Applies a change; returns a note for the log ("" when there is nothing to add). */
  private applyChangeQuietly(c: TimelineChange): string {
    let note = "";
    if (this.plant.kind === "transfer-function") {
      const physical =
        c.kind === "load-in" || c.kind === "load-out" ||
        (c.kind === "conditions" && (c.patch.inletBlockagePercent !== undefined || c.patch.doorAirflowM3PerH !== undefined));
      if (physical) note = " (no effect on a transfer-function plant)";
    }
    switch (c.kind) {
      case "setpoint":
        this.controller.setSetpoint(c.setpointC);
        break;
      case "mode":
        this.controller.setMode(c.mode);
        break;
      case "conditions":
        this.plant.setConditions(c.patch);
        break;
      case "load-in":
        this.plant.placeColdLoad(c.load);
        break;
      case "load-out":
        this.plant.removeColdLoad();
        break;
      case "noise":
        this.extraNoiseSdMa = c.extraNoiseSdMa;
        break;
      case "fault":
        if (c.target === "control") this.controlFault = c.fault;
        else this.cutoutFault = c.fault;
        break;
    }
    return note;
  }

  private applyChangesUpTo(t: number): void {
    const ch = this.changes;
    while (this.nextChange < ch.length && ch[this.nextChange].timeS <= t + SAME_INSTANT_S) {
      const c = ch[this.nextChange++];
      this.applyChange(c.change, c.timeS, c.label !== undefined ? `${c.label} ${c.phase}` : `${this.drill.events[c.eventIndex].type} ${c.phase}`);
    }
  }

  private applyAction(a: StampedAction): void {
    switch (a.type) {
      case "setpoint":
        this.controller.setSetpoint(a.setpointC);
        this.log("action", `setpoint ${a.setpointC}`);
        break;
      case "mode":
        this.controller.setMode(a.mode);
        this.log("action", `mode ${a.mode}`);
        break;
      case "manual-output":
        this.controller.setManualOutput(a.outPercent);
        this.log("action", `manual-output ${a.outPercent}`);
        break;
      case "tuning": {
        const cfg = controllerConfigSchema.parse(a.controller);
        if (cfg.sampleTimeS !== this.sampleTimeS) {
          this.log("action-refused", "tuning: the sample time cannot change during a run");
          break;
        }
        this.controllerCfg = cfg;
        this.controller.retune(cfg);
        this.log("action", "tuning");
        break;
      }
      case "disturbance": {
        // expanded like a timeline event starting now; its start applies at once, its end (if it
        // has a duration) joins the pending timeline changes in time order
        const now = this.k * this.sampleTimeS;
        let label = `disturbance ${describeDisturbance(a.event)}`;
        const changes = expandTimeline([{ ...a.event, timeS: now } as DrillEvent], this.plantDefinition, this.sampleTimeS);
        for (const c of changes) {
          if (c.timeS <= now + SAME_INSTANT_S) {
            label += this.applyDisturbanceChange(c.change);
            continue;
          }
          const injected: TimedChange = { ...c, eventIndex: -1, label: `${a.event.type}` };
          let i = this.nextChange;
          while (i < this.changes.length && this.changes[i].timeS <= injected.timeS) i++;
          this.changes.splice(i, 0, injected);
        }
        this.log("action", label);
        break;
      }
      case "cutout-reset": {
        const ok = this.cutout.reset(this.plant.cutoutSensorTemperatureC(), this.cutoutFault);
        this.log(ok ? "cutout-reset" : "cutout-reset-refused", ok ? "cutout reset" : "cutout reset refused: cause persists");
        break;
      }
    }
  }

  private superviseCutout(t: number): void {
    const trip = this.cutout.check(t, this.plant.cutoutSensorTemperatureC(), this.cutoutFault);
    if (trip) this.log("safety-trip", `${trip.cause} at ${trip.sensorC.toFixed(2)} °C`, t);
  }

  /** Process one controller sample and integrate the plant to the next one. */
  step(): void {
    const k = this.k;
    const ts = this.sampleTimeS;
    const tk = k * ts;
    this.applyChangesUpTo(tk);
    const pend = this.pending;
    if (pend.length && pend[0].sample <= k) {
      let n = 0;
      while (n < pend.length && pend[n].sample <= k) this.applyAction(pend[n++]);
      this.actionLog.push(...pend.slice(0, n));
      this.pending = pend.slice(n);
    }
    const reading = this.sensor.measure(this.plant.sensorTemperatureC(), this.controlFault, this.extraNoiseSdMa);
    const pvRaw = reading.pv;
    const bad = reading.bad;
    const out = this.controller.update(pvRaw, bad);
    this.superviseCutout(tk);
    const r = this.recorder;
    r.ensure(k);
    r.timeS[k] = tk;
    r.setpointC[k] = this.controller.state.sp;
    r.pvRawC[k] = pvRaw;
    r.pvFilteredC[k] = this.controller.state.pvFiltered;
    r.trueC[k] = this.plant.airTemperatureC();
    r.outPercent[k] = out;
    r.pvBad[k] = bad ? 1 : 0;
    r.length = k + 1;
    this.drive.setOutput(out);
    // integrate [t_k, t_k+1] in constant pieces
    const tEnd = (k + 1) * ts;
    let t = tk;
    let energy = 0;
    let firstOn = -1;
    const plant = this.plant;
    for (;;) {
      const seg = this.drive.segmentAt(t);
      const fraction = this.cutout.heaterPermitted ? seg.fraction : 0;
      if (firstOn < 0) firstOn = fraction > 0 ? 1 : 0;
      let until = seg.until < tEnd ? seg.until : tEnd;
      if (this.nextChange < this.changes.length) {
        const tc = this.changes[this.nextChange].timeS;
        if (tc < until) until = tc;
      }
      if (until > tEnd - SAME_INSTANT_S) until = tEnd;
      const h = t === tk && until === tEnd ? ts : until - t;
      if (h > 0) {
        plant.advance(h, fraction);
        energy += plant.heaterPowerW(fraction) * h;
      }
      t = until;
      this.superviseCutout(t);
      if (t >= tEnd) break;
      if (this.nextChange < this.changes.length && this.changes[this.nextChange].timeS <= t + SAME_INSTANT_S) {
        this.applyChangesUpTo(t);
        this.superviseCutout(t); // a failed cutout sensor trips at the instant of the fault
      }
    }
    r.heaterPowerW[k] = energy / ts;
    r.heaterOn[k] = firstOn;
    r.cutoutTripped[k] = this.cutout.tripped ? 1 : 0;
    this.k = k + 1;
  }
}

/** The flag text of a live disturbance, with its size and unit. */
export function describeDisturbance(e: LiveDisturbance): string {
  const dur = "durationS" in e && e.durationS !== undefined ? ` for ${e.durationS} s` : "";
  switch (e.type) {
    case "inlet-blockage":
      return `inlet ${e.percent} % blocked${dur}`;
    case "door-open":
      return `door open ${e.durationS} s`;
    case "ambient":
      return `ambient ${e.temperatureC} °C${dur}`;
    case "supply-voltage":
      return `supply ${e.percentOfNominal} % of nominal${dur}`;
    case "cold-load":
      return `cold load ${e.massKg} kg at ${e.temperatureC} °C${dur}`;
    case "sensor-noise":
      return `sensor noise +${e.extraNoiseSdMa} mA${dur}`;
    case "sensor-fault":
      return `${e.target === "cutout" ? "cutout " : ""}sensor ${e.fault}${dur}`;
  }
}
