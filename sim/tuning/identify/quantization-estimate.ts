/**
 * Resolution of a quantized signal (an ADC's or a logger's display step) from the signal itself.
 * A quantizer with step q puts every sample on a lattice k·q + offset, so every successive
 * difference is an integer multiple of q (common practice). The method: take the smallest nonzero
 * |difference| m as a candidate (or m/2, m/3, m/4 when the single step never occurs), accept it when
 * nearly all differences are within 2 % of q of a whole multiple, then refine q as the median of
 * d / round(d / q). Data without such a lattice (a continuous signal) give null.
 * The quantizer adds noise of variance q²/12 (Widrow & Kollár, "Quantization Noise", 2008, from
 * memory), which is why the step is worth knowing beside the noise σ.
 */
import { median } from "./noise-estimate";

/** share of nonzero differences that must lie on the lattice */
const ON_LATTICE = 0.95;
/** distance from a whole multiple still counted as on the lattice, in units of q */
const TOLERANCE = 0.02;
/** fewest nonzero differences to judge a lattice */
const MIN_DIFFERENCES = 8;

function latticeShare(d: readonly number[], q: number): number {
  let on = 0;
  for (const v of d) {
    const r = v / q;
    if (Math.abs(r - Math.round(r)) <= TOLERANCE) on++;
  }
  return on / d.length;
}

export function estimateQuantizationStep(pv: readonly number[]): number | null {
  let scale = 0;
  for (const v of pv) if (Number.isFinite(v)) scale = Math.max(scale, Math.abs(v));
  // differences this small are decimal-to-binary rounding of equal values, not steps
  const zero = 1e-9 * Math.max(1, scale);
  const d: number[] = [];
  for (let i = 1; i < pv.length; i++) {
    const v = Math.abs(pv[i] - pv[i - 1]);
    if (Number.isFinite(v) && v > zero) d.push(v);
  }
  if (d.length < MIN_DIFFERENCES) return null;
  let m = Infinity;
  for (const v of d) m = Math.min(m, v);
  for (let k = 1; k <= 4; k++) {
    const q0 = m / k;
    if (latticeShare(d, q0) < ON_LATTICE) continue;
    const refined = median(d.filter((v) => Math.abs(v / q0 - Math.round(v / q0)) <= TOLERANCE).map((v) => v / Math.round(v / q0)));
    return Number.isFinite(refined) && refined > 0 ? refined : q0;
  }
  return null;
}
