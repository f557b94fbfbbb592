/**
 * The enclosure plant: parameters + present conditions → thermal network → a stepper.
 * Integrators: "exact" (modal, linear mode only, the default), "odex" (reference and nonlinear
 * mode), "rk4" (fixed-step baseline for the benchmark). A change of conditions or a cold load
 * rebuilds the network, carrying the node temperatures across (temperatures are continuous).
 */
import type { ColdLoad, PlantConditions } from "./conditions";
import type { EnclosureParams } from "./enclosure-params";
import { ModalStepper } from "./modal-stepper";
import { enclosureDerivative, OdeStepper } from "./ode-stepper";
import { Rk4Stepper } from "./rk4-stepper";
import { wallLossFunction } from "./nonlinear-losses";
import { solveLinear } from "./matrix-exponential";
import { buildEnclosureNetwork, conductanceMatrix, nominalConditions, type ThermalNetwork } from "./thermal-network";
import type { InitialTemperatures, Plant } from "./plant";

export type IntegratorKind = "exact" | "odex" | "rk4";

export interface EnclosurePlantOptions {
  /** cutout's own sensor element time constant, s */
  cutoutSensorTimeConstantS: number;
  integrator?: IntegratorKind;
  /** odex relative and absolute tolerance */
  odexTolerance?: number;
  /** largest RK4 step, s */
  rk4MaxStepS?: number;
}

interface NodeStepper {
  advance(h: number, powerW: number): void;
  nodeTemperatures(out?: Float64Array): Float64Array;
  readonly sensors: Float64Array;
  airTemperature(): number;
}

class Rk4NetworkStepper implements NodeStepper {
  private readonly rk: Rk4Stepper;
  private power = 0;
  private readonly f: (y: Float64Array, out: Float64Array) => void;
  constructor(readonly net: ThermalNetwork, tau: number[], nodes: ArrayLike<number>, sensors: ArrayLike<number>, wallLoss: ((t: number) => number) | null, maxStep: number) {
    const y = new Float64Array(net.n + tau.length);
    y.set(nodes as ArrayLike<number>, 0);
    y.set(sensors as ArrayLike<number>, net.n);
    this.rk = new Rk4Stepper(y, maxStep);
    this.f = (yy, out) => enclosureDerivative(net, tau, wallLoss, yy, this.power, out);
  }
  advance(h: number, powerW: number): void {
    this.power = powerW;
    this.rk.advance(h, this.f);
  }
  nodeTemperatures(out = new Float64Array(this.net.n)): Float64Array {
    for (let i = 0; i < this.net.n; i++) out[i] = this.rk.y[i];
    return out;
  }
  get sensors(): Float64Array {
    return this.rk.y.subarray(this.net.n);
  }
  airTemperature(): number {
    return this.rk.y[this.net.airNode];
  }
}

export class EnclosurePlant implements Plant {
  readonly kind = "enclosure" as const;
  time = 0;
  heaterEnergyJ = 0;
  /** energy brought in (+) or taken out (−) with cold loads, J (for energy accounting) */
  loadEnergyJ = 0;
  private cond: PlantConditions;
  private load: ColdLoad | null = null;
  private net!: ThermalNetwork;
  private stepper!: NodeStepper;
  private readonly integrator: IntegratorKind;
  private readonly tau: number[];
  private readonly prepared: number[] = [];

  constructor(readonly params: EnclosureParams, readonly options: EnclosurePlantOptions) {
    this.integrator = options.integrator ?? (params.lossModel === "nonlinear" ? "odex" : "exact");
    if (this.integrator === "exact" && params.lossModel === "nonlinear") {
      throw new Error("the exact integrator needs the linear loss model; use odex for nonlinear losses");
    }
    this.tau = [params.sensorTimeConstantS, options.cutoutSensorTimeConstantS];
    this.cond = nominalConditions(params);
    const amb = params.ambientC;
    this.rebuild(null, [amb, amb]);
  }

  get network(): ThermalNetwork {
    return this.net;
  }

  private wallLoss(): ((t: number) => number) | null {
    if (this.params.lossModel !== "nonlinear") return null;
    const pr = this.params;
    const p = { ...pr.nonlinear, areaM2: pr.wallAreaM2 };
    const rIns = (1 / pr.wallUValueWPerM2K - 1 / pr.innerFilmCoefficientWPerM2K - 1 / pr.outerFilmCoefficientWPerM2K) / pr.wallAreaM2;
    const amb = this.cond.ambientC;
    return wallLossFunction(p, rIns, amb);
  }

  /** Re-derives network and stepper; node temperatures by node id (new nodes take `newNode`). */
  private rebuild(nodeTemps: Map<string, number> | null, sensors: ArrayLike<number>, defaultTemp = this.params.ambientC): void {
    this.net = buildEnclosureNetwork(this.params, this.cond, this.load, { linearOuterFilm: this.params.lossModel === "linear" });
    const temps = new Float64Array(this.net.n);
    this.net.nodes.forEach((id, i) => {
      temps[i] = nodeTemps?.get(id) ?? (id === "load" && this.load ? this.load.temperatureC : defaultTemp);
    });
    const wl = this.wallLoss();
    switch (this.integrator) {
      case "exact": {
        const m = new ModalStepper(this.net, this.tau, temps, sensors);
        for (const h of this.prepared) m.prepare(h);
        this.stepper = m;
        break;
      }
      case "odex":
        this.stepper = new OdeStepper(this.net, this.tau, temps, sensors, wl, this.options.odexTolerance ?? 1e-10);
        break;
      case "rk4":
        this.stepper = new Rk4NetworkStepper(this.net, this.tau, temps, sensors, wl, this.options.rk4MaxStepS ?? 0.5);
        break;
    }
  }

  private currentNodeMap(): Map<string, number> {
    const t = this.stepper.nodeTemperatures();
    return new Map(this.net.nodes.map((id, i) => [id, t[i]]));
  }

  prepareStep(h: number): void {
    if (!this.prepared.includes(h)) this.prepared.push(h);
    if (this.stepper instanceof ModalStepper) this.stepper.prepare(h);
  }

  advance(h: number, heaterFraction: number): void {
    if (h <= 0) return;
    const p = this.net.heaterFullPowerW * heaterFraction;
    this.stepper.advance(h, p);
    this.heaterEnergyJ += p * h;
    this.time += h;
  }

  heaterPowerW(heaterFraction: number): number {
    return this.net.heaterFullPowerW * heaterFraction;
  }

  airTemperatureC(): number {
    return this.stepper.airTemperature();
  }
  sensorTemperatureC(): number {
    return this.stepper.sensors[0];
  }
  cutoutSensorTemperatureC(): number {
    return this.stepper.sensors[1];
  }

  conditions(): PlantConditions {
    return { ...this.cond };
  }

  setConditions(c: Partial<PlantConditions>): void {
    const next = { ...this.cond, ...c };
    if (JSON.stringify(next) === JSON.stringify(this.cond)) return;
    const nodes = this.currentNodeMap();
    const sensors = Float64Array.from(this.stepper.sensors);
    this.cond = next;
    this.rebuild(nodes, sensors);
  }

  placeColdLoad(load: ColdLoad): void {
    const nodes = this.currentNodeMap();
    const sensors = Float64Array.from(this.stepper.sensors);
    const cNew = load.massKg * load.specificHeatJPerKgK;
    this.loadEnergyJ += cNew * load.temperatureC;
    if (this.load) {
      // mix into one lump: capacities add, temperature is the capacity-weighted mean
      const cOld = this.load.massKg * this.load.specificHeatJPerKgK;
      const tOld = nodes.get("load") ?? this.load.temperatureC;
      const mass = this.load.massKg + load.massKg;
      const t = (cOld * tOld + cNew * load.temperatureC) / (cOld + cNew);
      this.load = { massKg: mass, specificHeatJPerKgK: (cOld + cNew) / mass, temperatureC: t, airCouplingWPerK: this.load.airCouplingWPerK + load.airCouplingWPerK };
      nodes.set("load", t);
    } else {
      this.load = { ...load };
      nodes.set("load", load.temperatureC);
    }
    this.rebuild(nodes, sensors);
  }

  removeColdLoad(): void {
    if (!this.load) return;
    const nodes = this.currentNodeMap();
    const sensors = Float64Array.from(this.stepper.sensors);
    this.loadEnergyJ -= this.load.massKg * this.load.specificHeatJPerKgK * (nodes.get("load") ?? 0);
    nodes.delete("load");
    this.load = null;
    this.rebuild(nodes, sensors);
  }

  /** Σ C_i·T_i over the nodes (relative to 0 °C), J. */
  storedEnergyJ(): number {
    const t = this.stepper.nodeTemperatures();
    let e = 0;
    for (let i = 0; i < this.net.n; i++) e += this.net.capacity[i] * t[i];
    return e;
  }

  nodeTemperatures(): Record<string, number> {
    return Object.fromEntries(this.currentNodeMap());
  }

  /** Present heat losses to ambient, W (ventilation and wall skin). */
  lossesW(): { ventilationW: number; wallW: number } {
    const t = this.stepper.nodeTemperatures();
    const amb = this.cond.ambientC;
    const wl = this.wallLoss();
    const wall = t[this.net.wallNode];
    return {
      ventilationW: this.net.ventilationWPerK * (t[this.net.airNode] - amb),
      wallW: wl ? wl(wall) : this.net.wallOuterWPerK * (wall - amb),
    };
  }

  stateVector(): Float64Array {
    const t = this.stepper.nodeTemperatures();
    const out = new Float64Array(t.length + 2);
    out.set(t, 0);
    out.set(this.stepper.sensors, t.length);
    return out;
  }

  /** Node temperatures at steady state for a constant heater fraction (linear solve; Newton for nonlinear losses). */
  steadyNodeTemperatures(heaterFraction: number): Float64Array {
    const net = this.net;
    const n = net.n;
    const b = new Float64Array(n);
    for (let i = 0; i < n; i++) b[i] = net.ambientConductance[i] * net.ambientC;
    b[net.heaterNode] += net.heaterFullPowerW * heaterFraction;
    const l = conductanceMatrix(net);
    let x = solveLinear(l, b, n, 1);
    const wl = this.wallLoss();
    if (wl) {
      // Newton on F(x) = −L x + b − e_wall·Q(x_wall) = 0 (only the wall equation is nonlinear)
      x = Float64Array.from(x);
      const w = net.wallNode;
      for (let it = 0; it < 100; it++) {
        const f = new Float64Array(n);
        for (let i = 0; i < n; i++) {
          let s = b[i];
          for (let j = 0; j < n; j++) s -= l[i * n + j] * x[j];
          f[i] = s;
        }
        f[w] -= wl(x[w]);
        const d = 1e-4;
        const dq = (wl(x[w] + d) - wl(x[w] - d)) / (2 * d);
        const jac = Float64Array.from(l); // −J = L + e_w e_wᵀ dQ
        jac[w * n + w] += dq;
        const dx = solveLinear(jac, f, n, 1);
        let norm = 0;
        for (let i = 0; i < n; i++) {
          x[i] += dx[i];
          norm = Math.max(norm, Math.abs(dx[i]));
        }
        if (norm < 1e-12) break;
      }
    }
    return x;
  }

  initialize(init: InitialTemperatures): void {
    const amb = this.cond.ambientC;
    let temps: Float64Array;
    if (init.kind === "ambient") temps = new Float64Array(this.net.n).fill(amb);
    else if (init.kind === "steady") temps = this.steadyNodeTemperatures(init.outPercent / 100);
    else {
      temps = new Float64Array(this.net.n);
      this.net.nodes.forEach((id, i) => {
        temps[i] =
          id === "heater" ? (init.heaterC ?? init.airC)
          : id === "wall" ? (init.wallC ?? init.airC)
          : id === "contents" ? (init.contentsC ?? init.airC)
          : id === "load" ? (this.load?.temperatureC ?? init.airC)
          : init.airC;
      });
    }
    const air = temps[this.net.airNode];
    const sensorC = init.kind === "temperatures" && init.sensorC !== undefined ? init.sensorC : air;
    this.rebuild(new Map(this.net.nodes.map((id, i) => [id, temps[i]])), [sensorC, air]);
  }
}
