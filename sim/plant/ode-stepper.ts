/**
 * Stepping the enclosure with odex (Hairer's GBS extrapolation, E. Hairer, S. P. Nørsett,
 * G. Wanner, "Solving Ordinary Differential Equations I", §II.9) — the nonlinear-loss mode, and
 * the accuracy reference for the exact linear path. Each call integrates one interval on which
 * the inputs are constant (a fresh start at every switching instant or event).
 */
import { Solver } from "odex";
import type { ThermalNetwork } from "./thermal-network";

export class OdeStepper {
  private y: number[];
  private readonly solver: Solver;
  private readonly m: number;

  constructor(
    readonly net: ThermalNetwork,
    private readonly tau: number[],
    nodeTemperatures: ArrayLike<number>,
    sensorTemperatures: ArrayLike<number>,
    /** extra heat loss of the wall node to ambient (W) as a function of wall temperature */
    private readonly wallLossW: ((tWallC: number) => number) | null,
    tolerance = 1e-10,
  ) {
    this.m = tau.length;
    this.y = [...Array.from(nodeTemperatures), ...Array.from(sensorTemperatures)];
    this.solver = new Solver(this.y.length);
    this.solver.relativeTolerance = tolerance;
    this.solver.absoluteTolerance = tolerance;
    this.solver.maxSteps = 100000;
  }

  derivative(y: ArrayLike<number>, powerW: number, out: number[] | Float64Array): number[] | Float64Array {
    enclosureDerivative(this.net, this.tau, this.wallLossW, y, powerW, out);
    return out;
  }

  advance(h: number, powerW: number): void {
    if (h <= 0) return;
    const f = (_t: number, y: number[]): number[] => {
      const out = new Array<number>(y.length);
      enclosureDerivative(this.net, this.tau, this.wallLossW, y, powerW, out);
      return out;
    };
    const r = this.solver.solve(f, 0, this.y, h);
    if (r.outcome !== 0) throw new Error(`odex did not converge (outcome ${r.outcome})`);
    this.y = r.y;
  }

  nodeTemperatures(out = new Float64Array(this.net.n)): Float64Array {
    for (let i = 0; i < this.net.n; i++) out[i] = this.y[i];
    return out;
  }

  get sensors(): Float64Array {
    return Float64Array.from(this.y.slice(this.net.n));
  }

  airTemperature(): number {
    return this.y[this.net.airNode];
  }
}

/** dy/dt of the enclosure: network nodes, then sensor lags s' = (T_air − s)/τ; the optional
 * wall loss replaces the linear outer film (nonlinear mode). */
export function enclosureDerivative(
  net: ThermalNetwork,
  tau: ArrayLike<number>,
  wallLossW: ((tWallC: number) => number) | null,
  y: ArrayLike<number>,
  powerW: number,
  out: number[] | Float64Array,
): void {
  const n = net.n;
  for (let i = 0; i < n; i++) {
    let q = net.ambientConductance[i] * (net.ambientC - y[i]);
    for (let j = 0; j < n; j++) if (j !== i) q += net.coupling[i * n + j] * (y[j] - y[i]);
    if (i === net.heaterNode) q += powerW;
    if (i === net.wallNode && wallLossW) q -= wallLossW(y[i]);
    out[i] = q / net.capacity[i];
  }
  const air = y[net.airNode];
  for (let j = 0; j < tau.length; j++) out[n + j] = (air - y[n + j]) / tau[j];
}
