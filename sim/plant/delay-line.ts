/**
 * Exact transport delay for a piecewise-constant signal: a buffer of input segments (start time,
 * value). The delayed signal u(t − θ) is again piecewise constant, changing exactly θ after each
 * input change, so a plant stepping over an interval splits it at those instants — no Padé or
 * interpolation error (common practice for dead time in discrete simulation).
 */
export class InputDelayLine {
  private times: number[] = [];
  private values: number[] = [];

  constructor(readonly delayS: number, initialValue: number) {
    this.times.push(-Infinity);
    this.values.push(initialValue);
  }

  /** Records the input value from time t onward (t non-decreasing). */
  push(t: number, value: number): void {
    const last = this.values.length - 1;
    if (this.values[last] === value) return;
    if (this.times[last] === t) {
      this.values[last] = value;
      return;
    }
    this.times.push(t);
    this.values.push(value);
  }

  /** The delayed value acting at time t, i.e. u(t − θ) (right-continuous). */
  delayedAt(t: number): number {
    const tt = t - this.delayS;
    let i = this.times.length - 1;
    while (i > 0 && this.times[i] > tt) i--;
    return this.values[i];
  }

  /** First instant strictly after t where the delayed value changes, or +∞. */
  nextDelayedChangeAfter(t: number): number {
    for (let i = 1; i < this.times.length; i++) {
      const tc = this.times[i] + this.delayS;
      if (tc > t) return tc;
    }
    return Infinity;
  }

  /** Forget segments that can no longer act before time t. */
  prune(t: number): void {
    const tt = t - this.delayS;
    let k = 0;
    while (k + 1 < this.times.length && this.times[k + 1] <= tt) k++;
    if (k > 0) {
      this.times = this.times.slice(k);
      this.values = this.values.slice(k);
      this.times[0] = -Infinity;
    }
  }
}
