// The automorphisms of a graph, listed one by one, for searches that skip parts of their search
// space which are images of parts already searched (the exact max-cut tree, src/cut/tree/).
//
// Plain backtracking: vertices are mapped in an order where each next vertex has as many mapped
// neighbours as possible, and a vertex's candidates are the unused vertices of its degree whose
// adjacency to every mapped vertex matches (bitsets). On structured graphs (the polarity graphs:
// a few mapped vertices force the rest) the work is about n² words per automorphism; on graphs with
// no symmetry most candidates die within a few levels. Both the number of automorphisms listed and
// the search nodes are capped, so the cost is bounded; a list cut short is still a list of
// automorphisms (every use of it must only rely on each element being one, never on the list being
// the whole group). Common practice, no source.

import { popcount } from "../bits.js";
import type { Graph } from "../graph.js";

export interface AutomorphismOptions {
  /** Stop after listing this many automorphisms, the identity included (default 5000). */
  maxElements?: number;
  /** Stop after this many search nodes (candidate placements; default 2,000,000). */
  maxNodes?: number;
}

export interface AutomorphismList {
  /** Each a permutation p with uv an edge iff p[u]p[v] is one, of the same weight; the identity first. */
  elements: Int32Array[];
  /** True when the search ran to its end: `elements` is then the whole group. */
  complete: boolean;
  /** Search nodes used. */
  nodes: number;
}

/** Is `perm` an automorphism of `graph` (a permutation of its vertices keeping every edge and its weight)? */
export function isAutomorphism(graph: Graph, perm: ArrayLike<number>): boolean {
  const n = graph.n;
  if (perm.length !== n) return false;
  const seen = new Uint8Array(n);
  for (let v = 0; v < n; v++) {
    const p = perm[v];
    if (!Number.isInteger(p) || p < 0 || p >= n || seen[p] === 1) return false;
    seen[p] = 1;
  }
  // A permutation is a bijection on vertices; mapping every edge to an edge of the same weight
  // (same edge count) makes it a bijection on edges.
  let ok = true;
  graph.forEachEdge((u, v, w) => {
    if (ok && (!graph.hasEdge(perm[u], perm[v]) || graph.edgeWeight(perm[u], perm[v]) !== w)) ok = false;
  });
  return ok;
}

/** List the automorphisms of `graph` (see the file header), within the caps of `options`. */
export function listAutomorphisms(graph: Graph, options: AutomorphismOptions = {}): AutomorphismList {
  const n = graph.n;
  const maxElements = options.maxElements ?? 5000;
  const maxNodes = options.maxNodes ?? 2_000_000;
  const elements: Int32Array[] = [];
  if (n === 0) return { elements: [new Int32Array(0)], complete: true, nodes: 0 };
  const W = (n + 31) >>> 5;
  const adj = new Uint32Array(n * W);
  for (let v = 0; v < n; v++) for (const u of graph.neighborsOf(v)) adj[v * W + (u >>> 5)] |= 1 << (u & 31);
  const byDegree = new Map<number, Uint32Array>();
  for (let v = 0; v < n; v++) {
    const d = graph.degree(v);
    let mask = byDegree.get(d);
    if (mask === undefined) byDegree.set(d, (mask = new Uint32Array(W)));
    mask[v >>> 5] |= 1 << (v & 31);
  }
  // The mapping order: start in the smallest degree class, then always the vertex with the most
  // neighbours already ordered (its candidates are the most constrained).
  const order = new Int32Array(n);
  const inOrder = new Uint8Array(n);
  const ordered = new Int32Array(n);
  const classSize = (v: number): number => {
    let c = 0;
    for (const x of byDegree.get(graph.degree(v))!) c += popcount(x);
    return c;
  };
  for (let i = 0; i < n; i++) {
    let best = -1;
    for (let v = 0; v < n; v++) {
      if (inOrder[v] === 1) continue;
      if (best < 0 || ordered[v] > ordered[best] || (ordered[v] === ordered[best] && i === 0 && classSize(v) < classSize(best))) best = v;
    }
    order[i] = best;
    inOrder[best] = 1;
    for (const u of graph.neighborsOf(best)) ordered[u]++;
  }
  const img = new Int32Array(n).fill(-1);
  const used = new Uint32Array(W);
  const cand = new Uint32Array(n * W);
  let nodes = 0;
  let stopped = false;
  const weighted = graph.weighted;
  const place = (i: number): void => {
    if (i === n) {
      const perm = Int32Array.from(img);
      if (!weighted || isAutomorphism(graph, perm)) elements.push(perm);
      if (elements.length >= maxElements) stopped = true;
      return;
    }
    const x = order[i];
    const c = cand.subarray(i * W, (i + 1) * W);
    c.set(byDegree.get(graph.degree(x))!);
    for (let k = 0; k < W; k++) c[k] &= ~used[k];
    for (let j = 0; j < i; j++) {
      const z = order[j], y = img[z];
      const row = y * W;
      if ((adj[x * W + (z >>> 5)] >>> (z & 31)) & 1) for (let k = 0; k < W; k++) c[k] &= adj[row + k];
      else for (let k = 0; k < W; k++) c[k] &= ~adj[row + k];
    }
    // The identity first: try x itself before the others.
    const tryOne = (y: number): void => {
      if (++nodes > maxNodes) {
        stopped = true;
        return;
      }
      img[x] = y;
      used[y >>> 5] |= 1 << (y & 31);
      place(i + 1);
      used[y >>> 5] &= ~(1 << (y & 31));
      img[x] = -1;
    };
    if ((c[x >>> 5] >>> (x & 31)) & 1) tryOne(x);
    for (let k = 0; k < W && !stopped; k++) {
      let bits = c[k];
      while (bits !== 0 && !stopped) {
        const b = 31 - Math.clz32(bits & -bits);
        bits &= bits - 1;
        const y = k * 32 + b;
        if (y !== x) tryOne(y);
      }
    }
  };
  place(0);
  return { elements, complete: !stopped, nodes };
}

