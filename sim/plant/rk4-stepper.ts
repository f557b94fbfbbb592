/**
 * Classical fixed-step fourth-order Runge–Kutta (Kutta 1901; Hairer–Nørsett–Wanner I, §II.1),
 * the "straightforward" baseline of the benchmark. An interval of length h is cut into
 * ceil(h/maxStep) equal steps so the steps land on every switching instant and event.
 */
export type Derivative = (y: Float64Array, out: Float64Array) => void;

export class Rk4Stepper {
  private readonly k1: Float64Array;
  private readonly k2: Float64Array;
  private readonly k3: Float64Array;
  private readonly k4: Float64Array;
  private readonly tmp: Float64Array;

  constructor(readonly y: Float64Array, readonly maxStepS: number) {
    const n = y.length;
    this.k1 = new Float64Array(n);
    this.k2 = new Float64Array(n);
    this.k3 = new Float64Array(n);
    this.k4 = new Float64Array(n);
    this.tmp = new Float64Array(n);
  }

  advance(h: number, f: Derivative): void {
    if (h <= 0) return;
    const steps = Math.max(1, Math.ceil(h / this.maxStepS - 1e-9));
    const dt = h / steps;
    const { y, k1, k2, k3, k4, tmp } = this;
    const n = y.length;
    for (let s = 0; s < steps; s++) {
      f(y, k1);
      for (let i = 0; i < n; i++) tmp[i] = y[i] + 0.5 * dt * k1[i];
      f(tmp, k2);
      for (let i = 0; i < n; i++) tmp[i] = y[i] + 0.5 * dt * k2[i];
      f(tmp, k3);
      for (let i = 0; i < n; i++) tmp[i] = y[i] + dt * k3[i];
      f(tmp, k4);
      for (let i = 0; i < n; i++) y[i] += (dt / 6) * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]);
    }
  }
}
