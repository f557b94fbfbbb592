/**
 * The settling / recovery band half-width: ± max(2 % of |step|, an absolute floor, 3σ of the PV
 * noise). The 2 % criterion is the usual settling band (Ogata, Modern Control Engineering, ch. 5);
 * the floor and the noise term keep the band meaningful for small steps and noisy measurements
 * (without them a noisy trace would never "settle").
 */
export function bandHalfWidthC(stepSizeC: number, floorC: number, noiseSigmaC: number): number {
  return Math.max(0.02 * Math.abs(stepSizeC), floorC, 3 * noiseSigmaC);
}

/**
 * Time of the last entry into the band |y − target| ≤ band within samples first..last, i.e. the
 * instant after which the signal never leaves it again ("last exit" convention). The entry instant
 * is interpolated linearly between the last outside sample and the next one.
 * Returns the first sample's time if it never leaves, and null if it is outside at the end.
 */
export function lastEntryIntoBand(
  t: ArrayLike<number>,
  y: ArrayLike<number>,
  target: ArrayLike<number> | number,
  band: number,
  first: number,
  last: number,
): number | null {
  const tgt = (k: number) => (typeof target === "number" ? target : target[k]);
  if (last < first) return null;
  if (Math.abs(y[last] - tgt(last)) > band) return null;
  for (let k = last - 1; k >= first; k--) {
    const dev = y[k] - tgt(k);
    if (Math.abs(dev) > band) {
      // Crossing between k (outside) and k+1 (inside): interpolate on the deviation.
      const devNext = y[k + 1] - tgt(k + 1);
      const edge = dev > 0 ? band : -band;
      const frac = (dev - edge) / (dev - devNext);
      return t[k] + frac * (t[k + 1] - t[k]);
    }
  }
  return t[first];
}
