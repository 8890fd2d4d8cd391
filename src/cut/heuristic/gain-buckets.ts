// Bucket index over flip gains, so the best (or best eligible) move is found without a full
// scan. Buckets are circular doubly linked lists in typed arrays; no allocation after construction.

import type { Rng } from "../../random/prng.js";

/**
 * Gains are mapped to buckets monotonically: b = ⌊(g + G)·s⌋ with G the largest possible
 * |gain| (the largest Σ|w| at a vertex). Integer weights with a modest G get s = 1, so every
 * vertex in a bucket has the same gain; otherwise a bucket holds a gain interval and callers
 * scan it for the exact best. Monotonicity means the best gain always sits in the highest
 * non-empty bucket, and the best eligible gain in the highest bucket holding an eligible vertex.
 *
 * Node ids 0..n−1 are vertices; n + b is the sentinel of bucket b, so a list walk from
 * `first(b)` ends at the first id ≥ n, and linking needs no empty-list branches (these run
 * once per neighbour of every flipped vertex, where mispredicted branches cost the most).
 */
export class GainBuckets {
  readonly n: number;
  readonly count: number;
  /** True when each bucket holds exactly one gain value. */
  readonly exact: boolean;
  readonly next: Int32Array;
  readonly prev: Int32Array;
  readonly bucketOf: Int32Array;
  private readonly offset: number;
  private readonly scale: number;
  /** An upper bound on the highest non-empty bucket (lowered lazily by `topBucket`). */
  private top = -1;
  // Random bits choosing head or tail insertion, so equal gains are met in random order.
  private readonly rng: Rng;
  private bits = 0;
  private bitsLeft = 0;

  constructor(n: number, maxAbsGain: number, integral: boolean, rng: Rng) {
    const G = Math.max(1, Math.ceil(maxAbsGain));
    const cap = Math.max(1 << 16, 4 * n);
    this.n = n;
    this.rng = rng;
    this.exact = integral && 2 * G + 1 <= cap;
    this.count = this.exact ? 2 * G + 1 : Math.min(cap, Math.max(1024, 2 * n));
    this.offset = G;
    this.scale = this.exact ? 1 : (this.count - 1) / (2 * G);
    this.next = new Int32Array(n + this.count);
    this.prev = new Int32Array(n + this.count);
    this.bucketOf = new Int32Array(n);
    this.clear();
  }

  bucket(g: number): number {
    let b = this.exact ? g + this.offset : Math.floor((g + this.offset) * this.scale);
    // Drift in floating-point gains may step a hair outside [−G, G].
    if (b < 0) b = 0;
    else if (b >= this.count) b = this.count - 1;
    return b;
  }

  /** First vertex of bucket b (an id ≥ n means the bucket is empty). */
  first(b: number): number {
    return this.next[this.n + b];
  }

  /** Empty every bucket (vertices must be re-inserted). */
  clear(): void {
    for (let s = this.n; s < this.n + this.count; s++) {
      this.next[s] = s;
      this.prev[s] = s;
    }
    this.bucketOf.fill(-1);
    this.top = -1;
  }

  /** Insert v (not present) with gain g, at the head or the tail of its bucket at random. */
  insert(v: number, g: number): void {
    const b = this.bucket(g);
    if (this.bitsLeft === 0) {
      this.bits = this.rng.nextU32();
      this.bitsLeft = 32;
    }
    this.bitsLeft--;
    const s = this.n + b;
    const { next, prev } = this;
    // Link after the sentinel (head) or after the current tail, chosen by mask, not branch.
    const a = s ^ ((s ^ prev[s]) & -(this.bits & 1));
    this.bits >>>= 1;
    const c = next[a];
    next[v] = c;
    prev[v] = a;
    prev[c] = v;
    next[a] = v;
    this.bucketOf[v] = b;
    if (b > this.top) this.top = b;
  }

  remove(v: number): void {
    const { next, prev } = this;
    const p = prev[v];
    const q = next[v];
    next[p] = q;
    prev[q] = p;
    this.bucketOf[v] = -1;
  }

  /** Re-file v after its gain changed to g (no-op when the bucket is unchanged). */
  update(v: number, g: number): void {
    const b = this.bucket(g);
    if (b === this.bucketOf[v]) return;
    this.remove(v);
    this.insert(v, g);
  }

  /** Highest non-empty bucket, or −1 when empty. */
  topBucket(): number {
    let b = this.top;
    const n = this.n;
    while (b >= 0 && this.next[n + b] === n + b) b--;
    this.top = b;
    return b;
  }
}
