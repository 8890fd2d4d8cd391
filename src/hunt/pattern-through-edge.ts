// Does adding the pair uv to an H-free graph create a copy of H? Any new copy uses the new edge,
// so it suffices to map some edge ab of H onto uv and extend: a backtracking search rooted at one
// edge, whose candidates at each step are the intersection of the bitset rows of the images of
// the step's earlier pattern neighbours. Local: it never looks beyond what those rows reach.

import { invalidParameter } from "../errors.js";
import type { Graph } from "../graph/graph.js";
import { MAX_PATTERN_VERTICES } from "../graph/structure/subgraph.js";
import type { MutableGraph } from "./mutable-graph.js";

/** One rooted search order: pattern edge (order[0], order[1]) first, then each vertex with its earlier neighbours. */
interface RootedOrder {
  order: Int32Array;
  /** back[i] = positions j < i whose pattern vertex is adjacent to order[i]. */
  back: Int32Array[];
}

/** H prepared for rooted tests: one search order per oriented edge of H (symmetric duplicates are kept: H is small). */
export interface RootedPattern {
  /** The pattern, as given. */
  graph: Graph;
  k: number;
  orders: RootedOrder[];
}

/** Prepare H (at least one edge, at most MAX_PATTERN_VERTICES vertices) for `createsPattern`. */
export function rootedPattern(pattern: Graph): RootedPattern {
  const k = pattern.n;
  if (k > MAX_PATTERN_VERTICES) throw invalidParameter("rootedPattern", "pattern", `should have at most ${MAX_PATTERN_VERTICES} vertices`, `${k} vertices`);
  if (pattern.m === 0) throw invalidParameter("rootedPattern", "pattern", "should have at least one edge (an edgeless H is in every graph with enough vertices)", "no edges");
  const orders: RootedOrder[] = [];
  for (let a = 0; a < k; a++) {
    for (const b of pattern.neighborsOf(a)) {
      const order = [a, b];
      const placed = new Uint8Array(k);
      placed[a] = placed[b] = 1;
      while (order.length < k) {
        // Most links to placed vertices first: the candidate sets shrink fastest.
        let best = -1, bestLinks = -1;
        for (let x = 0; x < k; x++) {
          if (placed[x]) continue;
          let links = 0;
          for (const y of pattern.neighborsOf(x)) if (placed[y]) links++;
          if (links > bestLinks) { best = x; bestLinks = links; }
        }
        order.push(best);
        placed[best] = 1;
      }
      const pos = new Int32Array(k);
      order.forEach((x, i) => (pos[x] = i));
      const back = order.map((x, i) => Int32Array.from([...pattern.neighborsOf(x)].map((y) => pos[y]).filter((j) => j < i)));
      orders.push({ order: Int32Array.from(order), back });
    }
  }
  return { graph: pattern, k, orders };
}

/** Scratch space for one host size, reused across calls (no allocation per test). */
export class RootedSearch {
  private readonly cand: Uint32Array;
  private readonly used: Uint32Array;
  private readonly map: Int32Array;

  constructor(
    private readonly host: MutableGraph,
    private readonly h: RootedPattern,
  ) {
    this.cand = new Uint32Array(h.k * host.words);
    this.used = new Uint32Array(host.words);
    this.map = new Int32Array(h.k);
  }

  /** Would the non-edge uv, once added, lie on a copy of H? (The host is left unchanged.) */
  createsPattern(u: number, v: number): boolean {
    const g = this.host;
    if (u === v || g.has(u, v)) throw invalidParameter("createsPattern", "pair", "should be two distinct non-adjacent vertices", `${u}, ${v}`);
    if (this.h.k > g.n) return false;
    g.add(u, v);
    try {
      return this.throughEdge(u, v);
    } finally {
      g.remove(u, v);
    }
  }

  /** Does the present edge uv lie on a copy of H? */
  throughEdge(u: number, v: number): boolean {
    for (const o of this.h.orders) {
      this.map[0] = u;
      this.map[1] = v;
      this.used.fill(0);
      this.used[u >>> 5] |= 1 << (u & 31);
      this.used[v >>> 5] |= 1 << (v & 31);
      if (this.extend(o, 2)) return true;
    }
    return false;
  }

  private extend(o: RootedOrder, i: number): boolean {
    const k = this.h.k;
    if (i === k) return true;
    const g = this.host;
    const words = g.words;
    const base = i * words;
    const back = o.back[i];
    for (let w = 0; w < words; w++) {
      let x = back.length === 0 ? (w === words - 1 && (g.n & 31) !== 0 ? (1 << (g.n & 31)) - 1 : 0xffffffff) : 0xffffffff;
      for (let t = 0; t < back.length; t++) x &= g.rows[this.map[back[t]] * words + w];
      this.cand[base + w] = (x & ~this.used[w]) >>> 0;
    }
    for (let w = 0; w < words; w++) {
      let x = this.cand[base + w];
      while (x !== 0) {
        const low = x & -x;
        x ^= low;
        const y = (w << 5) + 31 - Math.clz32(low);
        this.map[i] = y;
        this.used[w] |= low;
        const found = this.extend(o, i + 1);
        this.used[w] &= ~low;
        if (found) return true;
      }
    }
    return false;
  }
}
