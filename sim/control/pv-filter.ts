/**
 * First-order PV filter τ·dy/dt = x − y, discretised exactly for an input held over each sample
 * (zero-order hold): y(k) = y(k−1) + α (x(k) − y(k−1)), α = 1 − exp(−h/τ)
 * (e.g. Åström & Wittenmark, Computer-Controlled Systems, sampling of a first-order system).
 * τ = 0 turns the filter off (α = 1).
 */
import { detExpm1 } from "../numeric/det-math";
export function pvFilterAlpha(tauS: number, sampleTimeS: number): number {
  return tauS > 0 ? -detExpm1(-sampleTimeS / tauS) : 1;
}

export class PvFilter {
  private alpha: number;
  value: number;

  constructor(tauS: number, sampleTimeS: number, initial: number) {
    this.alpha = pvFilterAlpha(tauS, sampleTimeS);
    this.value = initial;
  }

  /** New time constant or sample time; the filtered value is kept. */
  reconfigure(tauS: number, sampleTimeS: number): void {
    this.alpha = pvFilterAlpha(tauS, sampleTimeS);
  }

  reset(value: number): void {
    this.value = value;
  }

  update(x: number): number {
    this.value += this.alpha * (x - this.value);
    return this.value;
  }
}
