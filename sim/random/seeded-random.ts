/**
 * Seeded, reproducible pseudo-random numbers for the engine's noise.
 *
 * Generator: xoshiro128** 1.1 (D. Blackman, S. Vigna, "Scrambled linear pseudorandom number
 * generators", ACM TOMS 47(4), 2021, citation from memory; reference C code at prng.di.unimi.it). 128-bit state,
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
  // State words as int32 in plain fields (V8 keeps them unboxed; measured faster than a typed array).
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;

  /**
   * @param seed any finite number; reduced to an unsigned 32-bit integer by ToUint32 (truncate,
   *   modulo 2³²), so seeds that differ by a multiple of 2³² give the same stream.
   */
  constructor(seed: number) {
    if (!Number.isFinite(seed)) throw new RangeError(`SeededRandom: seed must be finite, got ${seed}`);
    this.seed = seed >>> 0;
    const w = new Uint32Array(4);
    expandSeed(this.seed, w);
    this.s0 = w[0] | 0;
    this.s1 = w[1] | 0;
    this.s2 = w[2] | 0;
    this.s3 = w[3] | 0;
  }

  /** A generator with the given raw xoshiro128** state (for reference test vectors). */
  static fromState(s0: number, s1: number, s2: number, s3: number): SeededRandom {
    if ((s0 | s1 | s2 | s3) === 0) throw new RangeError("SeededRandom.fromState: all-zero state is forbidden");
    const r = new SeededRandom(0);
    r.s0 = s0 | 0;
    r.s1 = s1 | 0;
    r.s2 = s2 | 0;
    r.s3 = s3 | 0;
    return r;
  }

  /** Next unsigned 32-bit integer: xoshiro128** step (Blackman & Vigna, reference next()). */
  nextUint32(): number {
    const s1 = this.s1;
    const x = Math.imul(s1, 5);
    const result = Math.imul((x << 7) | (x >>> 25), 9);
    const t = s1 << 9;
    let s2 = this.s2 ^ this.s0;
    let s3 = this.s3 ^ s1;
    this.s1 = s1 ^ s2;
    this.s0 = this.s0 ^ s3;
    s2 ^= t;
    s3 = (s3 << 11) | (s3 >>> 21);
    this.s2 = s2;
    this.s3 = s3;
    return result >>> 0;
  }

  /** Uniform on [0, 1) with 32-bit resolution: nextUint32 · 2⁻³². */
  uniform(): number {
    return this.nextUint32() * INV_2_POW_32;
  }

  /**
   * Approximately standard normal (mean 0, sd 1) from + − × ÷ only: Irwin–Hall sum of 12
   * sixteen-bit uniforms (gaussian.ts). Consumes 6 draws.
   */
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
