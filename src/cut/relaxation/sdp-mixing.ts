// The Goemans–Williamson relaxation max ¼⟨L, X⟩ s.t. diag X = 1, X ⪰ 0, solved in the low-rank
// factorisation X = VVᵀ (Burer–Monteiro) by the mixing method of Wang, Chang & Kolter (2017):
// cyclic exact updates v_i ← −normalise(Σ_j w_ij v_j), over-relaxed: v_i moves ω times as far towards
// that maximiser and is normalised again (successive over-relaxation, Young 1950, applied to the
// mixing method's coordinate update; our choice, measured in bench/sdp.bench.mjs). For 1 ≤ ω < 2 the new
// v_i is never farther in angle from the maximiser than the old one (the chord point v + ω(v* − v) lies
// between v* and 2v* − v, whose angle to v* is below v's), so every update still raises the objective.
// On grid-like graphs (the toroidal ±1 G-set graphs) plain sweeps shed the surplus rank of V very slowly;
// ω = 1.7 reaches the same certified bound in about a tenth of the sweeps there and in half on random
// graphs. On grid-like graphs (breadth-first depth from vertex 0 at least √n, at least 256 vertices reached:
// the toroidal G-set graphs, depth 54 at n = 800) the default is ω = 1.9, as SOR theory suggests for grids,
// whose optimal factor 2/(1 + sin πh) nears 2 as the mesh h shrinks (Young 1971, Iterative Solution of Large
// Linear Systems, ch. 6); on G11 it needs 218 sweeps instead of 365 and on G48 119 instead of 143 (and
// certifies a closer bound), while on the random G-set graphs it would need more (measured in
// bench/sdp.bench.mjs). Returns the primal vectors and a dual estimate y.

import { invalidParameter } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { checkMemory } from "../../limits/memory.js";
import { lanczosExtreme } from "../../linalg/lanczos.js";
import { shiftedLaplacianOperator, weightedDegrees } from "../../linalg/operator.js";
import { Rng } from "../../random/prng.js";
import { checkSeed } from "../../random/seed.js";
import { checkSeconds } from "../../validate.js";
import { dualBoundValue } from "./dual-bound.js";
import type { SolverStatus } from "../types.js";

export interface SdpOptions {
  /** Columns of V (default min(n, ⌈√(2n)⌉ + 1): above the Barvinok–Pataki rank, so generically no spurious local optima). */
  rank?: number;
  /** Seed of the random unit start vectors (default 0). */
  solverSeed?: number;
  /**
   * Stop when the estimated relative duality gap (¼(Σy + n·θ⁺) − value) / ¼(Σy + n·θ⁺) ≤ gapTolerance,
   * θ being a Lanczos estimate of λmax(L − Diag(y)) (default 1e-5). 0 disables the check.
   */
  gapTolerance?: number;
  /** Fewest sweeps between duality-gap checks (default 20; more when a check costs over ~15% of the sweeps' work). */
  checkEvery?: number;
  /** Stop when one sweep raises the objective by at most tolerance·|objective| (default 1e-12). */
  tolerance?: number;
  /** Stop when ‖(Diag(y) − L)V‖_F ≤ gradientTolerance·Σ|w| (default 0: off). */
  gradientTolerance?: number;
  /** Sweep budget (default 10000). */
  maxSweeps?: number;
  /** Wall-clock budget in seconds (default: none). */
  seconds?: number;
  /** Start from these vectors (n×rank, row-major; rows are normalised, zero rows replaced by random ones). */
  initial?: Float64Array;
  /** Over-relaxation factor ω of each update, 1 ≤ ω < 2 (default 1.7, 1.9 on grid-like graphs; 1 is the plain mixing method). */
  overRelaxation?: number;
}

export interface SdpRecord {
  method: "sdp-mixing";
  /** Primal objective ¼⟨L, VVᵀ⟩: a lower estimate of the SDP optimum (V is feasible). */
  value: number;
  /** Unit vectors v_i, row-major n×rank: the input of hyperplane rounding. */
  vectors: Float64Array;
  rank: number;
  sweeps: number;
  /** converged: tolerance met; iteration-limit: maxSweeps reached; time-limit: `seconds` ran out. */
  status: SolverStatus;
  seconds: number;
  solverSeed: number;
  /** Dual estimate y_i = ((L V)_i · v_i); ¼Σy equals `value`, and Diag(y) − L ⪰ 0 at an optimum. */
  y: Float64Array;
  /** Frobenius norm of (Diag(y) − L)V, zero exactly at a stationary point. */
  gradientNorm: number;
  /** Objective gain of the last sweep. */
  lastImprovement: number;
  /** Last duality-gap estimate ¼(Σy + n·θ⁺) − value (NaN if never checked); not a certificate. */
  gapEstimate: number;
}

const OWNER = "solveSdp";

/** Default over-relaxation factor ω of the mixing method's updates (see the file header). */
export const DEFAULT_OVER_RELAXATION = 1.7;

/** Default over-relaxation factor on grid-like graphs (see `isGridLike`). */
export const GRID_OVER_RELAXATION = 1.9;

/** Fewest vertices in vertex 0's component for the grid-like default to apply (small graphs converge fast either way). */
const GRID_MIN_VERTICES = 256;

/**
 * Grid-like: the breadth-first search from vertex 0 reaches at least GRID_MIN_VERTICES vertices and a
 * depth of at least the square root of their number (a k×k torus has depth k = √n, a k×k grid from its corner 2k − 2; random
 * graphs of any degree have depth O(log n)). O(n + m), a pure function of the graph.
 */
export function isGridLike(graph: Graph): boolean {
  const { n, offsets, neighbors } = graph;
  if (n < GRID_MIN_VERTICES) return false;
  const depth = new Int32Array(n).fill(-1);
  const queue = new Int32Array(n);
  let head = 0, tail = 0, deepest = 0;
  queue[tail++] = 0;
  depth[0] = 0;
  while (head < tail) {
    const v = queue[head++];
    for (let k = offsets[v]; k < offsets[v + 1]; k++) {
      const w = neighbors[k];
      if (depth[w] < 0) {
        depth[w] = depth[v] + 1;
        if (depth[w] > deepest) deepest = depth[w];
        queue[tail++] = w;
      }
    }
  }
  return tail >= GRID_MIN_VERTICES && deepest * deepest >= tail;
}

/** Over-relaxation stops once a sweep gains at most this fraction of the objective. */
const OVER_RELAXED_UNTIL = 1e-7;

/** Default rank ⌈√(2n)⌉ + 1, at most n. */
export function defaultSdpRank(n: number): number {
  return Math.max(1, Math.min(n, Math.ceil(Math.sqrt(2 * n)) + 1));
}

function checkOptions(graph: Graph, o: SdpOptions): void {
  const n = graph.n;
  if (o.rank !== undefined && !(Number.isInteger(o.rank) && o.rank >= 1 && o.rank <= Math.max(1, n))) {
    throw invalidParameter(OWNER, "rank", `should be an integer between 1 and n = ${n}`, o.rank);
  }
  checkSeed(OWNER, "solverSeed", o.solverSeed);
  if (o.tolerance !== undefined && !(o.tolerance >= 0 && o.tolerance < 1)) throw invalidParameter(OWNER, "tolerance", "should be a number in [0, 1)", o.tolerance);
  if (o.gapTolerance !== undefined && !(o.gapTolerance >= 0 && o.gapTolerance < 1)) throw invalidParameter(OWNER, "gapTolerance", "should be a number in [0, 1)", o.gapTolerance);
  if (o.checkEvery !== undefined && !(Number.isInteger(o.checkEvery) && o.checkEvery >= 1)) throw invalidParameter(OWNER, "checkEvery", "should be a positive integer", o.checkEvery);
  if (o.gradientTolerance !== undefined && !(o.gradientTolerance >= 0 && o.gradientTolerance < 1)) {
    throw invalidParameter(OWNER, "gradientTolerance", "should be a number in [0, 1)", o.gradientTolerance);
  }
  if (o.maxSweeps !== undefined && !(Number.isInteger(o.maxSweeps) && o.maxSweeps >= 0)) throw invalidParameter(OWNER, "maxSweeps", "should be a non-negative integer", o.maxSweeps);
  if (o.seconds !== undefined) checkSeconds(OWNER, o.seconds, 1);
  if (o.overRelaxation !== undefined && !(o.overRelaxation >= 1 && o.overRelaxation < 2)) throw invalidParameter(OWNER, "overRelaxation", "should be a number in [1, 2)", o.overRelaxation);
  const r = o.rank ?? defaultSdpRank(n);
  if (o.initial !== undefined && o.initial.length !== n * r) {
    throw invalidParameter(OWNER, "initial", `should hold n·rank = ${n * r} numbers`, `${o.initial.length} numbers`);
  }
}

/**
 * The SDP objective ¼⟨L, VVᵀ⟩ = Σ_{edges} w_uv (1 − ⟨v_u, v_v⟩) / 2 for unit rows of V
 * (row-major n×rank). The one place this formula is evaluated.
 */
export function sdpObjective(graph: Graph, vectors: Float64Array, rank: number): number {
  const { n, offsets, neighbors, weights } = graph;
  let s = 0;
  for (let u = 0; u < n; u++) {
    const bu = u * rank;
    for (let a = offsets[u]; a < offsets[u + 1]; a++) {
      const v = neighbors[a];
      if (v <= u) continue;
      const bv = v * rank;
      let ip = 0;
      for (let t = 0; t < rank; t++) ip += vectors[bu + t] * vectors[bv + t];
      s += (weights === null ? 1 : weights[a]) * (1 - ip);
    }
  }
  return s / 2;
}

/**
 * g ← Σ_j w_ij v_j over i's arcs (V row-major n×r). Four arcs per pass over g: each g[t] is
 * loaded and stored once per four neighbours, which more than doubles the speed of a sweep.
 */
function neighborSum(graph: Graph, i: number, V: Float64Array, r: number, g: Float64Array): void {
  const { offsets, neighbors, weights } = graph;
  const end = offsets[i + 1];
  let a = offsets[i];
  for (let t = 0; t < r; t++) g[t] = 0;
  if (weights === null) {
    for (; a + 3 < end; a += 4) {
      const b0 = neighbors[a] * r, b1 = neighbors[a + 1] * r, b2 = neighbors[a + 2] * r, b3 = neighbors[a + 3] * r;
      for (let t = 0; t < r; t++) g[t] += V[b0 + t] + V[b1 + t] + (V[b2 + t] + V[b3 + t]);
    }
    for (; a < end; a++) {
      const b0 = neighbors[a] * r;
      for (let t = 0; t < r; t++) g[t] += V[b0 + t];
    }
  } else {
    for (; a + 3 < end; a += 4) {
      const b0 = neighbors[a] * r, b1 = neighbors[a + 1] * r, b2 = neighbors[a + 2] * r, b3 = neighbors[a + 3] * r;
      const w0 = weights[a], w1 = weights[a + 1], w2 = weights[a + 2], w3 = weights[a + 3];
      for (let t = 0; t < r; t++) g[t] += w0 * V[b0 + t] + w1 * V[b1 + t] + (w2 * V[b2 + t] + w3 * V[b3 + t]);
    }
    for (; a < end; a++) {
      const b0 = neighbors[a] * r, w0 = weights[a];
      for (let t = 0; t < r; t++) g[t] += w0 * V[b0 + t];
    }
  }
}

/**
 * Dual estimate from primal vectors: y_i = ⟨(L V)_i, v_i⟩ = d_i − ⟨g_i, v_i⟩ with g_i = Σ_j w_ij v_j.
 * Optimality of X = VVᵀ means (Diag(y) − L)V = 0 with Diag(y) − L ⪰ 0; summing, ¼Σy = ¼⟨L, VVᵀ⟩.
 * Also returns ‖(Diag(y) − L)V‖_F, whose row i is g_i − ⟨g_i, v_i⟩v_i.
 */
export function sdpDualEstimate(graph: Graph, vectors: Float64Array, rank: number): { y: Float64Array; gradientNorm: number } {
  const n = graph.n;
  const d = weightedDegrees(graph);
  const y = new Float64Array(n);
  const g = new Float64Array(rank);
  let grad2 = 0;
  for (let i = 0; i < n; i++) {
    neighborSum(graph, i, vectors, rank, g);
    let gv = 0, gg = 0;
    const bi = i * rank;
    for (let t = 0; t < rank; t++) {
      gv += g[t] * vectors[bi + t];
      gg += g[t] * g[t];
    }
    y[i] = d[i] - gv;
    grad2 += Math.max(0, gg - gv * gv);
  }
  return { y, gradientNorm: Math.sqrt(grad2) };
}

/** Random unit rows (or the normalised `initial` rows). */
function startVectors(n: number, r: number, rng: Rng, initial: Float64Array | undefined): Float64Array {
  const V = new Float64Array(n * r);
  if (initial !== undefined) V.set(initial);
  for (let i = 0; i < n; i++) {
    const b = i * r;
    let s = 0;
    for (let t = 0; t < r; t++) s += V[b + t] * V[b + t];
    if (!(s > 0) || !Number.isFinite(s)) {
      for (let t = 0; t < r; t++) V[b + t] = rng.nextNormal();
      s = 0;
      for (let t = 0; t < r; t++) s += V[b + t] * V[b + t];
    }
    const inv = 1 / Math.sqrt(s);
    for (let t = 0; t < r; t++) V[b + t] *= inv;
  }
  return V;
}

/** Estimated duality gap for stopping: ¼(Σy + n·θ⁺) − value with θ a Lanczos estimate of λmax(L − Diag(y)). */
function gapEstimate(graph: Graph, y: Float64Array, value: number, warm: Float64Array | null): { gap: number; dual: number; top: Float64Array; products: number } {
  const top = lanczosExtreme(shiftedLaplacianOperator(graph, y), {
    which: "largest",
    // A rough θ suffices to decide when to stop (the certificate is established separately),
    // so the check stays at a few sweeps' worth of work.
    tolerance: 1e-6,
    maxBasis: 24,
    maxRestarts: 3,
    solverSeed: 1,
    ...(warm === null ? {} : { start: warm }),
  });
  const dual = dualBoundValue(y, Math.max(0, top.values[0]));
  return { gap: dual - value, dual, top: top.vectors[0], products: top.iterations };
}

/**
 * One cyclic sweep of (over-relaxed) mixing updates over V in place; returns the objective's gain and
 * Σ_i ‖g_i − ⟨g_i, v_i⟩v_i‖² before each update. Its own small function so that V8 optimises it
 * after its first call (inside one large loop the first solve ran mostly unoptimised).
 */
function sweep(graph: Graph, V: Float64Array, r: number, g: Float64Array, omega: number): { gain: number; grad2: number } {
  const { n, offsets } = graph;
  let gain = 0;
  let grad2 = 0;
  for (let i = 0; i < n; i++) {
    if (offsets[i] === offsets[i + 1]) continue;
    neighborSum(graph, i, V, r, g);
    const bi = i * r;
    let gg = 0, gv = 0, vv = 0;
    for (let t = 0; t < r; t++) {
      const x = V[bi + t];
      gg += g[t] * g[t];
      gv += g[t] * x;
      vv += x * x;
    }
    const gn = Math.sqrt(gg);
    if (!(gn > 1e-300)) continue;
    grad2 += Math.max(0, gg - gv * gv);
    const inv = -1 / gn;
    if (omega === 1) {
      // The exact maximiser of the objective in v_i alone; it gains ½(‖g‖ + ⟨g, v_i⟩) ≥ 0.
      gain += 0.5 * (gn + gv);
      for (let t = 0; t < r; t++) V[bi + t] = g[t] * inv;
    } else {
      // x = v_i + ω(v* − v_i) = (1 − ω)v_i + ω·v*, v* = −g/‖g‖, normalised in one pass: its norm and
      // ⟨g, x⟩ follow from ‖v_i‖², ⟨g, v_i⟩ and ‖g‖ already at hand. ‖x‖ ≥ ω‖v*‖ − (ω − 1)‖v_i‖ = 1 for
      // unit v_i, so ‖x‖² (terms at most 9) carries no cancellation. The objective in v_i is −½⟨g, v_i⟩,
      // so the gain is ½(⟨g, v_old⟩ − ⟨g, v_new⟩).
      const a = 1 - omega;
      const ss = a * a * vv - 2 * a * omega * gv / gn + omega * omega;
      if (!(ss > 1e-300)) {
        for (let t = 0; t < r; t++) V[bi + t] = g[t] * inv;
        gain += 0.5 * (gn + gv);
        continue;
      }
      const s = 1 / Math.sqrt(ss);
      const ca = s * a, cg = s * omega * inv;
      for (let t = 0; t < r; t++) V[bi + t] = ca * V[bi + t] + cg * g[t];
      const gvNew = ca * gv + cg * gg;
      gain += 0.5 * (gv - gvNew);
    }
  }
  return { gain, grad2 };
}

/** Solve the max-cut SDP approximately by the mixing method. Weighted graphs (any sign) are fine. */
export function solveSdp(graph: Graph, options: SdpOptions = {}): SdpRecord {
  checkOptions(graph, options);
  const t0 = performance.now();
  const { n, offsets, weights } = graph;
  const r = options.rank ?? defaultSdpRank(n);
  const seed = options.solverSeed ?? 0;
  const tol = options.tolerance ?? 1e-12;
  const gapTol = options.gapTolerance ?? 1e-5;
  const checkEvery = options.checkEvery ?? 20;
  const gradTol = options.gradientTolerance ?? 0;
  const maxSweeps = options.maxSweeps ?? 10000;
  // Over-relaxed sweeps until one gains at most OVER_RELAXED_UNTIL·|objective|, then plain ones: the
  // duality-gap checks judge plain sweeps only (an over-relaxed V is not stationary, so its dual
  // estimate is poor and a rough gap check may stop too early).
  let omega = options.overRelaxation ?? (isGridLike(graph) ? GRID_OVER_RELAXATION : DEFAULT_OVER_RELAXATION);
  const deadline = options.seconds === undefined ? Infinity : t0 + options.seconds * 1000;
  // V, its dual estimate and scratch: refuse up front rather than fail inside an allocation.
  checkMemory(8 * n * r + 64 * n, `${OWNER}: n = ${n} vertices at rank ${r}`);
  const rng = new Rng(seed);
  const V = startVectors(n, r, rng, options.initial);
  const g = new Float64Array(r);
  let absWeight = 0;
  if (weights === null) absWeight = 2 * graph.m;
  else for (let a = 0; a < weights.length; a++) absWeight += Math.abs(weights[a]);

  let value = sdpObjective(graph, V, r);
  let sweeps = 0;
  let status: SolverStatus = graph.m === 0 ? "converged" : "iteration-limit";
  let lastImprovement = 0;
  let gap = NaN;
  let warm: Float64Array | null = null;
  let nextCheck = checkEvery;
  // Costs in arc visits, not milliseconds, so the sweeps at which the gap is checked (and with them
  // the result) do not depend on the machine or its load: a sweep touches every arc `r` times, a
  // check's Lanczos product every arc once plus its basis of 24 vectors.
  const sweepCost = (n + 2 * graph.m) * r;
  while (status === "iteration-limit" && sweeps < maxSweeps) {
    const { gain, grad2 } = sweep(graph, V, r, g, omega);
    sweeps++;
    value += gain;
    lastImprovement = gain;
    if (omega !== 1) {
      if (gain <= OVER_RELAXED_UNTIL * Math.abs(value)) {
        omega = 1;
        nextCheck = sweeps + checkEvery;
      }
    } else if (gain <= tol * Math.abs(value) || Math.sqrt(grad2) <= gradTol * absWeight) status = "converged";
    else if (gapTol > 0 && sweeps >= nextCheck) {
      const est = gapEstimate(graph, sdpDualEstimate(graph, V, r).y, value, warm);
      gap = est.gap;
      warm = est.top;
      if (gap <= gapTol * Math.abs(est.dual)) status = "converged";
      // Space the checks so they cost at most ~15% of the sweeps' work.
      const checkCost = (est.products + 1) * (n + 2 * graph.m + 24 * n);
      nextCheck = sweeps + Math.max(checkEvery, Math.ceil(checkCost / (0.15 * Math.max(sweepCost, 1))));
    }
    if (status === "iteration-limit" && performance.now() > deadline) status = "time-limit";
  }
  const { y, gradientNorm } = sdpDualEstimate(graph, V, r);
  return {
    method: "sdp-mixing",
    value: sdpObjective(graph, V, r),
    vectors: V,
    rank: r,
    sweeps,
    status,
    seconds: (performance.now() - t0) / 1000,
    solverSeed: seed,
    y,
    gradientNorm,
    lastImprovement,
    gapEstimate: gap,
  };
}
