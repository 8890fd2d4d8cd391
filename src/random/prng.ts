// The project's one source of randomness: xoshiro128** (Blackman & Vigna, 2018),
// seeded through SplitMix32-style mixing. All arithmetic is 32-bit integer
// (Math.imul, >>> 0), so a seed gives the same stream on every machine and Node version.

import { checkSeed } from "./seed.js";

const TWO_POW_32 = 4294967296;
const TWO_POW_53 = 9007199254740992;

function mix32(x: number): number {
  // fmix32 finaliser from MurmurHash3: a bijection on 32-bit words with good avalanche.
  x ^= x >>> 16;
  x = Math.imul(x, 0x85ebca6b);
  x ^= x >>> 13;
  x = Math.imul(x, 0xc2b2ae35);
  x ^= x >>> 16;
  return x >>> 0;
}

export class Rng {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  /** The seed and stream this generator was created from, for the record. */
  readonly seed: number;
  readonly stream: number;

  constructor(seed: number, stream = 0) {
    checkSeed("Rng", "seed", seed);
    checkSeed("Rng", "stream", stream);
    this.seed = seed;
    this.stream = stream;
    // SplitMix32: successive golden-ratio increments, each mixed; the stream index
    // perturbs the starting point so forks are independent-looking sequences.
    let z = (seed ^ Math.imul(stream, 0x9e3779b9) ^ 0x6a09e667) >>> 0;
    const next = (): number => {
      z = (z + 0x9e3779b9) >>> 0;
      return mix32(z);
    };
    this.s0 = next() | 0;
    this.s1 = next() | 0;
    this.s2 = next() | 0;
    this.s3 = next() | 0;
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1; // all-zero state is a fixed point
  }

  /** Explicit-state constructor, used by tests that compare with the reference C code. */
  static fromState(s0: number, s1: number, s2: number, s3: number): Rng {
    const r = new Rng(0);
    r.s0 = s0 | 0;
    r.s1 = s1 | 0;
    r.s2 = s2 | 0;
    r.s3 = s3 | 0;
    return r;
  }

  /** Next 32-bit unsigned integer. */
  nextU32(): number {
    // State words are kept as signed int32 (`| 0`) so V8 stays on small-integer fast paths;
    // the bits, and hence the stream, are those of the unsigned reference code.
    const s0 = this.s0, s1 = this.s1, s2 = this.s2, s3 = this.s3;
    const t = Math.imul(s1, 5);
    const result = Math.imul((t << 7) | (t >>> 25), 9);
    const n2 = s2 ^ s0;
    const n3 = s3 ^ s1;
    this.s1 = s1 ^ n2;
    this.s0 = s0 ^ n3;
    this.s2 = n2 ^ (s1 << 9);
    this.s3 = (n3 << 11) | (n3 >>> 21);
    return result >>> 0;
  }

  /** Uniform double in [0, 1) with 53 random bits. */
  nextFloat(): number {
    const hi = this.nextU32() >>> 5; // 27 bits
    const lo = this.nextU32() >>> 6; // 26 bits
    return (hi * 67108864 + lo) / TWO_POW_53;
  }

  /** Uniform double in (0, 1]: safe under Math.log. */
  nextFloatOpenZero(): number {
    return 1 - this.nextFloat();
  }

  /** Uniform integer in [0, bound), unbiased (rejection), for 1 ≤ bound ≤ 2^32. */
  nextInt(bound: number): number {
    if (!(bound >= 1 && bound <= TWO_POW_32 && Number.isInteger(bound))) {
      throw new RangeError(`nextInt: bound must be an integer in [1, 2^32] (got ${bound})`);
    }
    if (bound === 1) return 0;
    const limit = TWO_POW_32 - (TWO_POW_32 % bound);
    for (;;) {
      const x = this.nextU32();
      if (x < limit) return x % bound;
    }
  }

  /** Uniform integer in [0, bound) for bounds up to 2^53. */
  nextBigInt53(bound: number): number {
    if (bound <= TWO_POW_32) return this.nextInt(bound);
    if (!(Number.isInteger(bound) && bound <= TWO_POW_53)) {
      throw new RangeError(`nextBigInt53: bound must be an integer ≤ 2^53 (got ${bound})`);
    }
    const limit = TWO_POW_53 - (TWO_POW_53 % bound);
    for (;;) {
      const x = Math.floor(this.nextFloat() * TWO_POW_53);
      if (x < limit) return x % bound;
    }
  }

  /** Standard normal deviate (Box–Muller; the second value is discarded to keep the stream simple). */
  nextNormal(): number {
    const u = this.nextFloatOpenZero();
    const v = this.nextFloat();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  }

  /** Fisher–Yates shuffle in place. */
  shuffle<T extends { length: number; [i: number]: unknown }>(a: T): T {
    for (let i = a.length - 1; i > 0; i--) {
      const j = this.nextInt(i + 1);
      const t = a[i];
      a[i] = a[j];
      a[j] = t;
    }
    return a;
  }

  /** An independent generator derived from this one's seed and a stream index (for workers, trials). */
  fork(stream: number): Rng {
    return new Rng(this.seed, (mix32(this.stream + 1) ^ stream) >>> 0);
  }
}
