/**
 * Exact stepping of the linear enclosure between switching instants and events.
 *
 * Method: modal decomposition. With T = C^{-1/2}·y the network C·T' = −L·T + b becomes
 * y' = −S·y + C^{-1/2}·b with S = C^{-1/2} L C^{-1/2} symmetric positive definite, so S = Q·D·Qᵀ
 * (Jacobi, symmetric-eigen.ts) and in modal coordinates z = Qᵀ C^{1/2} T every mode is scalar:
 *     z_i(h) = z_eq,i + e^{−d_i h}(z_i(0) − z_eq,i),     z_eq = D^{-1} Qᵀ C^{-1/2} b
 * for a constant input b (heater power, ambient) — the exact solution, no truncation error.
 * A sensor element is a first-order lag τ on the air node, s' = (T_air − s)/τ; with
 * T_air(t) = T_air,eq + Σ v_i w_i e^{λ_i t} its exact solution is
 *     s(h) = T_air,eq + e^{μh}(s0 − T_air,eq) + Σ v_i w_i (1/τ)·(e^{λ_i h} − e^{μh})/(λ_i − μ),  μ = −1/τ,
 * with the divided difference evaluated through expm1 when λ_i ≈ μ (no loss of accuracy at or
 * near a repeated eigenvalue). Coefficients for the sample time are precomputed; other step
 * lengths (the switching instants inside a cycle) cost one exp per mode.
 */
import { symmetricEigen } from "./symmetric-eigen";
import { conductanceMatrix, type ThermalNetwork } from "./thermal-network";
import { detExp, detExpm1 } from "../numeric/det-math";

interface StepCoefficients {
  h: number;
  modeDecay: Float64Array; // e^{λ_i h}
  sensorDecay: Float64Array; // e^{μ_j h}
  sensorGain: Float64Array; // [j*n+i] = v_air,i/τ_j · φ(λ_i, μ_j, h)
}

/** (e^{a h} − e^{b h})/(a − b), accurate for a ≈ b (divided difference of exp). */
export function expDividedDifference(a: number, b: number, h: number): number {
  const x = (a - b) * h;
  if (Math.abs(x) > 0.5) return (detExp(a * h) - detExp(b * h)) / (a - b);
  const r = x === 0 ? 1 : detExpm1(x) / x;
  return detExp(b * h) * h * r;
}

export class ModalStepper {
  readonly n: number;
  readonly lambda: Float64Array;
  private readonly toModal: Float64Array; // z = toModal · T   (n×n)
  private readonly toPhysical: Float64Array; // T = toPhysical · z
  private readonly airRow: Float64Array; // T_air = airRow · z
  private readonly eqPerWatt: Float64Array; // z_eq per W of heater power
  private readonly eqPerAmbient: Float64Array; // z_eq per °C of ambient
  private readonly airEqPerWatt: number;
  private readonly airEqPerAmbient: number;
  private readonly tau: Float64Array;
  readonly z: Float64Array;
  readonly sensors: Float64Array;
  private readonly cache: StepCoefficients[] = [];
  private readonly scratch: StepCoefficients;
  private readonly w: Float64Array;

  constructor(
    readonly net: ThermalNetwork,
    sensorTimeConstantsS: number[],
    nodeTemperatures: ArrayLike<number>,
    sensorTemperatures: ArrayLike<number>,
  ) {
    const n = net.n;
    this.n = n;
    const l = conductanceMatrix(net);
    const rs = new Float64Array(n); // C^{-1/2}
    for (let i = 0; i < n; i++) rs[i] = 1 / Math.sqrt(net.capacity[i]);
    const s = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) s[i * n + j] = rs[i] * l[i * n + j] * rs[j];
    const eig = symmetricEigen(s, n);
    this.lambda = new Float64Array(n);
    this.toModal = new Float64Array(n * n);
    this.toPhysical = new Float64Array(n * n);
    for (let k = 0; k < n; k++) {
      this.lambda[k] = -eig.values[k];
      for (let i = 0; i < n; i++) {
        const q = eig.vectors[i * n + k];
        this.toPhysical[i * n + k] = rs[i] * q;
        this.toModal[k * n + i] = q / rs[i];
      }
    }
    this.airRow = new Float64Array(n);
    for (let k = 0; k < n; k++) this.airRow[k] = this.toPhysical[net.airNode * n + k];
    this.eqPerWatt = new Float64Array(n);
    this.eqPerAmbient = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      const d = eig.values[k];
      // Qᵀ C^{-1/2} b: b = P e_heater + g·T_amb
      this.eqPerWatt[k] = (eig.vectors[net.heaterNode * n + k] * rs[net.heaterNode]) / d;
      let a = 0;
      for (let i = 0; i < n; i++) a += eig.vectors[i * n + k] * rs[i] * net.ambientConductance[i];
      this.eqPerAmbient[k] = a / d;
    }
    let aw = 0;
    let aa = 0;
    for (let k = 0; k < n; k++) {
      aw += this.airRow[k] * this.eqPerWatt[k];
      aa += this.airRow[k] * this.eqPerAmbient[k];
    }
    this.airEqPerWatt = aw;
    this.airEqPerAmbient = aa;
    this.tau = Float64Array.from(sensorTimeConstantsS);
    this.z = new Float64Array(n);
    this.w = new Float64Array(n);
    this.sensors = Float64Array.from(sensorTemperatures);
    this.setNodeTemperatures(nodeTemperatures);
    const m = this.tau.length;
    this.scratch = { h: NaN, modeDecay: new Float64Array(n), sensorDecay: new Float64Array(m), sensorGain: new Float64Array(m * n) };
  }

  setNodeTemperatures(t: ArrayLike<number>): void {
    const n = this.n;
    for (let k = 0; k < n; k++) {
      let s = 0;
      for (let i = 0; i < n; i++) s += this.toModal[k * n + i] * t[i];
      this.z[k] = s;
    }
  }

  nodeTemperatures(out = new Float64Array(this.n)): Float64Array {
    const n = this.n;
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += this.toPhysical[i * n + k] * this.z[k];
      out[i] = s;
    }
    return out;
  }

  airTemperature(): number {
    let s = 0;
    for (let k = 0; k < this.n; k++) s += this.airRow[k] * this.z[k];
    return s;
  }

  /** Steady air temperature for constant heater power and the network's ambient. */
  steadyAirTemperature(powerW: number): number {
    return powerW * this.airEqPerWatt + this.net.ambientC * this.airEqPerAmbient;
  }

  /** Precompute (and keep) the coefficients for a step length used often (the sample time). */
  prepare(h: number): void {
    if (!this.cache.some((c) => c.h === h)) this.cache.push(this.coefficients(h, undefined));
  }

  private coefficients(h: number, into: StepCoefficients | undefined): StepCoefficients {
    const n = this.n;
    const m = this.tau.length;
    const c = into ?? { h, modeDecay: new Float64Array(n), sensorDecay: new Float64Array(m), sensorGain: new Float64Array(m * n) };
    c.h = h;
    for (let k = 0; k < n; k++) c.modeDecay[k] = detExp(this.lambda[k] * h);
    for (let j = 0; j < m; j++) {
      const mu = -1 / this.tau[j];
      c.sensorDecay[j] = detExp(mu * h);
      for (let k = 0; k < n; k++) c.sensorGain[j * n + k] = (this.airRow[k] / this.tau[j]) * expDividedDifference(this.lambda[k], mu, h);
    }
    return c;
  }

  /** Exact step of length h with constant heater power (W). */
  advance(h: number, powerW: number): void {
    if (h <= 0) return;
    let c: StepCoefficients | undefined;
    for (let i = 0; i < this.cache.length; i++) if (this.cache[i].h === h) c = this.cache[i];
    if (!c) c = this.coefficients(h, this.scratch);
    const n = this.n;
    const amb = this.net.ambientC;
    const z = this.z;
    const w = this.w;
    for (let k = 0; k < n; k++) {
      const eq = powerW * this.eqPerWatt[k] + amb * this.eqPerAmbient[k];
      w[k] = z[k] - eq;
      z[k] = eq + c.modeDecay[k] * w[k];
    }
    const airEq = powerW * this.airEqPerWatt + amb * this.airEqPerAmbient;
    const m = this.tau.length;
    for (let j = 0; j < m; j++) {
      let s = airEq + c.sensorDecay[j] * (this.sensors[j] - airEq);
      const base = j * n;
      for (let k = 0; k < n; k++) s += c.sensorGain[base + k] * w[k];
      this.sensors[j] = s;
    }
  }
}
