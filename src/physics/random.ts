/**
 * Seedable, splittable pseudo-random numbers.
 *
 * Generator: xoshiro128** (D. Blackman and S. Vigna, "Scrambled linear
 * pseudorandom number generators", ACM TOMS 47 (2021) 36, arXiv:1805.01407),
 * 128 bits of state, period 2^128 - 1, 32-bit output built from `Math.imul`
 * so it runs at full speed without BigInt.
 *
 * Streams: every worker, model point, energy and event chunk asks for its own
 * stream with `RandomStream.forStream(seed, ...ids)`. The ids are hashed into
 * the 128-bit state, so a stream depends only on (seed, ids) and never on how
 * many workers run or in which order: this is what makes results
 * byte-identical for any worker count. `jump()` advances by 2^64 steps for
 * users who prefer non-overlapping sub-sequences of one stream.
 */

const TWO_POW_MINUS_53 = 1 / 9007199254740992;
const TWO_POW_26 = 67108864;

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

/** The 32-bit finaliser of MurmurHash3 (A. Appleby, public domain): a bijective avalanche mix. */
export function mix32(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

/** Jump polynomial for 2^64 steps of xoshiro128** (Blackman and Vigna's reference code). */
const JUMP = [0x8764000b, 0xf542d2d3, 0x6fa035c3, 0x77f2db5b];

/** Splits a non-negative integer seed below 2^53 into two 32-bit words. */
function seedWords(seed: number): [number, number] {
  if (!Number.isInteger(seed) || seed < 0 || seed > Number.MAX_SAFE_INTEGER) {
    throw new RangeError(`seed must be an integer in [0, 2^53), got ${seed}`);
  }
  return [seed >>> 0, Math.floor(seed / 4294967296) >>> 0];
}

export class RandomStream {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  /** Second normal deviate of the last Box–Muller pair, or NaN when none is cached. */
  private spareNormal = Number.NaN;

  /** Builds a stream from four 32-bit state words (not all zero). Prefer `forStream`. */
  constructor(s0: number, s1: number, s2: number, s3: number) {
    if ((s0 | s1 | s2 | s3) === 0) throw new RangeError('xoshiro128** state must not be all zero');
    // State words are kept as signed int32 (`| 0`): values above 2^31 would
    // otherwise be stored as boxed doubles and slow every draw.
    this.s0 = s0 | 0;
    this.s1 = s1 | 0;
    this.s2 = s2 | 0;
    this.s3 = s3 | 0;
  }

  /**
   * The stream identified by a seed and a path of stream ids
   * (for example `forStream(seed, pointIndex, energyIndex, chunk)`).
   * Different paths give statistically independent streams.
   *
   * @example
   * RandomStream.forStream(42, 0).nextUint32() === RandomStream.forStream(42, 0).nextUint32() // true
   */
  static forStream(seed: number, ...ids: number[]): RandomStream {
    const [lo, hi] = seedWords(seed);
    // Two hash lanes with different constants so that the 128-bit state is not
    // a function of a single 32-bit hash.
    let a = mix32(lo ^ 0x9e3779b9);
    let b = mix32(hi ^ 0x7f4a7c15 ^ a);
    for (let k = 0; k < ids.length; k++) {
      const [idLo, idHi] = seedWords(ids[k]);
      a = mix32((a ^ mix32(idLo + Math.imul(k + 1, 0x632be5ab))) + 0x165667b1);
      b = mix32((b ^ mix32(idHi ^ a ^ Math.imul(k + 1, 0x27d4eb2f))) + 0x61c88647);
    }
    const s0 = mix32(a + 0x3c6ef372);
    const s1 = mix32(b + 0xa54ff53a);
    const s2 = mix32((a ^ b) + 0x510e527f);
    const s3 = mix32((a + b) ^ 0x9b05688c);
    // An all-zero state (probability 2^-128) would be a fixed point: nudge it.
    return new RandomStream(s0, s1, s2, (s0 | s1 | s2 | s3) === 0 ? 1 : s3);
  }

  /** A child stream derived from this stream's next outputs (deterministic, advances this stream). */
  split(): RandomStream {
    const s0 = this.nextUint32();
    const s1 = this.nextUint32();
    const s2 = this.nextUint32();
    const s3 = this.nextUint32();
    return new RandomStream(mix32(s0), mix32(s1 ^ 0x5bd1e995), mix32(s2), mix32(s3) | 1);
  }

  /** A copy with the same state. */
  clone(): RandomStream {
    const copy = new RandomStream(this.s0, this.s1, this.s2, this.s3);
    copy.spareNormal = this.spareNormal;
    return copy;
  }

  /** The four state words (for checkpoints and tests). */
  state(): [number, number, number, number] {
    return [this.s0 >>> 0, this.s1 >>> 0, this.s2 >>> 0, this.s3 >>> 0];
  }

  /** Next 32-bit unsigned integer. */
  nextUint32(): number {
    const s1 = this.s1;
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return result;
  }

  /** Uniform double in [0, 1) with 53 random bits. */
  uniform(): number {
    const hi = this.nextUint32() >>> 5; // 27 bits
    const lo = this.nextUint32() >>> 6; // 26 bits
    return (hi * TWO_POW_26 + lo) * TWO_POW_MINUS_53;
  }

  /** Uniform double in the open interval (0, 1): safe to take the logarithm of. */
  uniformOpen(): number {
    let u = this.uniform();
    while (u === 0) u = this.uniform();
    return u;
  }

  /** Uniform double in [low, high). */
  uniformIn(low: number, high: number): number {
    return low + (high - low) * this.uniform();
  }

  /** Uniform integer in [0, n) for 1 <= n <= 2^32, without modulo bias (Lemire's rejection). */
  integerBelow(n: number): number {
    if (n <= 1) return 0;
    const limit = 4294967296 - (4294967296 % n);
    let x = this.nextUint32();
    while (x >= limit) x = this.nextUint32();
    return x % n;
  }

  /** Standard normal deviate (Box–Muller, polar form; Marsaglia and Bray 1964). */
  normal(): number {
    if (!Number.isNaN(this.spareNormal)) {
      const z = this.spareNormal;
      this.spareNormal = Number.NaN;
      return z;
    }
    let u: number;
    let v: number;
    let s: number;
    do {
      u = 2 * this.uniform() - 1;
      v = 2 * this.uniform() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const f = Math.sqrt((-2 * Math.log(s)) / s);
    this.spareNormal = v * f;
    return u * f;
  }

  /** Normal deviate with the given mean and standard deviation. */
  gaussian(mean: number, sigma: number): number {
    return mean + sigma * this.normal();
  }

  /** Exponential deviate with unit mean. */
  exponential(): number {
    return -Math.log(this.uniformOpen());
  }

  /** Fills `out` with uniform doubles in [0, 1). */
  fillUniform(out: Float64Array): Float64Array {
    for (let i = 0; i < out.length; i++) out[i] = this.uniform();
    return out;
  }

  /** Advances the stream by 2^64 steps: 2^64 non-overlapping sub-sequences of one stream. */
  jump(): void {
    let t0 = 0;
    let t1 = 0;
    let t2 = 0;
    let t3 = 0;
    for (const word of JUMP) {
      for (let b = 0; b < 32; b++) {
        if ((word >>> b) & 1) {
          t0 ^= this.s0;
          t1 ^= this.s1;
          t2 ^= this.s2;
          t3 ^= this.s3;
        }
        this.nextUint32();
      }
    }
    this.s0 = t0 | 0;
    this.s1 = t1 | 0;
    this.s2 = t2 | 0;
    this.s3 = t3 | 0;
    this.spareNormal = Number.NaN;
  }
}
