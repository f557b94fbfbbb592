/**
 * Seeded, reproducible pseudo-random numbers for the engine's noise.
 *
 * Generator: xoshiro128** 1.1 (D. Blackman, S. Vigna, "Scrambled linear pseudorandom number
 * generators", ACM TOMS 47(4), 2021; reference C code at prng.di.unimi.it). 128-bit state,
 * period 2¹²⁸ − 1, pure 32-bit integer arithmetic (Math.imul, shifts, rotations), so a seed
 * gives the same sequence bit-for-bit in every JavaScript engine.
 *
 * Gaussian: Irwin–Hall sum of 12 uniforms minus 6 (see gaussian.ts); + − × ÷ only.
 */
import { expandSeed, forkSeed } from "./seed-mix";
import { irwinHallGaussian } from "./gaussian";

/** 2⁻³², to map a 32-bit integer onto [0, 1). Exact in binary floating point. */
const INV_2_POW_32 = 1 / 4294967296;

export class SeededRandom {
  /** The 32-bit seed this stream was built from (what fork() derives sub-streams from). */
  readonly seed: number;
  // State words kept as int32 in a typed array: stays unboxed and allocation-free in V8.
  private readonly s = new Uint32Array(4);

  /**
   * @param seed any finite number; reduced to an unsigned 32-bit integer by ToUint32 (truncate,
   *   modulo 2³²), so seeds that differ by a multiple of 2³² give the same stream.
   */
  constructor(seed: number) {
    if (!Number.isFinite(seed)) throw new RangeError(`SeededRandom: seed must be finite, got ${seed}`);
    this.seed = seed >>> 0;
    expandSeed(this.seed, this.s);
  }

  /** A generator with the given raw xoshiro128** state (for reference test vectors). */
  static fromState(s0: number, s1: number, s2: number, s3: number): SeededRandom {
    const r = new SeededRandom(0);
    r.s[0] = s0;
    r.s[1] = s1;
    r.s[2] = s2;
    r.s[3] = s3;
    if ((s0 | s1 | s2 | s3) === 0) throw new RangeError("SeededRandom.fromState: all-zero state is forbidden");
    return r;
  }

  /** Next unsigned 32-bit integer: xoshiro128** step (Blackman & Vigna, reference next()). */
  nextUint32(): number {
    const s = this.s;
    const s1 = s[1];
    const x = Math.imul(s1, 5);
    const result = Math.imul((x << 7) | (x >>> 25), 9);
    const t = s1 << 9;
    s[2] ^= s[0];
    s[3] ^= s1;
    s[1] ^= s[2];
    s[0] ^= s[3];
    s[2] ^= t;
    const s3 = s[3];
    s[3] = (s3 << 11) | (s3 >>> 21);
    return result >>> 0;
  }

  /** Uniform on [0, 1) with 32-bit resolution: nextUint32 · 2⁻³². */
  uniform(): number {
    return this.nextUint32() * INV_2_POW_32;
  }

  /** Approximately standard normal (mean 0, sd 1), from + − × ÷ only: Irwin–Hall n = 12. Consumes 12 draws. */
  gaussian(): number {
    return irwinHallGaussian(this);
  }

  /**
   * An independent, reproducible sub-stream. It depends only on this generator's seed and
   * `stream`, never on how many numbers have been drawn, so giving each part of the simulation
   * its own fork means adding noise to one part never shifts another. Distinct (seed, stream)
   * pairs give distinct seeds with overwhelming probability; overlap of the resulting sequences
   * in a period of 2¹²⁸ − 1 is negligible for our run lengths.
   */
  fork(stream: number): SeededRandom {
    if (!Number.isFinite(stream)) throw new RangeError(`SeededRandom.fork: stream must be finite, got ${stream}`);
    return new SeededRandom(forkSeed(this.seed, stream));
  }
}
