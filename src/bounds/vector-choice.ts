// The best explicit-vector guarantee we can find: maximise
//   f(V, ε) = (1/2π)·Σ_i ε_i|V_i| − ½·Σ_{ij∈E} ε_iε_j|V_i ∩ V_j|   over V_i ⊆ N(i), 0 ≤ ε_i ≤ 1/√|V_i|.
//
// Why block coordinate ascent is exact per block. Only these terms involve (V_i, ε_i):
//   g_i = ε_i·Σ_{k∈V_i} b_ik,   b_ik = 1/(2π) − ½·w_ik,   w_ik = Σ_{j∈N(i), k∈V_j} ε_j
// (w_ik collects the neighbours j of i whose sets also hold k, i.e. the triangles ijk). With the
// other vertices fixed, g_i is linear in ε_i, so its maximum sits at ε_i = 0 or ε_i = 1/√|V_i|; for
// a set of size s the best V_i holds the s largest b_ik, giving max(0, max_s (Σ_{top s} b_ik)/√s).
// That is the exact maximiser of f over block i. With V_i = N(i) fixed, only ε_i ∈ {0, 1/√d_i}.
// f is not concave (the matrix of its quadratic part has a zero diagonal), so the ascent finds a
// point no single block change improves, not necessarily the global maximum; f restricted to any
// coordinate is linear, so the box maximum is at a vertex of the box, which is where the ascent moves.
//
// Convergence: a block is changed only when g_i rises by more than a relative 1e-12, the
// configurations (V, ε ∈ {0, cap}) are finitely many and f never falls, so the ascent stops; the
// sweep limit only bounds the work. Two starts are tried, the default choice (V_i = N(i),
// ε_i = 1/√d_i) and the few-triangles choice (uniform ε*), so the result is never below either.

import { invalidParameter, InputError } from "../errors.js";
import type { Graph } from "../graph/graph.js";
import { sharedTriangleCount } from "../graph/structure/triangles.js";
import { perGraph } from "../graph/per-graph.js";
import { float64Pool, int32Pool, uint8Pool } from "../graph/scratch.js";
import { boundDoesNotApply, type LowerBoundRecord } from "./types.js";
import { fewTrianglesChoice } from "./few-triangles.js";
import { VECTOR_LINEAR_FACTOR, VECTOR_OVERLAP_FACTOR, sharedDefaultVectorChoice, vectorMethodGuaranteeFor, type VectorGuaranteeRecord } from "./vector-guarantee.js";
import type { VectorSets } from "./vector-sets.js";

const OWNER = "vector choice";
const NAME = "vector-optimised";

export interface VectorChoiceOptions {
  /** Optimise the sets V_i ⊆ N(i) as well as ε (default true); false keeps V_i = N(i). */
  optimiseSets?: boolean;
  /** Most sweeps of block coordinate ascent from each start (default 100). */
  maxSweeps?: number;
}

/** Where the winning ascent started. */
export type VectorChoiceStart = "default" | "uniform";

export interface VectorChoiceRecord {
  /** The guarantee of the choice found, computed by the one guarantee evaluator (name "vector-optimised"). */
  guarantee: VectorGuaranteeRecord;
  /** The choice: V_i as sorted CSR lists and ε_i. */
  choice: VectorSets;
  optimiseSets: boolean;
  start: VectorChoiceStart;
  /** Sweeps run from the winning start. */
  sweeps: number;
  /** converged: a whole sweep changed nothing; iteration-limit: maxSweeps ran out first. */
  status: "converged" | "iteration-limit";
  /** f after each sweep of the winning start, the start's value first (non-decreasing). */
  trace: number[];
  /** Vertices with an edge whose ε_i ended at 0. */
  switchedOff: number;
  /** Σ_i (d_i − |V_i|) over vertices left on: neighbours dropped from their sets. */
  droppedMembers: number;
  /** The guarantee of the two starting choices. */
  defaultSurplus: number;
  uniformSurplus: number;
}

interface AscentResult {
  inSet: Uint8Array;
  eps: Float64Array;
  sweeps: number;
  converged: boolean;
  trace: number[];
}

/** Work arrays of the ascent, shared by both starts. */
interface Scratch {
  b: Float64Array;
  order: Int32Array;
  /** owner[k] = i while block i is evaluated; it only ever holds i for k ∈ N(i), so stale entries never match. */
  owner: Int32Array;
  slot: Int32Array;
}

// The scratch arrays come from pools (a sweep runs the optimiser on 10^5 tiny graphs; see
// src/graph/scratch.ts): b, order and slot are written before they are read, owner is reset here
// (a stale entry of another graph could match), dirty is filled at the start of each ascent. No
// call made while they are in use runs the optimiser again.
const bPool = float64Pool(), orderPool = int32Pool(), ownerPool = int32Pool(), slotPool = int32Pool(), dirtyPool = uint8Pool();

function scratchFor(graph: Graph): Scratch {
  const { n, offsets: off } = graph;
  let maxDeg = 0;
  for (let i = 0; i < n; i++) maxDeg = Math.max(maxDeg, off[i + 1] - off[i]);
  return { b: bPool.take(maxDeg), order: orderPool.take(maxDeg), owner: ownerPool.take(n).fill(-1), slot: slotPool.take(n) };
}

/**
 * order[0..d) := 0..d−1 sorted by b descending, ties by index ascending: the one order the
 * comparator (x, y) ↦ b[y] − b[x] || x − y defines (a total order), by insertion (d is a degree).
 */
function sortByGain(order: Int32Array, b: Float64Array, d: number): void {
  for (let t = 0; t < d; t++) {
    const bt = b[t];
    let s = t - 1;
    while (s >= 0 && b[order[s]] < bt) {
      order[s + 1] = order[s];
      s--;
    }
    order[s + 1] = t;
  }
}

/** Block coordinate ascent from (inSet, eps); both arrays are updated in place. */
function ascend(graph: Graph, inSet: Uint8Array, eps: Float64Array, start: number, inTriangle: Float64Array, optimiseSets: boolean, maxSweeps: number, scratch: Scratch): AscentResult {
  const { n, offsets: off, neighbors: nb } = graph;
  const { b, order, owner, slot } = scratch;
  const L = VECTOR_LINEAR_FACTOR;
  const Q = VECTOR_OVERLAP_FACTOR;
  // Block i's optimum depends only on (V_j, ε_j) for j ∈ N(i): a vertex is looked at again only
  // after a neighbour changed (all are dirty at the start).
  const dirty = dirtyPool.take(n).fill(1);
  let f = start;
  const trace = [f];
  let sweeps = 0;
  let converged = false;
  while (sweeps < maxSweeps) {
    sweeps++;
    let changed = 0;
    for (let i = 0; i < n; i++) {
      const o = off[i];
      const d = off[i + 1] - o;
      if (d === 0 || dirty[i] === 0) continue;
      dirty[i] = 0;
      for (let t = 0; t < d; t++) {
        owner[nb[o + t]] = i;
        slot[nb[o + t]] = t;
        b[t] = 0;
      }
      // A vertex in no triangle has w_ik = 0: no neighbour's set can hold a neighbour of i.
      if (inTriangle[i] > 0) {
        for (let a = o; a < o + d; a++) {
          const j = nb[a];
          const ej = eps[j];
          if (ej === 0) continue;
          for (let c = off[j]; c < off[j + 1]; c++) {
            if (inSet[c] === 0) continue;
            const k = nb[c];
            if (owner[k] === i) b[slot[k]] += ej;
          }
        }
      }
      let current = 0;
      let all = 0;
      for (let t = 0; t < d; t++) {
        b[t] = L - Q * b[t];
        all += b[t];
        if (inSet[o + t] === 1) current += b[t];
      }
      current *= eps[i];
      let best = 0;
      let bestSize = 0;
      if (!optimiseSets) {
        if (all > 0) {
          best = all / Math.sqrt(d);
          bestSize = d;
        }
      } else {
        sortByGain(order, b, d);
        let prefix = 0;
        for (let s = 1; s <= d; s++) {
          prefix += b[order[s - 1]];
          const v = prefix / Math.sqrt(s);
          if (v > best) {
            best = v;
            bestSize = s;
          }
        }
      }
      if (best > current + 1e-12 * (1 + Math.abs(current))) {
        changed++;
        f += best - current;
        for (let t = 0; t < d; t++) dirty[nb[o + t]] = 1;
        if (!optimiseSets) {
          eps[i] = bestSize === 0 ? 0 : 1 / Math.sqrt(d);
        } else {
          for (let t = 0; t < d; t++) inSet[o + t] = 0;
          for (let s = 0; s < bestSize; s++) inSet[o + order[s]] = 1;
          eps[i] = bestSize === 0 ? 0 : 1 / Math.sqrt(bestSize);
        }
      }
    }
    trace.push(f);
    if (changed === 0) {
      converged = true;
      break;
    }
  }
  return { inSet, eps, sweeps, converged, trace };
}

/** The CSR sets of a choice given by per-arc membership flags (the graph's own lists when nothing is dropped). */
function setsOf(graph: Graph, inSet: Uint8Array, eps: Float64Array): VectorSets {
  const n = graph.n;
  let all = true;
  for (let a = 0; a < inSet.length && all; a++) all = inSet[a] === 1;
  if (all) return { offsets: graph.offsets, members: graph.neighbors, eps, neighbourhoods: true };
  const offsets = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let a = graph.offsets[i]; a < graph.offsets[i + 1]; a++) s += inSet[a];
    offsets[i + 1] = offsets[i] + s;
  }
  const members = new Int32Array(offsets[n]);
  let p = 0;
  for (let a = 0; a < inSet.length; a++) if (inSet[a] === 1) members[p++] = graph.neighbors[a];
  const e = new Float64Array(n);
  for (let i = 0; i < n; i++) e[i] = offsets[i + 1] === offsets[i] ? 0 : eps[i];
  return { offsets, members, eps: e, neighbourhoods: false };
}

/**
 * Maximise the explicit vector method's guarantee over ε (and the sets V_i ⊆ N(i) unless
 * `optimiseSets: false`) by block coordinate ascent, exact per vertex; unweighted graphs only.
 * The guarantee holds for every such choice (the vector method; Shearer 1992 for the triangle-free
 * form). Throws InputError for a weighted graph or a bad option.
 */
export function optimiseVectorChoice(graph: Graph, options: VectorChoiceOptions = {}): VectorChoiceRecord {
  if (graph.weighted) throw new InputError(`${OWNER}: the graph is weighted; the vector-method guarantee is proved for unweighted graphs only`);
  const optimiseSets = options.optimiseSets ?? true;
  if (typeof optimiseSets !== "boolean") throw invalidParameter(OWNER, "optimiseSets", "should be true or false", optimiseSets);
  const maxSweeps = options.maxSweeps ?? 100;
  if (!Number.isInteger(maxSweeps) || maxSweeps < 1 || maxSweeps > 1e6) throw invalidParameter(OWNER, "maxSweeps", "should be an integer between 1 and 1e6", maxSweeps);

  const { n, offsets } = graph;
  const arcs = graph.neighbors.length;
  const triangles = sharedTriangleCount(graph);
  const inTriangle = triangles.perVertex;
  // With V_i = N(i) the per-edge overlaps depend on the graph alone: both starts share them (and
  // the vector-method evaluator of the same graph object, which computed them already).
  const { sets: defaultSets, terms, guarantee: defaultGuarantee } = sharedDefaultVectorChoice(graph);
  const defaultSurplus = defaultGuarantee.surplus as number;
  // The few-triangles bound's uniform ε* (unweighted here), on every vertex with an edge.
  let maxDegree = 0;
  for (let i = 0; i < n; i++) maxDegree = Math.max(maxDegree, offsets[i + 1] - offsets[i]);
  const uniformEps = fewTrianglesChoice(graph.m, graph.m === 0 ? 0 : triangles.total, maxDegree).eps;
  const uniform = new Float64Array(n);
  for (let i = 0; i < n; i++) uniform[i] = offsets[i + 1] > offsets[i] ? uniformEps : 0;
  const uniformSets: VectorSets = { offsets, members: graph.neighbors, eps: uniform, neighbourhoods: true };
  const uniformSurplus = vectorMethodGuaranteeFor(graph, uniformSets, terms).surplus as number;

  const scratch = scratchFor(graph);
  const fromDefault = ascend(graph, new Uint8Array(arcs).fill(1), defaultSets.eps.slice(), defaultSurplus, inTriangle, optimiseSets, maxSweeps, scratch);
  const fromUniform = ascend(graph, new Uint8Array(arcs).fill(1), uniform.slice(), uniformSurplus, inTriangle, optimiseSets, maxSweeps, scratch);
  const last = (r: AscentResult) => r.trace[r.trace.length - 1];
  const win = last(fromUniform) > last(fromDefault) ? fromUniform : fromDefault;
  const start: VectorChoiceStart = win === fromDefault ? "default" : "uniform";

  const choice = setsOf(graph, win.inSet, win.eps);
  const g = vectorMethodGuaranteeFor(graph, choice, choice.neighbourhoods ? terms : undefined);
  let switchedOff = 0;
  let droppedMembers = 0;
  for (let i = 0; i < graph.n; i++) {
    const d = graph.degree(i);
    if (d === 0) continue;
    if (choice.eps[i] === 0) switchedOff++;
    else droppedMembers += d - (choice.offsets[i + 1] - choice.offsets[i]);
  }
  const what = optimiseSets ? "the best V_i ⊆ N(i) and ε_i found" : "V_i = N(i) and the best ε_i found";
  const guarantee: VectorGuaranteeRecord = {
    name: NAME,
    value: g.value,
    surplus: g.surplus,
    applies: g.applies,
    reason: `explicit vector method with ${what} by block coordinate ascent (${switchedOff} vertices switched off, ${droppedMembers} set members dropped)`,
    linearTerm: g.linearTerm,
    overlapTerm: g.overlapTerm,
    overlapEdges: g.overlapEdges,
    normedTerm: g.normedTerm,
  };
  return {
    guarantee,
    choice,
    optimiseSets,
    start,
    sweeps: win.sweeps,
    status: win.converged ? "converged" : "iteration-limit",
    trace: win.trace,
    switchedOff,
    droppedMembers,
    defaultSurplus,
    uniformSurplus,
  };
}

/**
 * optimiseVectorChoice with the default options, computed once per Graph object: a sweep job asks
 * for it in the vector-optimised evaluator and again in the decomposition cut, whose remainder is
 * often the whole graph. Graphs are immutable; callers must treat the record as read-only.
 */
export const sharedVectorChoice: (graph: Graph) => VectorChoiceRecord = perGraph((g) => optimiseVectorChoice(g));

/** The optimised guarantee as a plain lower-bound record ("does not apply" for weighted graphs). */
export function vectorOptimisedBound(graph: Graph, options: VectorChoiceOptions = {}): LowerBoundRecord {
  if (graph.weighted) return boundDoesNotApply(NAME, "proved for unweighted graphs only");
  const defaults = options.optimiseSets === undefined && options.maxSweeps === undefined;
  const { name, value, surplus, applies, reason } = (defaults ? sharedVectorChoice(graph) : optimiseVectorChoice(graph, options)).guarantee;
  return { name, value, surplus, applies, reason };
}

/** A choice as the `sets` and `eps` options the rounding and the guarantee take. */
export function vectorChoiceOptions(choice: VectorSets): { sets: number[][]; eps: number[] } {
  const n = choice.offsets.length - 1;
  const sets: number[][] = [];
  for (let i = 0; i < n; i++) sets.push(Array.from(choice.members.subarray(choice.offsets[i], choice.offsets[i + 1])));
  return { sets, eps: Array.from(choice.eps) };
}
