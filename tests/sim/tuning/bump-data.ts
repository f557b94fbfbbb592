/** Synthetic bump-test records with an analytic (superposition) truth, for the identification tests. */
import { SeededRandom } from "@/sim/random";

export interface TrueModel {
  gain: number;
  taus: number[];
  deadTime: number;
}

/** Unit step response of K e^{−θs}/∏(τs+1) for one or two distinct lags (analytic). */
export function stepResponse(m: TrueModel, t: number): number {
  const s = t - m.deadTime;
  if (s <= 0) return 0;
  if (m.taus.length === 1) return m.gain * (1 - Math.exp(-s / m.taus[0]));
  const [a, b] = m.taus;
  return m.gain * (1 - (a * Math.exp(-s / a) - b * Math.exp(-s / b)) / (a - b));
}

export interface RecordSpec {
  model: TrueModel;
  seed: number;
  durationS: number;
  /** sampling interval drawn uniformly from [lo, hi], s */
  interval: [number, number];
  /** OUT as a function of the sample's time (changes take effect at the sample where they are logged) */
  out: (t: number) => number;
  noiseSigma: number;
  pv0: number;
  /** PV drift before anything, °C/s */
  driftPerS?: number;
}

export function makeRecord(spec: RecordSpec): { t: number[]; out: number[]; pv: number[] } {
  const rng = new SeededRandom(spec.seed);
  const t: number[] = [];
  for (let x = 0; x <= spec.durationS; x += spec.interval[0] + (spec.interval[1] - spec.interval[0]) * rng.uniform()) t.push(x);
  const out = t.map(spec.out);
  const pv = t.map((ti, i) => {
    // superposition of the held OUT changes, each starting at the sample where it was logged
    let y = spec.pv0 + (spec.driftPerS ?? 0) * ti;
    for (let j = 1; j <= i; j++) {
      const du = out[j] - out[j - 1];
      if (du !== 0) y += du * stepResponse(spec.model, ti - t[j]);
    }
    return y + spec.noiseSigma * rng.gaussian();
  });
  return { t, out, pv };
}
