// The random H-free process: visit all pairs in uniformly random order and add each pair as an
// edge unless that creates a copy of H (K3, C4, C5, K4 or K2,3). Adding edges only creates
// copies, so a pair rejected once stays rejected: after one pass the graph is maximal H-free.

import { buildGraph } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import type { Rng } from "../random/prng.js";
import { buildRandomTyped } from "./typed-build.js";
import { defineFamily } from "./types.js";

export const HFREE_PATTERNS = ["K3", "C4", "C5", "K4", "K2,3"] as const;
export type HFreePattern = (typeof HFREE_PATTERNS)[number];

/** Pairs are packed as u·2^16 + v in a Uint32Array (all C(n, 2) of them: 200 MB at n = 10^4). */
export const HFREE_MAX_VERTICES = 10000;

/** Growing graph: bitset rows for O(1) adjacency and growable neighbour lists. */
class GrowingGraph {
  readonly n: number;
  readonly words: number;
  readonly bits: Uint32Array;
  readonly lists: Int32Array[];
  readonly deg: Int32Array;

  constructor(n: number) {
    this.n = n;
    this.words = Math.ceil(n / 32);
    this.bits = new Uint32Array(n * this.words);
    this.lists = Array.from({ length: n }, () => new Int32Array(4));
    this.deg = new Int32Array(n);
  }

  has(u: number, v: number): boolean {
    return ((this.bits[u * this.words + (v >>> 5)] >>> (v & 31)) & 1) === 1;
  }

  private push(u: number, v: number): void {
    let list = this.lists[u];
    if (this.deg[u] === list.length) {
      const bigger = new Int32Array(list.length * 2);
      bigger.set(list);
      this.lists[u] = list = bigger;
    }
    list[this.deg[u]++] = v;
  }

  add(u: number, v: number): void {
    this.bits[u * this.words + (v >>> 5)] |= 1 << (v & 31);
    this.bits[v * this.words + (u >>> 5)] |= 1 << (u & 31);
    this.push(u, v);
    this.push(v, u);
  }
}

/**
 * How one pattern is tested: `closes(u, v)` for a non-edge uv says whether adding it would
 * create a copy of H; `added(u, v)` updates the rule's own bookkeeping after uv became an edge.
 */
interface PatternRule {
  closes(u: number, v: number): boolean;
  added(u: number, v: number): void;
}

function setBit(rows: Uint32Array, words: number, r: number, c: number): void {
  rows[r * words + (c >>> 5)] |= 1 << (c & 31);
}

/**
 * K3: uv closes a triangle iff u and v have a common neighbour. Kept as a bitset of such pairs:
 * a new edge ab gives b a common neighbour with every other x ~ a (and a with every x ~ b).
 */
function triangleRule(g: GrowingGraph): PatternRule {
  const { words, lists, deg } = g;
  const shared = new Uint32Array(g.n * words);
  const spread = (a: number, b: number): void => {
    const la = lists[a];
    for (let i = 0; i < deg[a]; i++) {
      const x = la[i];
      if (x === b) continue;
      setBit(shared, words, b, x);
      setBit(shared, words, x, b);
    }
  };
  return {
    closes: (u, v) => ((shared[u * words + (v >>> 5)] >>> (v & 31)) & 1) === 1,
    added: (a, b) => {
      spread(a, b);
      spread(b, a);
    },
  };
}

/**
 * Bitset rows S(x) = the ends of walks of length 2 from x (x itself included once deg x > 0),
 * kept up to date: a new edge ab adds exactly the walks that use it, a–b–z, b–a–z, z–a–b, z–b–a.
 */
function walkTwoRows(g: GrowingGraph): { rows: Uint32Array; added: (a: number, b: number) => void } {
  const { words, bits, lists, deg } = g;
  const rows = new Uint32Array(g.n * words);
  return {
    rows,
    added: (a, b) => {
      const ra = a * words, rb = b * words;
      for (let w = 0; w < words; w++) {
        rows[ra + w] |= bits[rb + w];
        rows[rb + w] |= bits[ra + w];
      }
      const la = lists[a], lb = lists[b];
      for (let i = 0; i < deg[a]; i++) setBit(rows, words, la[i], b);
      for (let i = 0; i < deg[b]; i++) setBit(rows, words, lb[i], a);
    },
  };
}

/**
 * C4: uv closes a 4-cycle iff a path u–x–y–v exists, i.e. N(u) meets S(v) (x ≠ v and y ≠ u
 * hold since uv is not an edge).
 */
function fourCycleRule(g: GrowingGraph): PatternRule {
  const { words, bits } = g;
  const walks = walkTwoRows(g);
  const reach2 = walks.rows;
  return {
    closes: (u, v) => {
      const a = u * words, b = v * words;
      for (let w = 0; w < words; w++) if ((bits[a + w] & reach2[b + w]) !== 0) return true;
      return false;
    },
    added: walks.added,
  };
}

/** K4: uv closes a K4 iff two adjacent vertices are common neighbours of u and v. */
function k4Rule(g: GrowingGraph): PatternRule {
  const { words, bits } = g;
  const common = new Int32Array(g.n);
  return {
    closes: (u, v) => {
      const a = u * words, b = v * words;
      let k = 0;
      for (let w = 0; w < words; w++) {
        let x = bits[a + w] & bits[b + w];
        while (x !== 0) {
          const low = x & -x;
          const y = (w << 5) + 31 - Math.clz32(low);
          for (let i = 0; i < k; i++) if (g.has(y, common[i])) return true;
          common[k++] = y;
          x ^= low;
        }
      }
      return false;
    },
    added: () => {},
  };
}

/**
 * C5: uv closes a 5-cycle iff a path u–a–b–c–v on five distinct vertices exists: a middle
 * vertex b ∉ {u, v} in S(u) ∩ S(v) whose links a ∈ N(u) ∩ N(b) and c ∈ N(v) ∩ N(b) can be
 * chosen distinct, which fails only when both sets are the same single vertex.
 */
function fiveCycleRule(g: GrowingGraph): PatternRule {
  const { words, lists, deg } = g;
  const walks = walkTwoRows(g);
  const reach2 = walks.rows;
  const distinctLinks = (u: number, v: number, b: number): boolean => {
    const lb = lists[b];
    let viaU = -1, viaV = -1;
    for (let i = 0, db = deg[b]; i < db; i++) {
      const x = lb[i];
      if (g.has(u, x)) {
        if (viaU >= 0 || (viaV >= 0 && viaV !== x)) return true;
        viaU = x;
      }
      if (g.has(v, x)) {
        if (viaV >= 0 || (viaU >= 0 && viaU !== x)) return true;
        viaV = x;
      }
    }
    return false;
  };
  return {
    closes: (u, v) => {
      const a = u * words, c = v * words;
      for (let w = 0; w < words; w++) {
        let x = reach2[a + w] & reach2[c + w];
        while (x !== 0) {
          const low = x & -x;
          x ^= low;
          const b = (w << 5) + 31 - Math.clz32(low);
          if (b !== u && b !== v && distinctLinks(u, v, b)) return true;
        }
      }
      return false;
    },
    added: walks.added,
  };
}

/**
 * K2,3: every edge of K2,3 joins its 2-side to its 3-side, so uv closes one iff u and some
 * w ~ v have two common neighbours (neither is v, since v ≁ u), or v and some w ~ u do.
 * Common-neighbour counts are kept in an n×n byte matrix (at most 2 while K2,3-free; saturating).
 */
function k23Rule(g: GrowingGraph): PatternRule {
  const { n, lists, deg } = g;
  const codegree = new Uint8Array(n * n);
  const bump = (a: number, b: number): void => {
    // b became a neighbour of a: b gains a common neighbour (a) with every other x ~ a.
    const la = lists[a];
    for (let i = 0; i < deg[a]; i++) {
      const x = la[i];
      if (x === b) continue;
      if (codegree[x * n + b] < 255) codegree[x * n + b]++;
      if (codegree[b * n + x] < 255) codegree[b * n + x]++;
    }
  };
  return {
    closes: (u, v) => {
      const lu = lists[u], lv = lists[v];
      for (let i = 0; i < deg[v]; i++) if (codegree[u * n + lv[i]] >= 2) return true;
      for (let i = 0; i < deg[u]; i++) if (codegree[v * n + lu[i]] >= 2) return true;
      return false;
    },
    added: (a, b) => {
      bump(a, b);
      bump(b, a);
    },
  };
}

const RULES: Record<HFreePattern, (g: GrowingGraph) => PatternRule> = {
  K3: triangleRule,
  C4: fourCycleRule,
  C5: fiveCycleRule,
  K4: k4Rule,
  "K2,3": k23Rule,
};

function runProcess(n: number, h: HFreePattern, edgeLimit: number, rng: Rng): Graph {
  const total = (n * (n - 1)) / 2;
  const pairs = new Uint32Array(total);
  for (let u = 0, k = 0; u < n; u++) for (let v = u + 1; v < n; v++) pairs[k++] = u * 65536 + v;
  const g = new GrowingGraph(n);
  const rule = RULES[h](g);
  const limit = edgeLimit === 0 ? total : edgeLimit;
  const us = new Int32Array(Math.min(limit, total));
  const vs = new Int32Array(Math.min(limit, total));
  let m = 0;
  // Fisher–Yates drawn lazily: step t takes a uniform pair among those not yet visited.
  for (let t = 0; t < total && m < limit; t++) {
    const j = t + rng.nextInt(total - t);
    const pair = pairs[j];
    pairs[j] = pairs[t];
    const u = pair >>> 16;
    const v = pair & 0xffff;
    if (rule.closes(u, v)) continue;
    g.add(u, v);
    rule.added(u, v);
    us[m] = u;
    vs[m] = v;
    m++;
  }
  return buildGraph(n, us.subarray(0, m), vs.subarray(0, m)).graph;
}

/** Bohman & Keevash (2010): the H-free process ends with order n^{2 − (v−2)/(e−1)} (log n)^{1/(e−1)} edges. */
const PATTERN_SIZE: Record<HFreePattern, { v: number; e: number; constant: number }> = {
  // 1/(2√2): Bohman & Keevash (2013); Fiz Pontiveros, Griffiths & Morris (2013).
  K3: { v: 3, e: 3, constant: 1 / (2 * Math.SQRT2) },
  C4: { v: 4, e: 4, constant: 1 },
  C5: { v: 5, e: 5, constant: 1 },
  K4: { v: 4, e: 6, constant: 1 },
  "K2,3": { v: 5, e: 6, constant: 1 },
};

export const hfreeProcessFamily = defineFamily({
  name: "hfree-process",
  summary: "random H-free process: pairs in random order, each added unless it creates a copy of H",
  params: [
    { name: "n", type: "integer", description: "number of vertices", min: 1, max: HFREE_MAX_VERTICES },
    { name: "h", type: "string", description: "the forbidden graph H", choices: HFREE_PATTERNS },
    { name: "edges", type: "integer", description: "stop after this many edges (0: run until the graph is maximal H-free)", default: 0, min: 0 },
  ],
  random: true,
  freeOf: (params) => [{ pattern: params.h, citation: "by construction: no edge that completes a copy of H is ever added" }],
  predictedSize: (params) => {
    const n = params.n;
    const edges = params.edges;
    const { v, e, constant } = PATTERN_SIZE[params.h];
    const ln = Math.log(Math.max(n, 2));
    const estimate = constant * n ** (2 - (v - 2) / (e - 1)) * ln ** (1 / (e - 1));
    const cap = Math.min((n * (n - 1)) / 2, edges === 0 ? Infinity : edges);
    return { n, m: Math.min(estimate, cap), mExact: false };
  },
  build: (params, ctx) => runProcess(params.n, params.h, params.edges, ctx.rng),
  notes: [
    "Final size: (1/(2√2) + o(1)) n^{3/2} √(log n) edges for K3 (Bohman & Keevash 2013; Fiz Pontiveros, Griffiths & Morris 2013).",
    "Order n^{2−(v−2)/(e−1)} (log n)^{1/(e−1)} for strictly 2-balanced H (Bohman & Keevash 2010); the predicted size uses constant 1 for C4, C5, K4, K2,3.",
  ],
});

/** The H-free process from a graph seed (spec `hfree-process:n=…,h=…,seed=…`) or a caller's Rng. */
export function hfreeProcess(n: number, h: HFreePattern, graphSeed: number | Rng = 0, edges = 0): Graph {
  return buildRandomTyped(hfreeProcessFamily, { n, h, edges }, graphSeed);
}
