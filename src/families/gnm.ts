// Erdős–Rényi G(n, m): uniform over the labelled graphs on n vertices with exactly m edges.
// Uniform random pairs, repeats rejected through an open-addressing hash of pair keys; when
// m exceeds half of all pairs, the missing pairs are sampled that way and the rest is kept.

import { invalidParameter } from "../errors.js";
import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import type { Rng } from "../random/prng.js";
import { MAX_RANDOM_VERTICES } from "./gnp.js";
import { buildRandomTyped } from "./typed-build.js";
import { defineFamily } from "./types.js";

const TWO_POW_32 = 4294967296;

/**
 * A set of pair keys u·n + v (u < v), exact below 2^53, in linear-probing open addressing
 * over a Float64Array (−1 marks an empty slot; load stays at most 0.7).
 */
export class PairKeySet {
  private readonly slots: Float64Array;
  private readonly mask: number;
  private count = 0;

  constructor(maxKeys: number) {
    let cap = 16;
    while (cap * 0.7 < maxKeys) cap *= 2;
    this.slots = new Float64Array(cap).fill(-1);
    this.mask = cap - 1;
  }

  get size(): number {
    return this.count;
  }

  private home(key: number): number {
    // Mix the low and high 32-bit halves (multiply–xorshift); only the slot index needs spreading.
    let h = (key >>> 0) ^ Math.imul(Math.floor(key / TWO_POW_32), 0x9e3779b1);
    h = Math.imul(h ^ (h >>> 16), 0x7feb352d);
    h = Math.imul(h ^ (h >>> 15), 0x846ca68b);
    return (h ^ (h >>> 16)) & this.mask;
  }

  /** Insert `key`; false when it was already present. */
  add(key: number): boolean {
    const s = this.slots;
    for (let i = this.home(key); ; i = (i + 1) & this.mask) {
      const x = s[i];
      if (x === key) return false;
      if (x === -1) {
        s[i] = key;
        this.count++;
        return true;
      }
    }
  }

  has(key: number): boolean {
    const s = this.slots;
    for (let i = this.home(key); ; i = (i + 1) & this.mask) {
      const x = s[i];
      if (x === key) return true;
      if (x === -1) return false;
    }
  }

  /** Calls f on every key, in slot order (a function of the inserted set and capacity only). */
  forEach(f: (key: number) => void): void {
    const s = this.slots;
    for (let i = 0; i < s.length; i++) if (s[i] !== -1) f(s[i]);
  }
}

/** `count` distinct uniformly random pairs of [0, n): the first `count` distinct draws of an i.i.d. stream. */
function distinctRandomPairs(n: number, count: number, rng: Rng): PairKeySet {
  const set = new PairKeySet(count);
  while (set.size < count) {
    const a = rng.nextInt(n);
    const b = rng.nextInt(n);
    if (a === b) continue;
    // Each unordered pair arises from two ordered draws, so pairs are uniform.
    set.add(a < b ? a * n + b : b * n + a);
  }
  return set;
}

function pairCount(n: number): number {
  return (n * (n - 1)) / 2;
}

function sampleGnm(n: number, m: number, rng: Rng): Graph {
  const total = pairCount(n);
  const buf = new EdgeBuffer({ capacity: m });
  if (m <= total / 2) {
    distinctRandomPairs(n, m, rng).forEach((key) => {
      const u = Math.floor(key / n);
      buf.add(u, key - u * n);
    });
  } else {
    // Dense: O(total) = O(m) to walk all pairs, keeping those not drawn as missing.
    const missing = distinctRandomPairs(n, total - m, rng);
    for (let u = 0; u < n; u++) {
      const base = u * n;
      for (let v = u + 1; v < n; v++) if (!missing.has(base + v)) buf.add(u, v);
    }
  }
  return buf.build(n).graph;
}

export const gnmFamily = defineFamily({
  name: "gnm",
  summary: "Erdős–Rényi random graph G(n, m): uniform over graphs with exactly m edges",
  params: [
    { name: "n", type: "integer", description: "number of vertices", min: 0, max: MAX_RANDOM_VERTICES },
    { name: "m", type: "integer", description: "number of edges, at most n(n−1)/2", min: 0 },
  ],
  random: true,
  freeOf: () => [],
  validate: (params) => {
    const n = params.n;
    const total = pairCount(n);
    if (params.m > total) {
      throw invalidParameter("gnm", "m", `should be an integer between 0 and n(n−1)/2 = ${total} for n = ${n}`, params.m);
    }
  },
  predictedSize: (params) => {
    const n = params.n;
    const m = params.m;
    const regular = n > 0 && (m === 0 || m === pairCount(n));
    return { n, m, mExact: true, ...(regular ? { minDegree: (2 * m) / n, maxDegree: (2 * m) / n } : {}) };
  },
  build: (params, ctx) => sampleGnm(params.n, params.m, ctx.rng),
  notes: ["Uniform over all labelled graphs with m edges (the first m distinct pairs of an i.i.d. uniform stream form a uniform m-subset)."],
});

/** G(n, m) from a graph seed (the graph of spec `gnm:n=…,m=…,seed=…`) or from a caller's Rng. */
export function gnm(n: number, m: number, graphSeed: number | Rng = 0): Graph {
  return buildRandomTyped(gnmFamily, { n, m }, graphSeed);
}
