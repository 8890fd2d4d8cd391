// Sparse vector rounding ("the explicit vector method"): vertex i gets x_i = e_i − ε_i·Σ_{k∈V_i} e_k,
// and a Gaussian g puts i on side [g·x_i > 0], with g·x_i = g_i − ε_i·Σ_{k∈V_i} g_k: O(n + Σ|V_i|)
// per trial. Also the exact expected cut, edge by edge, to set against the guarantee.

import { intersectionSize, resolveVectorSets, sortedContains, vectorEdgeTerms, type VectorEdgeTerms, type VectorSetOptions, type VectorSets } from "../../bounds/vector-sets.js";
import { vectorMethodGuaranteeFor } from "../../bounds/vector-guarantee.js";
import type { Graph } from "../../graph/graph.js";
import { Rng } from "../../random/prng.js";
import { checkSeed } from "../../random/seed.js";
import { cutValue, surplusOf } from "../../graph/cut-value.js";
import { FlipState } from "./flip-state.js";
import { checkTrials, separationProbability } from "./hyperplane-rounding.js";
import { cutRecordOf, type CutRecord } from "../types.js";

const OWNER = "vector method";

export interface VectorRoundingOptions extends VectorSetOptions {
  /** Number of Gaussian vectors g (default 100). */
  trials?: number;
  /** Seed of the random hyperplanes or Gaussian vectors (default 0). */
  solverSeed?: number;
  /** Climb each rounded cut to a 1-flip local optimum (default false). Statistics always describe the raw rounding. */
  polish?: boolean;
}

/**
 * ⟨x̂_i, x̂_j⟩ for distinct i, j from its parts: ⟨x_i, x_j⟩ = ε_iε_j|V_i∩V_j| − ε_j[i∈V_j] − ε_i[j∈V_i]
 * (i ∉ V_i), over the norms √(1 + ε_i²|V_i|)·√(1 + ε_j²|V_j|).
 */
function cosineOf(ei: number, ej: number, si: number, sj: number, overlap: number, iInJ: number, jInI: number): number {
  return (ei * ej * overlap - ej * iInJ - ei * jInI) / Math.sqrt((1 + ei * ei * si) * (1 + ej * ej * sj));
}

/** ⟨x̂_i, x̂_j⟩ for one pair of distinct vertices (binary searches; the expectation uses the bulk path). */
export function vectorMethodCosine(sets: VectorSets, i: number, j: number): number {
  const { offsets, members, eps } = sets;
  const iInJ = sortedContains(members, offsets[j], offsets[j + 1], i) ? 1 : 0;
  const jInI = sortedContains(members, offsets[i], offsets[i + 1], j) ? 1 : 0;
  return cosineOf(eps[i], eps[j], offsets[i + 1] - offsets[i], offsets[j + 1] - offsets[j], intersectionSize(sets, i, j), iInJ, jInI);
}

/** Σ_edges w·arccos(⟨x̂_i, x̂_j⟩)/π, with the per-edge overlaps counted in bulk. */
function expectedCutFor(graph: Graph, sets: VectorSets, terms: VectorEdgeTerms): number {
  const { offsets: go, neighbors, weights } = graph;
  const { offsets, eps } = sets;
  const { overlap, member } = terms;
  let expected = 0;
  for (let i = 0; i < graph.n; i++) {
    const si = offsets[i + 1] - offsets[i];
    for (let a = go[i]; a < go[i + 1]; a++) {
      const j = neighbors[a];
      if (j < i) continue;
      const jInI = member === null ? 1 : member[a];
      const iInJ = member === null ? 1 : member[graph.arcIndex(j, i)];
      const cos = cosineOf(eps[i], eps[j], si, offsets[j + 1] - offsets[j], overlap[a], iInJ, jInI);
      expected += (weights === null ? 1 : weights[a]) * separationProbability(cos);
    }
  }
  return expected;
}

/** Exact expected cut of sparse vector rounding: Σ_edges w·arccos(⟨x̂_i, x̂_j⟩)/π. */
export function vectorMethodExpectedCut(graph: Graph, options: VectorSetOptions = {}): number {
  return vectorMethodExpectedCutFor(graph, resolveVectorSets(graph, options));
}

/** The same for sets already resolved (a choice the optimiser returned: no second validation). */
export function vectorMethodExpectedCutFor(graph: Graph, sets: VectorSets): number {
  return expectedCutFor(graph, sets, vectorEdgeTerms(graph, sets));
}

interface Trials {
  bestSide: Uint8Array;
  /** Best (polished, when asked) cut value and best raw rounded cut value. */
  best: number;
  bestRaw: number;
  /** Running mean and sum of squared deviations of the raw surplus. */
  mean: number;
  m2: number;
  trialSeconds: number;
}

/** The rounding trials themselves: `trials` Gaussian vectors from `solverSeed`, the best side kept. */
function roundTrials(graph: Graph, sets: VectorSets, trials: number, solverSeed: number, polish: boolean): Trials {
  const rng = new Rng(solverSeed);
  const n = graph.n;
  const { offsets, members, eps } = sets;
  const g = new Float64Array(n);
  const side = new Uint8Array(n);
  const bestSide = new Uint8Array(n);
  const state = polish ? new FlipState(graph) : null;
  // Welford's running mean and variance of the raw surplus (no cancellation at large m).
  let mean = 0;
  let m2 = 0;
  let bestRaw = -Infinity;
  let best = -Infinity;
  // Each edge once (u < v), in cutValue's order, so the sum below is cutValue's to the last bit;
  // the sides are 0/1 by construction, so cutValue's check of the partition is not needed per trial.
  const { offsets: go, neighbors, weights } = graph;
  const half = graph.totalWeight / 2;
  const ends = new Int32Array(2 * graph.m);
  const edgeWeight = weights === null ? null : new Float64Array(graph.m);
  let e = 0;
  for (let u = 0; u < n; u++) {
    for (let a = go[u]; a < go[u + 1]; a++) {
      const v = neighbors[a];
      if (v <= u) continue;
      ends[2 * e] = u;
      ends[2 * e + 1] = v;
      if (edgeWeight !== null) edgeWeight[e] = weights![a];
      e++;
    }
  }
  const tTrials = performance.now();
  for (let t = 0; t < trials; t++) {
    for (let v = 0; v < n; v++) g[v] = rng.nextNormal();
    for (let v = 0; v < n; v++) {
      let s = 0;
      for (let a = offsets[v]; a < offsets[v + 1]; a++) s += g[members[a]];
      side[v] = g[v] - eps[v] * s > 0 ? 1 : 0;
    }
    let raw = 0;
    if (edgeWeight === null) {
      for (let k = 0; k < e; k++) raw += side[ends[2 * k]] ^ side[ends[2 * k + 1]];
    } else {
      for (let k = 0; k < e; k++) if (side[ends[2 * k]] !== side[ends[2 * k + 1]]) raw += edgeWeight[k];
    }
    const surplus = raw - half;
    const d = surplus - mean;
    mean += d / (t + 1);
    m2 += d * (surplus - mean);
    if (raw > bestRaw) bestRaw = raw;
    let value = raw;
    if (state !== null) {
      value = state.polishInPlace(side);
    }
    if (value > best) {
      best = value;
      bestSide.set(side);
    }
  }
  return { bestSide, best, bestRaw, mean, m2, trialSeconds: (performance.now() - tTrials) / 1000 };
}

/** Round the explicit vectors `trials` times; the record holds the best cut and the statistics. */
export function vectorMethodRound(graph: Graph, options: VectorRoundingOptions = {}): CutRecord {
  const t0 = performance.now();
  const sets = resolveVectorSets(graph, options);
  const trials = checkTrials(OWNER, options.trials, 100);
  const solverSeed = checkSeed(OWNER, "solverSeed", options.solverSeed);
  const polish = options.polish ?? false;
  const { bestSide, bestRaw, mean, m2, trialSeconds } = roundTrials(graph, sets, trials, solverSeed, polish);
  const variance = trials > 1 ? m2 / (trials - 1) : 0;
  const terms = vectorEdgeTerms(graph, sets);
  const guarantee = vectorMethodGuaranteeFor(graph, sets, terms);
  const value = cutValue(graph, bestSide);
  return cutRecordOf("vector-rounding", graph, bestSide, "completed", (performance.now() - t0) / 1000, solverSeed, {
    trials,
    guarantee: guarantee.surplus,
    guaranteeApplies: guarantee.applies,
    expectedSurplus: surplusOf(graph, expectedCutFor(graph, sets, terms)),
    meanSurplus: mean,
    stdErr: Math.sqrt(variance / trials),
    bestRoundedSurplus: surplusOf(graph, bestRaw),
    bestSurplus: surplusOf(graph, value),
    polish,
    trialSeconds,
  });
}

/** What vectorMethodRound's record says of the cut and the trials, without its guarantee and statistics. */
export interface VectorRoundingCut {
  /** The best cut's sides (owned by the caller) and its value. */
  partition: Uint8Array;
  value: number;
  /** Mean raw rounded surplus over the trials (the record's `meanSurplus`). */
  meanSurplus: number;
}

/**
 * The best cut and mean surplus of vectorMethodRound with the same options, equal to the record's
 * `partition`, `value` and `details.meanSurplus`, without the guarantee, the expected cut and the
 * record (callers that round one vector choice many times compute those once: the decomposition).
 */
export function vectorMethodRoundCut(graph: Graph, options: VectorRoundingOptions = {}): VectorRoundingCut {
  return vectorMethodRoundCutFor(graph, resolveVectorSets(graph, options), options);
}

/**
 * vectorMethodRoundCut for sets already resolved (`options`' own sets and ε are not read): the
 * decomposition rounds the choice the optimiser returned, valid by construction, batch after batch.
 */
export function vectorMethodRoundCutFor(graph: Graph, sets: VectorSets, options: Pick<VectorRoundingOptions, "trials" | "solverSeed" | "polish"> = {}): VectorRoundingCut {
  const trials = checkTrials(OWNER, options.trials, 100);
  const solverSeed = checkSeed(OWNER, "solverSeed", options.solverSeed);
  const r = roundTrials(graph, sets, trials, solverSeed, options.polish ?? false);
  return { partition: r.bestSide, value: cutValue(graph, r.bestSide), meanSurplus: r.mean };
}
