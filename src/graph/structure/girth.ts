// Girth (length of a shortest cycle) with a shortest cycle as witness: BFS from each 2-core
// vertex over larger vertices, stopped once it cannot beat the best cycle so far.

import type { Graph } from "../graph.js";
import { int32Pool, uint8Pool } from "../scratch.js";

// Scratch per role (tiny graphs come by the hundred thousand); each is initialised before it is read.
const compPool = int32Pool(), queuePool = int32Pool(), onlyCyclePool = uint8Pool();
const seenPool = int32Pool(), distPool = int32Pool(), parentPool = int32Pool();
const degPool = int32Pool(), stackPool = int32Pool(), inCorePool = uint8Pool();

export interface GirthResult {
  /** Length of a shortest cycle, or null when the graph is a forest. */
  girth: number | null;
  /** A shortest cycle [v0, …, v_{g-1}] (v_i ~ v_{i+1}, v_{g-1} ~ v0), or null for a forest. */
  cycle: number[] | null;
}

/**
 * Cycles live in the 2-core. A 2-core component that is itself a cycle is read off directly;
 * elsewhere one BFS per root s runs over vertices ≥ s (a shortest cycle is found from its
 * smallest vertex) and stops once it cannot beat the best so far. Worst case O(n·m).
 */
export function girth(g: Graph): GirthResult {
  const { n, offsets, neighbors } = g;
  const inCore = twoCore(g);
  let best = Infinity;
  let cycle: number[] | null = null;

  // Components of the 2-core; one whose vertices all have 2 core neighbours is a cycle.
  const comp = compPool.take(n).fill(-1);
  const queue = queuePool.take(n);
  const onlyCycle = onlyCyclePool.take(n).fill(0); // 1 for vertices of a 2-core component that is a plain cycle
  for (let s = 0; s < n; s++) {
    if (!inCore[s] || comp[s] >= 0) continue;
    let head = 0, tail = 0, allTwo = true;
    queue[tail++] = s;
    comp[s] = s;
    while (head < tail) {
      const u = queue[head++];
      let cd = 0;
      for (let i = offsets[u]; i < offsets[u + 1]; i++) {
        const w = neighbors[i];
        if (!inCore[w]) continue;
        cd++;
        if (comp[w] < 0) {
          comp[w] = s;
          queue[tail++] = w;
        }
      }
      if (cd !== 2) allTwo = false;
    }
    if (!allTwo) continue;
    for (let i = 0; i < tail; i++) onlyCycle[queue[i]] = 1;
    if (tail < best) {
      best = tail;
      cycle = walkCycle(g, inCore, s, tail);
    }
  }

  const seen = seenPool.take(n).fill(0); // = s + 1 when visited from root s
  const dist = distPool.take(n); // read only where seen[·] marks it written from this root
  const parent = parentPool.take(n); // likewise
  for (let s = 0; s < n && best > 3; s++) {
    if (!inCore[s] || onlyCycle[s]) continue;
    // A shortest cycle is found from its smallest vertex, so vertices below s can be ignored.
    const stamp = s + 1;
    let head = 0, tail = 0;
    queue[tail++] = s;
    seen[s] = stamp;
    dist[s] = 0;
    parent[s] = -1;
    while (head < tail) {
      const u = queue[head++];
      const du = dist[u];
      if (2 * du + 1 >= best) break; // every closed walk through u from here has length ≥ 2du + 1
      for (let i = offsets[u]; i < offsets[u + 1]; i++) {
        const w = neighbors[i];
        if (w < s || !inCore[w]) continue;
        if (seen[w] !== stamp) {
          seen[w] = stamp;
          dist[w] = du + 1;
          parent[w] = u;
          queue[tail++] = w;
        } else if (w !== parent[u] && du + dist[w] + 1 < best) {
          const c = treeCycle(parent, u, w);
          if (c.length < best) {
            best = c.length;
            cycle = c;
          }
        }
      }
    }
  }
  return cycle === null ? { girth: null, cycle: null } : { girth: best, cycle };
}

/** Peel vertices of degree ≤ 1 until none remain: what is left (the 2-core) holds every cycle. */
function twoCore(g: Graph): Uint8Array {
  const { n, offsets, neighbors } = g;
  const deg = degPool.take(n);
  const stack = stackPool.take(n);
  const inCore = inCorePool.take(n).fill(1);
  let top = 0;
  for (let v = 0; v < n; v++) {
    deg[v] = offsets[v + 1] - offsets[v];
    if (deg[v] <= 1) {
      inCore[v] = 0;
      stack[top++] = v;
    }
  }
  while (top > 0) {
    const v = stack[--top];
    for (let i = offsets[v]; i < offsets[v + 1]; i++) {
      const w = neighbors[i];
      if (inCore[w] && --deg[w] <= 1) {
        inCore[w] = 0;
        stack[top++] = w;
      }
    }
  }
  return inCore;
}

/** Walk a 2-core component that is a cycle of `len` vertices, starting at s. */
function walkCycle(g: Graph, inCore: Uint8Array, s: number, len: number): number[] {
  const out = [s];
  let prev = -1, cur = s;
  while (out.length < len) {
    let next = -1;
    for (let i = g.offsets[cur]; i < g.offsets[cur + 1]; i++) {
      const w = g.neighbors[i];
      if (inCore[w] && w !== prev) { next = w; break; }
    }
    prev = cur;
    cur = next;
    out.push(cur);
  }
  return out;
}

/** The cycle closed by non-tree edge u–w: tree paths to the root, trimmed at their lowest common ancestor. */
function treeCycle(parent: Int32Array, u: number, w: number): number[] {
  const up: number[] = [];
  for (let x = u; x !== -1; x = parent[x]) up.push(x);
  const wp: number[] = [];
  for (let x = w; x !== -1; x = parent[x]) wp.push(x);
  // Root paths share a suffix (from the common ancestor up); keep one copy of the ancestor.
  while (up.length >= 2 && wp.length >= 2 && up[up.length - 2] === wp[wp.length - 2]) {
    up.pop();
    wp.pop();
  }
  wp.pop();
  return [...up, ...wp.reverse()];
}
