/**
 * Gain margin, phase margin, maximum sensitivity and closed-loop bandwidth of a loop
 * (definitions as in references §15, e.g. Åström & Hägglund 1995; Skogestad & Postlethwaite):
 *   GM = 1/|L(jω180)| where arg L = −180° (mod 360°); Infinity if the phase never gets there;
 *   PM = 180° + arg L(jωc) where |L(jωc)| = 1; Infinity if |L| never reaches 1;
 *   Ms = max |1/(1 + L(jω))|;  bandwidth: the lowest ω where |T| = |L/(1 + L)| falls to 1/√2 of |T(0)|.
 * Method: a dense log-spaced grid (200 points per decade over the loop's time scales ± 3 decades),
 * bisection on log ω inside each bracketing interval for the crossovers, golden-section search on
 * log ω around the largest grid value for the Ms peak.
 */
import { loopResponse, sensitivities, type LoopPoint } from "./frequency-response";
import { loopTimeScales, type Loop } from "./loop";
import { bisect, goldenMax } from "../numeric/one-dimensional-search";

export interface Margins {
  /** gain margin (factor); Infinity if the phase never reaches −180° */
  gainMargin: number;
  /** phase-crossover frequency ω180, rad/s (null when GM is infinite) */
  phaseCrossoverRadPerS: number | null;
  /** phase margin, degrees; Infinity if |L| stays below 1 */
  phaseMarginDeg: number;
  /** gain-crossover frequency ωc, rad/s (null when |L| never reaches 1) */
  gainCrossoverRadPerS: number | null;
  /** extra dead time that would make the loop oscillate: PM/ωc, s */
  delayMarginS: number;
  /** maximum sensitivity Ms */
  maxSensitivity: number;
  maxSensitivityAtRadPerS: number;
  /** closed-loop −3 dB bandwidth, rad/s (null if not found in range) */
  bandwidthRadPerS: number | null;
  omegaRange: [number, number];
}

const TWO_PI = 2 * Math.PI;

export function frequencyGrid(loop: Loop, pointsPerDecade = 200): number[] {
  const ts = loopTimeScales(loop);
  const big = ts.length ? Math.max(...ts) : 1;
  const small = ts.length ? Math.min(...ts) : 1;
  const lo = Math.log10(1 / big) - 3;
  const hi = Math.log10(1 / small) + 3;
  const n = Math.ceil((hi - lo) * pointsPerDecade);
  const w: number[] = [];
  for (let i = 0; i <= n; i++) w.push(10 ** (lo + ((hi - lo) * i) / n));
  return w;
}

/** The integer k with phase in [−π + 2πk, π + 2πk): which "−180° level" band the phase is in. */
function band(phase: number): number {
  return Math.floor((phase + Math.PI) / TWO_PI);
}

export function computeMargins(loop: Loop): Margins {
  const w = frequencyGrid(loop);
  const pts: LoopPoint[] = w.map((x) => loopResponse(loop, x));
  const at = (lw: number) => loopResponse(loop, 10 ** lw);

  // gain margin: every crossing of −180° + 360°k; the smallest 1/|L| is the one that matters
  let gm = Infinity;
  let w180: number | null = null;
  for (let i = 1; i < pts.length; i++) {
    const b0 = band(pts[i - 1].phase);
    const b1 = band(pts[i].phase);
    if (b0 === b1) continue;
    const level = -Math.PI + TWO_PI * Math.max(b0, b1);
    const lw = bisect((x) => at(x).phase - level, Math.log10(w[i - 1]), Math.log10(w[i]));
    const p = at(lw);
    if (1 / p.mag < gm) {
      gm = 1 / p.mag;
      w180 = p.omega;
    }
  }

  // phase margin: every crossing of |L| = 1; the smallest margin counts
  let pm = Infinity;
  let wc: number | null = null;
  for (let i = 1; i < pts.length; i++) {
    const a = Math.log(pts[i - 1].mag);
    const b = Math.log(pts[i].mag);
    if ((a < 0) === (b < 0)) continue;
    const lw = bisect((x) => Math.log(at(x).mag), Math.log10(w[i - 1]), Math.log10(w[i]));
    const p = at(lw);
    let m = p.phase + Math.PI;
    m -= TWO_PI * Math.floor((m + Math.PI) / TWO_PI); // to [−π, π)
    const deg = (m * 180) / Math.PI;
    if (deg < pm) {
      pm = deg;
      wc = p.omega;
    }
  }
  // maximum sensitivity: grid maximum, then golden-section refinement between its neighbours
  let iMax = 0;
  let sMax = -Infinity;
  pts.forEach((p, i) => {
    const s = sensitivities(p).s;
    if (s > sMax) {
      sMax = s;
      iMax = i;
    }
  });
  const lo = Math.log10(w[Math.max(0, iMax - 1)]);
  const hi = Math.log10(w[Math.min(w.length - 1, iMax + 1)]);
  const peak = goldenMax((x) => sensitivities(at(x)).s, lo, hi);
  const ms = Math.max(sMax, peak.f);
  const msAt = peak.f >= sMax ? 10 ** peak.x : w[iMax];

  // bandwidth: first fall of |T| below |T(0)|/√2
  const t0 = sensitivities(pts[0]).t;
  const limit = t0 / Math.SQRT2;
  let bw: number | null = null;
  for (let i = 1; i < pts.length; i++) {
    if (sensitivities(pts[i]).t < limit) {
      const lw = bisect((x) => sensitivities(at(x)).t - limit, Math.log10(w[i - 1]), Math.log10(w[i]));
      bw = 10 ** lw;
      break;
    }
  }

  const pmRad = (pm * Math.PI) / 180;
  return {
    gainMargin: gm,
    phaseCrossoverRadPerS: w180,
    phaseMarginDeg: pm,
    gainCrossoverRadPerS: wc,
    delayMarginS: wc !== null && pm > 0 ? pmRad / wc : wc === null ? Infinity : 0,
    maxSensitivity: ms,
    maxSensitivityAtRadPerS: msAt,
    bandwidthRadPerS: bw,
    omegaRange: [w[0], w[w.length - 1]],
  };
}
