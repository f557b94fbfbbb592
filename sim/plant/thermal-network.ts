/**
 * The enclosure as a lumped-capacitance network (brief: heater element → air → walls and
 * contents → ambient). Each node i has heat capacity C_i; couplings G_ij (W/K) are symmetric;
 * g_i (W/K) connects node i to ambient. Then
 *     C·dT/dt = −L·T + P·e_heater + g·T_amb,   L = diag(ΣG + g) − G,
 * which is linear between switching instants and events. Nonlinear outer losses (if enabled)
 * replace the wall's ambient conductance and are added by the nonlinear stepper.
 */
import { AIR_SPECIFIC_HEAT_J_PER_KG_K, airDensity, ventilationConductance } from "./air";
import type { EnclosureParams } from "./enclosure-params";
import type { ColdLoad, PlantConditions } from "./conditions";

export type NodeId = "heater" | "air" | "wall" | "contents" | "load";

export interface ThermalNetwork {
  n: number;
  nodes: NodeId[];
  capacity: Float64Array;
  /** n×n row-major, symmetric, zero diagonal */
  coupling: Float64Array;
  /** linear conductance to ambient per node (W/K) */
  ambientConductance: Float64Array;
  ambientC: number;
  heaterNode: number;
  airNode: number;
  wallNode: number;
  /** heater power when fully on at the present supply voltage, W */
  heaterFullPowerW: number;
  /** the individual loss conductances, for energy accounting */
  ventilationWPerK: number;
  wallOuterWPerK: number;
}

/** Defaults for conditions taken from the parameters (nothing disturbed). */
export function nominalConditions(p: EnclosureParams): PlantConditions {
  return { inletBlockagePercent: 0, doorAirflowM3PerH: 0, ambientC: p.ambientC, supplyVoltageV: p.nominalVoltageV };
}

/** Builds the network for the given parameters and present conditions. */
export function buildEnclosureNetwork(
  p: EnclosureParams,
  c: PlantConditions,
  load: ColdLoad | null,
  opts: { linearOuterFilm: boolean } = { linearOuterFilm: true },
): ThermalNetwork {
  const nodes: NodeId[] = ["heater", "air", "wall"];
  const hasContents = p.contents.massKg > 0 && p.contents.airCouplingWPerK > 0;
  if (hasContents) nodes.push("contents");
  if (load) nodes.push("load");
  const n = nodes.length;
  const capacity = new Float64Array(n);
  const coupling = new Float64Array(n * n);
  const ambientConductance = new Float64Array(n);
  const link = (i: number, j: number, g: number) => {
    coupling[i * n + j] += g;
    coupling[j * n + i] += g;
  };
  // Air capacity at the density of the design ambient: small against the walls, and a constant
  // value keeps the model linear and the stored energy Σ C·T well defined when ambient changes
  // (documented simplification). The ventilation mass flow uses the present inlet density.
  capacity[0] = p.heaterHeatCapacityJPerK;
  capacity[1] = airDensity(p.ambientC, p.pressurePa) * p.volumeM3 * AIR_SPECIFIC_HEAT_J_PER_KG_K;
  capacity[2] = p.wallHeatCapacityJPerK;
  link(0, 1, p.heaterHeatCapacityJPerK / p.heaterTimeConstantS);
  // 1/U = 1/h_in + (insulation + outer film): the series air→wall→ambient conductance is U·A.
  const a = p.wallAreaM2;
  link(1, 2, p.innerFilmCoefficientWPerM2K * a);
  const wallOuter = opts.linearOuterFilm ? a / (1 / p.wallUValueWPerM2K - 1 / p.innerFilmCoefficientWPerM2K) : 0;
  ambientConductance[2] = wallOuter;
  const flow = p.inletAirflowM3PerH * (1 - clamp(c.inletBlockagePercent, 0, 100) / 100) + Math.max(0, c.doorAirflowM3PerH);
  const vent = ventilationConductance(flow, c.ambientC, p.pressurePa);
  ambientConductance[1] = vent;
  let k = 3;
  if (hasContents) {
    capacity[k] = p.contents.massKg * p.contents.specificHeatJPerKgK;
    link(1, k, p.contents.airCouplingWPerK);
    k++;
  }
  if (load) {
    capacity[k] = load.massKg * load.specificHeatJPerKgK;
    link(1, k, load.airCouplingWPerK);
  }
  const v = c.supplyVoltageV / p.nominalVoltageV;
  return {
    n, nodes, capacity, coupling, ambientConductance, ambientC: c.ambientC,
    heaterNode: 0, airNode: 1, wallNode: 2,
    heaterFullPowerW: p.heaterRatingW * v * v,
    ventilationWPerK: vent, wallOuterWPerK: wallOuter,
  };
}

/** L = diag(ΣG + g) − G (row-major), the network's conductance ("Laplacian plus ground") matrix. */
export function conductanceMatrix(net: ThermalNetwork): Float64Array {
  const { n } = net;
  const l = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    let sum = net.ambientConductance[i];
    for (let j = 0; j < n; j++) {
      if (j === i) continue;
      sum += net.coupling[i * n + j];
      l[i * n + j] = -net.coupling[i * n + j];
    }
    l[i * n + i] = sum;
  }
  return l;
}

/** dT/dt of the linear network (node temperatures only), into `out`. */
export function networkDerivative(net: ThermalNetwork, t: ArrayLike<number>, powerW: number, out: Float64Array | number[]): void {
  const { n } = net;
  for (let i = 0; i < n; i++) {
    let q = net.ambientConductance[i] * (net.ambientC - t[i]);
    for (let j = 0; j < n; j++) if (j !== i) q += net.coupling[i * n + j] * (t[j] - t[i]);
    if (i === net.heaterNode) q += powerW;
    out[i] = q / net.capacity[i];
  }
}

function clamp(x: number, lo: number, hi: number): number {
  return Math.min(hi, Math.max(lo, x));
}
