/**
 * 32-bit integer mixing used to expand a seed into generator state.
 *
 * Method: the MurmurHash3 32-bit finaliser ("fmix32", A. Appleby, public domain), applied to a
 * Weyl sequence with increment 0x9E3779B9 (⌊2³²/φ⌋), i.e. the 32-bit analogue of SplitMix
 * (Steele, Lea & Flood, "Fast splittable pseudorandom number generators", OOPSLA 2014; from memory).
 * Integer arithmetic only (Math.imul, shifts, xor), so it is bit-exact in every JS engine.
 */

/** MurmurHash3 fmix32: a bijective avalanche mix of one 32-bit word; returns an unsigned 32-bit integer. */
export function fmix32(x: number): number {
  let h = x | 0;
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

/** Golden-ratio Weyl increment ⌊2³²/φ⌋. */
export const WEYL_INCREMENT = 0x9e3779b9;

/**
 * Four well-mixed, not-all-zero 32-bit words from a 32-bit seed (SplitMix-style: successive Weyl
 * values through fmix32). Writes into `out` to stay allocation-free for callers that reuse it.
 */
export function expandSeed(seed: number, out: Uint32Array): void {
  let w = seed >>> 0;
  for (let k = 0; k < 4; k++) {
    w = (w + WEYL_INCREMENT) >>> 0;
    out[k] = fmix32(w);
  }
  // xoshiro's only forbidden state is all-zero; fmix32 is a bijection so this needs four zero
  // outputs in a row, which cannot happen for successive Weyl values, but guard anyway.
  if ((out[0] | out[1] | out[2] | out[3]) === 0) out[0] = 1;
}

/** Seed of sub-stream `stream` of a generator seeded with `seed` (two rounds of fmix32 over both words). */
export function forkSeed(seed: number, stream: number): number {
  const s = fmix32((stream >>> 0) ^ 0x5bd1e995);
  return fmix32((seed >>> 0) ^ Math.imul(s, WEYL_INCREMENT) ^ (s >>> 15));
}
