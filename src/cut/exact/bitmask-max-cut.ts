// Exact max cut of a tiny graph (at most 30 vertices, tuned for n ≤ 20) with the adjacency held
// as one 32-bit mask per vertex: the census's per-graph solver, where millions of graphs of a
// dozen vertices each must cost little more than their enumeration.

import { InputError } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { hasIntegerWeights } from "../../graph/weights.js";
import { checkSeed } from "../../random/seed.js";
import { exactRecord, nowSeconds, type ExactCutRecord } from "./common.js";
import { popcount } from "../../graph/bits.js";

/** Largest n the bitmask search takes: one bit per vertex in a 32-bit integer, 2^(n−1) patterns at worst. */
export const BITMASK_MAX_VERTICES = 30;

/** What the search did, for records and benchmarks (never summed into one number). */
export interface BitmaskCutStats {
  /** Vertices left after leaves and isolated vertices were peeled off. */
  core: number;
  /** Gray-code steps taken over the core (0 when the core is bipartite or empty). */
  graySteps: number;
  /** The side-1 vertices of a maximum cut (vertex bit v set = vertex v on side 1). */
  side: number;
}

// Scratch for the hot path, sized once: the census calls this millions of times per thread.
const stripVertex = new Int32Array(BITMASK_MAX_VERTICES);
const stripNeighbour = new Int32Array(BITMASK_MAX_VERTICES);
const coreVerts = new Int32Array(BITMASK_MAX_VERTICES);
const coreDeg = new Int32Array(BITMASK_MAX_VERTICES);
const coreAdj = new Int32Array(BITMASK_MAX_VERTICES);

/**
 * The max cut of the graph whose vertex v has neighbours `adj[v]` (a bitmask, symmetric, no
 * loops), n ≤ BITMASK_MAX_VERTICES. `adj` is not modified. Fills `stats` when given.
 *
 * Three shortcuts keep the per-graph cost near the enumeration cost, each exact:
 * 1. A vertex of degree 1 is always cut from its neighbour in some maximum cut, so
 *    maxcut(G) = maxcut(G − v) + 1; such vertices are peeled repeatedly, isolated ones dropped
 *    (common practice, no source; it is the degree-1 case of the reduction rules for max cut in
 *    Ferizovic, Hespe, Lamm, Mnich, Schulz, Strash, "Engineering kernelization for maximum cut",
 *    ALENEX 2020).
 * 2. A bipartite core is cut completely (maxcut = m).
 * 3. Otherwise the core is not bipartite, so some edge stays uncut: maxcut ≤ m − 1, and the
 *    enumeration stops as soon as a cut reaches that bound.
 * The enumeration fixes the first core vertex on side 0 (a cut and its mirror are the same cut)
 * and walks the other 2^(k−1) patterns of the k core vertices in binary-reflected Gray-code order;
 * flipping vertex v changes the cut by deg(v) − 2·|N(v) ∩ other side|, one popcount per step.
 */
export function bitmaskMaxCut(adj: ArrayLike<number>, n: number, stats?: BitmaskCutStats): number {
  if (n > BITMASK_MAX_VERTICES) throw new InputError(`bitmaskMaxCut: graph has ${n} vertices; the bitmask search supports at most ${BITMASK_MAX_VERTICES}`);
  // Peel leaves. `alive` holds the vertices not yet peeled; degrees are counted inside it.
  let alive = n === 32 ? -1 : (1 << n) - 1;
  let peeled = 0;
  let bonus = 0;
  let changed = true;
  while (changed) {
    changed = false;
    for (let v = 0; v < n; v++) {
      const bit = 1 << v;
      if ((alive & bit) === 0) continue;
      const nb = adj[v] & alive;
      if (nb === 0) {
        alive &= ~bit; // isolated: no edge to cut
        changed = true;
      } else if ((nb & (nb - 1)) === 0) {
        stripVertex[peeled] = v;
        stripNeighbour[peeled] = 31 - Math.clz32(nb);
        peeled++;
        bonus++;
        alive &= ~bit;
        changed = true;
      }
    }
  }
  let k = 0;
  let twiceM = 0;
  for (let v = 0; v < n; v++) {
    if ((alive & (1 << v)) === 0) continue;
    coreVerts[k] = v;
    coreAdj[k] = adj[v] & alive;
    coreDeg[k] = popcount(coreAdj[k]);
    twiceM += coreDeg[k];
    k++;
  }
  const m = twiceM >> 1;
  let side = 0;
  let coreCut = 0;
  let steps = 0;
  if (k > 0) {
    // 2-colour the core breadth-first over masks; a clash means an odd cycle.
    let colourOne = 0;
    let seen = 0;
    let bipartite = true;
    for (let i = 0; i < k && bipartite; i++) {
      const root = 1 << coreVerts[i];
      if ((seen & root) !== 0) continue;
      seen |= root;
      let frontier = root;
      let frontierIsOne = false;
      while (frontier !== 0 && bipartite) {
        let next = 0;
        let f = frontier;
        while (f !== 0) {
          const v = 31 - Math.clz32(f & -f);
          f &= f - 1;
          next |= adj[v] & alive;
        }
        if ((next & frontier) !== 0) bipartite = false;
        if (frontierIsOne) colourOne |= frontier;
        next &= ~seen;
        seen |= next;
        frontier = next;
        frontierIsOne = !frontierIsOne;
      }
    }
    if (bipartite) {
      side = colourOne;
      coreCut = m;
    } else {
      const bound = m - 1;
      let s1 = 0; // side-1 core vertices, in vertex bits
      let cut = 0;
      let best = 0;
      let bestSide = 0;
      const patterns = 2 ** (k - 1);
      for (let s = 1; s < patterns; s++) {
        // Step s flips core vertex j + 1, j the lowest set bit of s (vertex coreVerts[0] stays on side 0).
        const j = 31 - Math.clz32(s & -s) + 1;
        const v = coreVerts[j];
        const bit = 1 << v;
        const nb = coreAdj[j];
        // Neighbours on v's own side become cut, the others uncut.
        const same = (s1 & bit) !== 0 ? nb & s1 : nb & ~s1;
        cut += 2 * popcount(same) - coreDeg[j];
        s1 ^= bit;
        if (cut > best) {
          best = cut;
          bestSide = s1;
          if (best >= bound) {
            steps = s;
            break;
          }
        }
        steps = s;
      }
      side = bestSide;
      coreCut = best;
    }
  }
  if (stats !== undefined) {
    // Put each peeled vertex opposite its neighbour, latest peeled first (its neighbour was still there).
    for (let i = peeled - 1; i >= 0; i--) {
      const v = stripVertex[i];
      if ((side & (1 << stripNeighbour[i])) === 0) side |= 1 << v;
      else side &= ~(1 << v);
    }
    stats.core = k;
    stats.graySteps = steps;
    stats.side = side;
  }
  return coreCut + bonus;
}

/** Neighbour masks of a graph with at most BITMASK_MAX_VERTICES vertices, into `out` (reused when long enough). */
export function adjacencyMasks(graph: Graph, out?: Int32Array): Int32Array {
  const { n, offsets, neighbors } = graph;
  if (n > BITMASK_MAX_VERTICES) throw new InputError(`adjacencyMasks: graph has ${n} vertices; bitmasks hold at most ${BITMASK_MAX_VERTICES}`);
  const adj = out !== undefined && out.length >= n ? out : new Int32Array(n);
  for (let v = 0; v < n; v++) {
    let mask = 0;
    for (let k = offsets[v]; k < offsets[v + 1]; k++) mask |= 1 << neighbors[k];
    adj[v] = mask;
  }
  return adj;
}

/**
 * Exact max cut of an unweighted graph of at most BITMASK_MAX_VERTICES vertices by the bitmask
 * search (`bitmaskMaxCut`), as an exact-search record (method `exact-bitmask`, status optimal,
 * upper = value). Weighted graphs are refused: the masks carry no weights.
 */
export function bitmaskExactMaxCut(graph: Graph, options: { solverSeed?: number } = {}): ExactCutRecord {
  const t0 = nowSeconds();
  const owner = "bitmaskExactMaxCut";
  const seed = checkSeed(owner, "solverSeed", options.solverSeed);
  if (graph.weights !== null && !(hasIntegerWeights(graph) && graph.weights.every((w) => w === 1))) {
    throw new InputError(`${owner}: the bitmask search takes unweighted graphs only`);
  }
  const stats: BitmaskCutStats = { core: 0, graySteps: 0, side: 0 };
  bitmaskMaxCut(adjacencyMasks(graph), graph.n, stats);
  const partition = new Uint8Array(graph.n);
  for (let v = 0; v < graph.n; v++) partition[v] = (stats.side >>> v) & 1;
  const search = { status: "optimal" as const, upper: null, slack: 0, graySteps: stats.graySteps, branchNodes: 0, t0, solverSeed: seed };
  return exactRecord("exact-bitmask", graph, partition, search, { core: stats.core, workUsed: stats.graySteps });
}
