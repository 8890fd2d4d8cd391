// Goemans–Williamson hyperplane rounding of vertex vectors (e.g. an SDP solution): a random
// Gaussian normal g puts i on side [g·v_i > 0]; best of many trials, optionally 1-flip polished.

import { invalidParameter } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { Rng } from "../../random/prng.js";
import { checkSeed } from "../../random/seed.js";
import { cutValue } from "../../graph/cut-value.js";
import { FlipState } from "./flip-state.js";
import { cutRecordOf, type CutRecord } from "../types.js";

const OWNER = "hyperplane rounding";

export interface RoundingOptions {
  /** Number of random hyperplanes (default 100). */
  trials?: number;
  /** Seed of the random hyperplanes or Gaussian vectors (default 0). */
  solverSeed?: number;
  /** Climb each rounded cut to a 1-flip local optimum (default true). */
  polish?: boolean;
}

export function checkTrials(owner: string, trials: number | undefined, dflt: number): number {
  const t = trials ?? dflt;
  if (!Number.isInteger(t) || t < 1 || t > 1e9) throw invalidParameter(owner, "trials", "should be an integer between 1 and 1e9", t);
  return t;
}

/**
 * Probability that a uniformly random hyperplane through the origin separates two vectors
 * at the given cosine: arccos(cos)/π (Goemans & Williamson 1995, Lemma 3.2).
 */
export function separationProbability(cosine: number): number {
  return Math.acos(Math.max(-1, Math.min(1, cosine))) / Math.PI;
}

/**
 * Exact expected cut of hyperplane rounding: Σ_edges w·arccos(cos ∠(v_i, v_j))/π. A zero vector
 * always lands on side 0, so its edges to non-zero vectors are cut with probability ½.
 */
export function hyperplaneExpectedCut(graph: Graph, vectors: Float64Array, r: number): number {
  checkVectors(graph, vectors, r);
  const norms = new Float64Array(graph.n);
  for (let v = 0; v < graph.n; v++) {
    let s = 0;
    for (let k = 0; k < r; k++) s += vectors[v * r + k] ** 2;
    norms[v] = Math.sqrt(s);
  }
  let expected = 0;
  graph.forEachEdge((u, v, w) => {
    const nu = norms[u];
    const nv = norms[v];
    if (nu === 0 && nv === 0) return;
    if (nu === 0 || nv === 0) {
      expected += w / 2;
      return;
    }
    let dot = 0;
    for (let k = 0; k < r; k++) dot += vectors[u * r + k] * vectors[v * r + k];
    expected += w * separationProbability(dot / (nu * nv));
  });
  return expected;
}

function checkVectors(graph: Graph, vectors: Float64Array, r: number): void {
  if (!Number.isInteger(r) || r < 1) throw invalidParameter(OWNER, "r", "should be a positive integer (the vector dimension)", r);
  if (!(vectors instanceof Float64Array) || vectors.length !== graph.n * r) {
    throw invalidParameter(OWNER, "vectors", `should be a Float64Array of n·r = ${graph.n * r} numbers (row-major)`, vectors?.length);
  }
  for (let i = 0; i < vectors.length; i++) {
    if (!Number.isFinite(vectors[i])) throw invalidParameter(OWNER, "vectors", `should hold finite numbers; entry ${i} is not`, vectors[i]);
  }
}

/** Round n×r row-major `vectors` by `trials` random hyperplanes; the record holds the best cut. */
export function hyperplaneRound(graph: Graph, vectors: Float64Array, r: number, options: RoundingOptions = {}): CutRecord {
  const t0 = performance.now();
  checkVectors(graph, vectors, r);
  const trials = checkTrials(OWNER, options.trials, 100);
  const solverSeed = checkSeed(OWNER, "solverSeed", options.solverSeed);
  const polish = options.polish ?? true;
  const rng = new Rng(solverSeed);
  const n = graph.n;
  const normal = new Float64Array(r);
  const side = new Uint8Array(n);
  const bestSide = new Uint8Array(n);
  const state = polish ? new FlipState(graph) : null;
  let sumRaw = 0;
  let bestRaw = -Infinity;
  let sumPolished = 0;
  let best = -Infinity;
  for (let t = 0; t < trials; t++) {
    for (let k = 0; k < r; k++) normal[k] = rng.nextNormal();
    for (let v = 0; v < n; v++) {
      let dot = 0;
      for (let k = 0; k < r; k++) dot += vectors[v * r + k] * normal[k];
      side[v] = dot > 0 ? 1 : 0;
    }
    const raw = cutValue(graph, side);
    sumRaw += raw;
    if (raw > bestRaw) bestRaw = raw;
    let value = raw;
    if (state !== null) {
      value = state.polishInPlace(side);
      sumPolished += value;
    }
    if (value > best) {
      best = value;
      bestSide.set(side);
    }
  }
  return cutRecordOf("hyperplane-rounding", graph, bestSide, "completed", (performance.now() - t0) / 1000, solverSeed, {
    trials,
    meanCut: sumRaw / trials,
    bestRoundedCut: bestRaw,
    meanPolishedCut: polish ? sumPolished / trials : null,
    expectedCut: hyperplaneExpectedCut(graph, vectors, r),
    polish,
  });
}
