/**
 * FOPDT / SOPDT plant with sensor-element lags. States (temperatures, °C):
 *   q1' = (r(t−θ) − q1)/τ1,  [q2' = (q1 − q2)/τ2],  T = q_last,  s_j' = (T − s_j)/τ_j
 * with target r = T_op + (T_amb − T_amb,0) + K·(u − u_op), u = 100·fraction·(V/V_nom)² in %.
 * Stepping: exact for piecewise-constant input, x(h) = r·1 + e^{Ah}(x(0) − r·1) (every state's
 * equilibrium is r), with e^{Ah} by Padé scaling-and-squaring (matrix-exponential.ts), cached per
 * step length; the interval is split where the delayed input changes (delay-line.ts).
 * Disturbances that need a physical enclosure (airflow, door, cold load) do not apply here.
 */
import type { ColdLoad, PlantConditions } from "./conditions";
import { InputDelayLine } from "./delay-line";
import { matrixExponential } from "./matrix-exponential";
import type { InitialTemperatures, Plant } from "./plant";
import type { TransferFunctionParams } from "./transfer-function-params";

export class TransferFunctionPlant implements Plant {
  readonly kind = "transfer-function" as const;
  time = 0;
  heaterEnergyJ = 0;
  readonly x: Float64Array;
  private readonly a: Float64Array;
  private readonly n: number;
  private readonly lags: number; // 1 or 2
  private readonly sensorIndex: number[]; // state index of control and cutout sensor (or output index if no lag)
  private readonly cache = new Map<number, Float64Array>();
  private cond: PlantConditions;
  private delay: InputDelayLine;
  private readonly tmp: Float64Array;

  constructor(readonly params: TransferFunctionParams, readonly options: { cutoutSensorTimeConstantS: number }) {
    const taus = params.timeConstantsS;
    this.lags = taus.length;
    const sensorTaus = [params.sensorTimeConstantS, options.cutoutSensorTimeConstantS];
    const out = this.lags - 1;
    const states: { tau: number; from: number }[] = taus.map((tau, i) => ({ tau, from: i - 1 })); // from −1 = input
    this.sensorIndex = sensorTaus.map((tau) => {
      if (tau <= 0) return out;
      states.push({ tau, from: out });
      return states.length - 1;
    });
    this.n = states.length;
    const n = this.n;
    this.a = new Float64Array(n * n);
    states.forEach((s, i) => {
      this.a[i * n + i] = -1 / s.tau;
      if (s.from >= 0) this.a[i * n + s.from] = 1 / s.tau;
    });
    this.x = new Float64Array(n);
    this.tmp = new Float64Array(n);
    this.cond = { inletBlockagePercent: 0, doorAirflowM3PerH: 0, ambientC: params.ambientC, supplyVoltageV: params.nominalVoltageV };
    this.delay = new InputDelayLine(params.deadTimeS, params.operatingPoint.outPercent);
    this.initialize({ kind: "steady", outPercent: params.operatingPoint.outPercent });
  }

  /** e^{A h} with the input column dropped (see header), cached by step length. */
  private transition(h: number): Float64Array {
    let phi = this.cache.get(h);
    if (!phi) {
      phi = matrixExponential(this.a, this.n, h);
      if (this.cache.size > 256) this.cache.clear();
      this.cache.set(h, phi);
    }
    return phi;
  }

  private effectiveInputPercent(fraction: number): number {
    const v = this.cond.supplyVoltageV / this.params.nominalVoltageV;
    return 100 * fraction * v * v;
  }

  private target(uPercent: number): number {
    const p = this.params;
    return p.operatingPoint.temperatureC + (this.cond.ambientC - p.ambientC) + p.gainCPerPercent * (uPercent - p.operatingPoint.outPercent);
  }

  prepareStep(h: number): void {
    this.transition(h);
  }

  advance(h: number, heaterFraction: number): void {
    if (h <= 0) return;
    const u = this.effectiveInputPercent(heaterFraction);
    this.delay.push(this.time, u);
    const end = this.time + h;
    let t = this.time;
    while (t < end) {
      const next = Math.min(end, this.delay.nextDelayedChangeAfter(t));
      const seg = next - t;
      // the delayed input is constant on the open segment (t, next); read it at the midpoint, since
      // at t itself (= a recorded change + θ, rounded) it could still return the previous value
      if (seg > 1e-12 * Math.max(1, Math.abs(t))) this.exactSegment(seg, this.target(this.delay.delayedAt(t + seg / 2)));
      t = next;
    }
    this.delay.prune(end);
    this.heaterEnergyJ += this.heaterPowerW(heaterFraction) * h;
    this.time = end;
  }

  private exactSegment(h: number, r: number): void {
    const n = this.n;
    const phi = this.transition(h);
    for (let i = 0; i < n; i++) this.tmp[i] = this.x[i] - r;
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let j = 0; j < n; j++) s += phi[i * n + j] * this.tmp[j];
      this.x[i] = r + s;
    }
  }

  airTemperatureC(): number {
    return this.x[this.lags - 1];
  }
  sensorTemperatureC(): number {
    return this.x[this.sensorIndex[0]];
  }
  cutoutSensorTemperatureC(): number {
    return this.x[this.sensorIndex[1]];
  }
  heaterPowerW(heaterFraction: number): number {
    const v = this.cond.supplyVoltageV / this.params.nominalVoltageV;
    return this.params.heaterRatingW * heaterFraction * v * v;
  }
  conditions(): PlantConditions {
    return { ...this.cond };
  }
  setConditions(c: Partial<PlantConditions>): void {
    this.cond = { ...this.cond, ...c };
  }
  placeColdLoad(_load: ColdLoad): void {
    /* not applicable to a transfer-function model */
  }
  removeColdLoad(): void {
    /* not applicable */
  }
  initialize(init: InitialTemperatures): void {
    let temp: number;
    let u: number;
    if (init.kind === "ambient") {
      u = 0;
      temp = this.target(0);
    } else if (init.kind === "steady") {
      u = this.effectiveInputPercent(init.outPercent / 100);
      temp = this.target(u);
    } else {
      temp = init.airC;
      u = this.params.operatingPoint.outPercent + (temp - this.target(this.params.operatingPoint.outPercent)) / (this.params.gainCPerPercent || 1);
    }
    this.x.fill(temp);
    if (init.kind === "temperatures" && init.sensorC !== undefined && this.sensorIndex[0] >= this.lags) this.x[this.sensorIndex[0]] = init.sensorC;
    this.delay = new InputDelayLine(this.params.deadTimeS, u);
  }
  stateVector(): Float64Array {
    return Float64Array.from(this.x);
  }
}
