// Symmetry-breaking conditions for subgraph search: "image of a < image of b" pairs from a
// stabiliser chain of the pattern's automorphisms (Grochow & Kellis 2007).

import type { Graph } from "../graph.js";

/** Give up on one automorphism query after this many search nodes: a smaller orbit is still sound. */
const AUTOMORPHISM_QUERY_BUDGET = 100_000;

/**
 * Conditions [a, b] (pattern vertices) with image(a) < image(b). Built as: take a vertex v
 * in a nontrivial orbit of the current group H, require v's image below those of the rest
 * of its orbit, replace H by the stabiliser of v, repeat. Any embedding f can be composed with
 * an automorphism to meet them (pick σ ∈ H moving v to the orbit element of least f-value), so
 * searching only for conditioned embeddings loses no occurrence; an orbit found too small
 * (query budget) only drops conditions, which stays sound.
 */
export function symmetryConditions(p: Graph, preferOrder?: ArrayLike<number>): [number, number][] {
  const k = p.n;
  const order = preferOrder === undefined ? Array.from({ length: k }, (_, i) => i) : Array.from(preferOrder);
  const adj = new Uint32Array(k);
  for (let v = 0; v < k; v++) for (const w of p.neighborsOf(v)) adj[v] |= 1 << w;
  const fixedList: number[] = [];
  const conditions: [number, number][] = [];
  for (;;) {
    let added = false;
    for (const v of order) {
      if (fixedList.includes(v)) continue;
      const orbit: number[] = [];
      for (let w = 0; w < k; w++) {
        if (w === v || fixedList.includes(w)) continue;
        if (p.degree(w) !== p.degree(v)) continue;
        if (automorphismExists(p, adj, fixedList, v, w)) orbit.push(w);
      }
      if (orbit.length === 0) continue;
      for (const w of orbit) conditions.push([v, w]);
      fixedList.push(v);
      added = true;
      break;
    }
    if (!added) return conditions;
  }
}

/** Is there an automorphism fixing every vertex of `fixed` and sending v to w? (budgeted backtracking) */
function automorphismExists(p: Graph, adj: Uint32Array, fixed: number[], v: number, w: number): boolean {
  const k = p.n;
  const img = new Int32Array(k).fill(-1);
  let usedMask = 0;
  for (const f of fixed) {
    img[f] = f;
    usedMask |= 1 << f;
  }
  img[v] = w;
  usedMask |= 1 << w;
  // Preassigned pairs must already respect adjacency.
  const pre = [...fixed, v];
  for (const a of pre) for (const b of pre) if (a < b && ((adj[a] >>> b) & 1) !== ((adj[img[a]] >>> img[b]) & 1)) return false;
  const rest: number[] = [];
  for (let x = 0; x < k; x++) if (img[x] < 0) rest.push(x);
  let nodes = 0;
  const place = (i: number): boolean => {
    if (i === rest.length) return true;
    const x = rest[i];
    for (let y = 0; y < k; y++) {
      if ((usedMask >>> y) & 1 || p.degree(y) !== p.degree(x)) continue;
      if (++nodes > AUTOMORPHISM_QUERY_BUDGET) return false;
      let ok = true;
      for (let z = 0; z < k && ok; z++) {
        const iz = img[z];
        if (iz >= 0 && ((adj[x] >>> z) & 1) !== ((adj[y] >>> iz) & 1)) ok = false;
      }
      if (!ok) continue;
      img[x] = y;
      usedMask |= 1 << y;
      if (place(i + 1)) return true;
      img[x] = -1;
      usedMask &= ~(1 << y);
      if (nodes > AUTOMORPHISM_QUERY_BUDGET) return false;
    }
    return false;
  };
  return place(0);
}
