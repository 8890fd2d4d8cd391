// The SDP relaxation strengthened by triangle inequalities, solved through its Lagrangian dual
// θ(μ) = max{¼⟨L − 4Σμ_t A_t, X⟩ : diag X = 1, X ⪰ 0} + Σμ_t over μ ≥ 0 (the approach of Rendl,
// Rinaldi and Wiegele, Math. Programming 121 (2010), with a projected subgradient step in place of
// their bundle method, and the mixing method in place of an interior-point solver).
//
// For fixed μ the inner problem is a plain max-cut SDP: L − 4Σμ_t A_t is the Laplacian of the graph
// G_μ with weights w_ij + 2Σ μ_t s_p plus a diagonal c = d − d_μ, which is constant on diag X = 1. So
// θ(μ) = SDP(G_μ) + ¼Σc + Σμ, its subgradient is g_t = 1 − ⟨A_t, X(μ)⟩, and a dual vector y_μ of G_μ
// gives y = y_μ + c for the certificate (src/cut/relaxation/triangle-dual.ts). Each round separates
// the most violated triangle inequalities of the current X (triples with at least one edge, or all
// triples of small graphs), steps μ (Polyak's rule towards a target: the best known cut), re-solves
// G_μ warm from the last vectors, and certifies. Every bound is re-certified from scratch; the
// solver's accuracy affects only how tight it is, never whether it holds.

import { invalidParameter } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { buildGraph } from "../../graph/builder.js";
import { weightedDegrees } from "../../linalg/operator.js";
import { checkSeed } from "../../random/seed.js";
import { checkSeconds } from "../../validate.js";
import type { SolverStatus } from "../types.js";
import { solveSdp } from "./sdp-mixing.js";
import { TRIANGLE_DENSE_LIMIT, TRIANGLE_SIGNS, certifyTriangleDual, triangleListProblem, type TriangleCertificate } from "./triangle-dual.js";

export interface TriangleSdpOptions {
  /** Seed of the SDP start vectors and Lanczos runs (default 0). */
  solverSeed?: number;
  /** Wall-clock budget (default: none); checked between rounds. */
  seconds?: number;
  /** Rounds of separation and multiplier steps: the deterministic work limit (default 40). */
  iterations?: number;
  /** Best known cut: the step aims at it, and the search stops once the bound is within `stopGap` of it. */
  target?: number;
  /** Stop when bound − target < stopGap (default 1: with integer weights the bound then closes). */
  stopGap?: number;
  /** Inequalities added per round (default max(20, n)). */
  perRound?: number;
  /** Mixing-method sweeps of the first (plain) solve (default 2000; it stops earlier when a sweep gains < 1e-9 relative). */
  firstSweeps?: number;
  /** Mixing-method sweeps per round (default 60). */
  /** Start vectors of the first solve (n × rank, row-major), e.g. a parent node's. */
  initial?: Float64Array;
  /** Their rank (default: the SDP's default rank; required with `initial`). */
  rank?: number;
  /** Relative gain per sweep below which the first solve stops (default 1e-9). */
  firstTolerance?: number;
  sweeps?: number;
  /**
   * Inequalities to start from (four integers each, as in the certificate) and their multipliers,
   * e.g. a parent node's mapped to this graph (`mapTrianglesAfterFix`). Only a start: the bound is
   * certified from scratch either way.
   */
  warmTriangles?: Int32Array;
  warmMu?: Float64Array;
  /**
   * Cheap bounds first: run the rounds only when the plain bound is within stopGap + this of the
   * target (default Infinity); otherwise stop after the plain bound with status "completed".
   */
  strengthenWithin?: number;
  /**
   * Stop the rounds early (status "completed") when the dual value falls so slowly that at the rate
   * of the last ten accepted rounds it would not reach target + stopGap with the rounds left, even at twice
   * that rate (default false: every round is run).
   */
  stopWhenHopeless?: boolean;
  /** After the first two rounds, separate new inequalities only every this many rounds (default 1). */
  separateEvery?: number;
}

export interface TriangleSdpRecord {
  method: "sdp-triangles";
  /** The best certified bound (the plain SDP's when the inequalities did not improve on it). */
  value: number;
  /** The certified bound with μ = 0 (the plain SDP), from the first solve. */
  plainValue: number;
  certificate: TriangleCertificate;
  /** Unit vectors of the last solve (row-major n × rank), for rounding. */
  vectors: Float64Array;
  rank: number;
  /** converged: within stopGap of the target; iteration-limit: rounds used up; time-limit. */
  status: SolverStatus;
  rounds: number;
  /** Inequalities with μ_t > 0 in the certificate. */
  inequalities: number;
  seconds: number;
  solverSeed: number;
}

const OWNER = "solveTriangleSdp";
/** The first step factor (1 = Polyak's step; halved at every step that raised the dual value). */
const START_STEP = 1;
/** Rejected steps before the factor halves (a rejected step still adds the newly separated inequalities next round). */
const REJECTIONS_PER_HALVING = 1;
/** Relative rise of the dual value a step may cause and still be kept (0, 0.002 and 0.01 tried on G(40, 0.3), KG(8,3): 0.01 closed most). */
const ACCEPT_RISE = 0.01;

/** Accepted rounds over which `stopWhenHopeless` measures the rate of descent (4 stopped rounds that a longer run would have used, on 3-regular graphs). */
const HOPELESS_WINDOW = 10;

/** Active inequalities: packed (i, j, k, pattern), multipliers, and a key set against duplicates. */
class ActiveSet {
  tri: number[] = [];
  mu: number[] = [];
  readonly keys = new Set<number>();
  constructor(readonly n: number) {}
  key(i: number, j: number, k: number, p: number): number {
    return ((i * this.n + j) * this.n + k) * 4 + p;
  }
  add(i: number, j: number, k: number, p: number): void {
    const key = this.key(i, j, k, p);
    if (this.keys.has(key)) return;
    this.keys.add(key);
    this.tri.push(i, j, k, p);
    this.mu.push(0);
  }
  /** Go back to an earlier list (its multipliers included). */
  restore(tri: number[], mu: number[]): void {
    this.tri = tri.slice();
    this.mu = mu.slice();
    this.keys.clear();
    for (let t = 0; t < mu.length; t++) this.keys.add(this.key(tri[4 * t], tri[4 * t + 1], tri[4 * t + 2], tri[4 * t + 3]));
  }
  /** Drop inequalities with μ = 0 that X satisfies with slack (their subgradient g_t > 0.1). */
  purge(g: Float64Array): void {
    const tri: number[] = [], mu: number[] = [];
    this.keys.clear();
    for (let t = 0; t < this.mu.length; t++) {
      if (this.mu[t] === 0 && g[t] > 0.1) continue;
      tri.push(this.tri[4 * t], this.tri[4 * t + 1], this.tri[4 * t + 2], this.tri[4 * t + 3]);
      mu.push(this.mu[t]);
      this.keys.add(this.key(this.tri[4 * t], this.tri[4 * t + 1], this.tri[4 * t + 2], this.tri[4 * t + 3]));
    }
    this.tri = tri;
    this.mu = mu;
  }
}

/** X = VVᵀ, dense. */
function gram(V: Float64Array, n: number, r: number): Float64Array {
  const X = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    X[i * n + i] = 1;
    for (let j = 0; j < i; j++) {
      let s = 0;
      for (let t = 0; t < r; t++) s += V[i * r + t] * V[j * r + t];
      X[i * n + j] = s;
      X[j * n + i] = s;
    }
  }
  return X;
}

/** ⟨A_t, X⟩ − 1 for a pattern of a triple: its violation (negative when satisfied). */
function violationOf(X: Float64Array, n: number, i: number, j: number, k: number, p: number): number {
  const s = TRIANGLE_SIGNS[p];
  return s[0] * X[i * n + j] + s[1] * X[i * n + k] + s[2] * X[j * n + k] - 1;
}

/** Candidate inequalities of one separation round: packed (i, j, k, pattern) and violations. */
class Candidates {
  tri = new Int32Array(4096);
  viol = new Float64Array(1024);
  size = 0;
  push(i: number, j: number, k: number, p: number, v: number): void {
    if (this.size === this.viol.length) {
      const t = new Int32Array(this.tri.length * 2);
      t.set(this.tri);
      this.tri = t;
      const w = new Float64Array(this.viol.length * 2);
      w.set(this.viol);
      this.viol = w;
    }
    const q = this.size++;
    this.tri[4 * q] = i;
    this.tri[4 * q + 1] = j;
    this.tri[4 * q + 2] = k;
    this.tri[4 * q + 3] = p;
    this.viol[q] = v;
  }
}

/** The most violated pattern of a sorted triple, if it is violated by more than 1e-4. */
function checkTriple(X: Float64Array, n: number, i: number, j: number, k: number, active: ActiveSet, out: Candidates): void {
  const a = X[i * n + j], b = X[i * n + k], c = X[j * n + k];
  // Violations of the patterns (−,−,−), (−,+,+), (+,−,+), (+,+,−) (TRIANGLE_SIGNS), each minus 1.
  const v0 = -a - b - c, v1 = -a + b + c, v2 = a - b + c, v3 = a + b - c;
  let best = v0, p = 0;
  if (v1 > best) { best = v1; p = 1; }
  if (v2 > best) { best = v2; p = 2; }
  if (v3 > best) { best = v3; p = 3; }
  if (best - 1 > 1e-4 && !active.keys.has(active.key(i, j, k, p))) out.push(i, j, k, p, best - 1);
}

/** Separation: the `count` most violated inequalities of X not yet in the set join it (with μ = 0). */
function separate(graph: Graph, X: Float64Array, active: ActiveSet, count: number): number {
  const n = graph.n;
  const cand = new Candidates();
  const full = n * n * n / 6 <= 4 * graph.m * n || n <= 120;
  if (full) {
    // Every pattern's value is at most |a| + |b| + |c|: triples below 1 + 1e-4 there are skipped
    // without the four sums (most triples, once X is near a cut matrix only where it is decided).
    for (let i = 0; i < n; i++) {
      const ri = i * n;
      for (let j = i + 1; j < n; j++) {
        const rj = j * n;
        const a = Math.abs(X[ri + j]);
        for (let k = j + 1; k < n; k++) {
          if (a + Math.abs(X[ri + k]) + Math.abs(X[rj + k]) > 1 + 1e-4) checkTriple(X, n, i, j, k, active, cand);
        }
      }
    }
  } else {
    // Triples holding at least one edge, each once: enumerated from its least edge in (min, max) order.
    const { offsets, neighbors } = graph;
    const earlier = (a: number, b: number, u: number, v: number): boolean => {
      const lo = Math.min(a, b), hi = Math.max(a, b);
      return (lo < u || (lo === u && hi < v)) && graph.hasEdge(lo, hi);
    };
    for (let u = 0; u < n; u++) {
      for (let q = offsets[u]; q < offsets[u + 1]; q++) {
        const v = neighbors[q];
        if (v <= u) continue;
        for (let k = 0; k < n; k++) {
          if (k === u || k === v || earlier(u, k, u, v) || earlier(v, k, u, v)) continue;
          const a = Math.min(u, k), c = Math.max(v, k);
          const b = u + v + k - a - c;
          checkTriple(X, n, a, b, c, active, cand);
        }
      }
    }
  }
  const take = Math.min(count, cand.size);
  if (take === 0) return 0;
  // The take-th largest violation, by a native sort of a copy; ties at it are admitted in order.
  const sorted = cand.viol.slice(0, cand.size).sort();
  const cut = sorted[cand.size - take];
  let added = 0;
  for (let q = 0; q < cand.size && added < take; q++) {
    if (cand.viol[q] >= cut) {
      active.add(cand.tri[4 * q], cand.tri[4 * q + 1], cand.tri[4 * q + 2], cand.tri[4 * q + 3]);
      added++;
    }
  }
  return added;
}

/** G_μ: the graph's weights plus 2Σμ_t s_p on every pair of an inequality with μ_t > 0. */
function lagrangianGraph(graph: Graph, active: ActiveSet): Graph {
  const n = graph.n;
  const extra = new Map<number, number>();
  graph.forEachEdge((u, v, w) => {
    const a = Math.min(u, v), b = Math.max(u, v);
    extra.set(a * n + b, (extra.get(a * n + b) ?? 0) + w);
  });
  for (let t = 0; t < active.mu.length; t++) {
    const m = active.mu[t];
    if (m === 0) continue;
    const i = active.tri[4 * t], j = active.tri[4 * t + 1], k = active.tri[4 * t + 2];
    const s = TRIANGLE_SIGNS[active.tri[4 * t + 3]];
    for (const [a, b, sign] of [[i, j, s[0]], [i, k, s[1]], [j, k, s[2]]] as const) extra.set(a * n + b, (extra.get(a * n + b) ?? 0) + 2 * m * sign);
  }
  const keys = [...extra.keys()].sort((a, b) => a - b);
  const us = new Int32Array(keys.length), vs = new Int32Array(keys.length), ws = new Float64Array(keys.length);
  keys.forEach((key, e) => {
    us[e] = Math.floor(key / n);
    vs[e] = key % n;
    ws[e] = extra.get(key)!;
  });
  return buildGraph(n, us, vs, ws).graph;
}

/** The plain SDP of G_μ warm-started from V: its vectors, the dual vector y of the original problem, and θ(μ). */
function innerSolve(graph: Graph, active: ActiveSet, d: Float64Array, V: Float64Array, r: number, seed: number, sweeps: number): { V: Float64Array; y: Float64Array; theta: number } {
  const n = graph.n;
  const gm = lagrangianGraph(graph, active);
  const dm = weightedDegrees(gm);
  const sol = solveSdp(gm, { solverSeed: seed, initial: V, rank: r, maxSweeps: sweeps, gapTolerance: 0, tolerance: 1e-9 });
  let cSum = 0, muSum = 0;
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    y[i] = sol.y[i] + d[i] - dm[i];
    cSum += d[i] - dm[i];
  }
  for (const m of active.mu) muSum += m;
  return { V: sol.vectors, y, theta: sol.value + cSum / 4 + muSum };
}

/**
 * The triangle-strengthened SDP bound with its certificate (see the file header). Deterministic for
 * a given seed and `iterations`; `seconds` only stops it earlier.
 */
export function solveTriangleSdp(graph: Graph, options: TriangleSdpOptions = {}): TriangleSdpRecord {
  const t0 = performance.now();
  const seed = checkSeed(OWNER, "solverSeed", options.solverSeed);
  const seconds = options.seconds === undefined ? Infinity : checkSeconds(OWNER, options.seconds, 1);
  const iterations = options.iterations ?? 40;
  if (!(Number.isInteger(iterations) && iterations >= 0)) throw invalidParameter(OWNER, "iterations", "should be a non-negative integer", iterations);
  if (options.target !== undefined && !Number.isFinite(options.target)) throw invalidParameter(OWNER, "target", "should be a finite number", options.target);
  const stopGap = options.stopGap ?? 1;
  if (!(stopGap >= 0)) throw invalidParameter(OWNER, "stopGap", "should be a number ≥ 0", stopGap);
  const n = graph.n;
  if (n > TRIANGLE_DENSE_LIMIT) throw invalidParameter(OWNER, "graph", `should have at most ${TRIANGLE_DENSE_LIMIT} vertices (the bound's proof is dense)`, `${n} vertices`);
  const perRound = options.perRound ?? Math.max(20, n);
  const sweeps = options.sweeps ?? 60;
  const separateEvery = options.separateEvery ?? 1;
  if (!(Number.isInteger(separateEvery) && separateEvery >= 1)) throw invalidParameter(OWNER, "separateEvery", "should be a positive integer", separateEvery);
  const deadline = t0 + seconds * 1000;
  const d = weightedDegrees(graph);

  // No duality-gap checks: their spacing follows the clock, and the result must not.
  const first = solveSdp(graph, { solverSeed: seed, gapTolerance: 0, tolerance: options.firstTolerance ?? 1e-9, maxSweeps: options.firstSweeps ?? 2000, initial: options.initial, rank: options.rank });
  let V = first.vectors;
  const r = first.rank;
  const active = new ActiveSet(n);
  const plain = certifyTriangleDual(graph, first.y, new Int32Array(0), new Float64Array(0), seed + 1);
  let best = plain;
  const target = options.target ?? -Infinity;
  const done = (): boolean => best.value - target < stopGap;
  let status: SolverStatus = done() ? "converged" : "iteration-limit";
  let rounds = 0;
  // Polyak step length factor, halved at every rejected step.
  let lambda = START_STEP;
  let bestTheta = first.value;
  let stall = 0;
  let theta = first.value;
  let kept = { tri: [] as number[], mu: [] as number[], V: V.slice() };
  if (status === "iteration-limit" && options.strengthenWithin !== undefined && plain.value - target >= stopGap + options.strengthenWithin) status = "completed";
  // The multipliers of the last certified bound, to certify the kept ones once more at the end if they moved since.
  let certifiedKept = kept;
  const certifyKept = (): void => {
    certifiedKept = kept;
    const tri: number[] = [], mu: number[] = [];
    for (let t = 0; t < kept.mu.length; t++) {
      if (kept.mu[t] > 0) {
        tri.push(kept.tri[4 * t], kept.tri[4 * t + 1], kept.tri[4 * t + 2], kept.tri[4 * t + 3]);
        mu.push(kept.mu[t]);
      }
    }
    if (mu.length === 0) return;
    const b = certifyTriangleDual(graph, keptY, Int32Array.from(tri), Float64Array.from(mu), seed + 1);
    if (b.proven && b.value < best.value) best = b;
  };
  let keptY: Float64Array = first.y;
  if (status === "iteration-limit" && options.warmTriangles !== undefined && options.warmMu !== undefined && options.warmMu.length > 0) {
    const wt = options.warmTriangles, wm = options.warmMu;
    const problem = triangleListProblem(n, wt, wm);
    if (problem !== null) throw invalidParameter(OWNER, "warmTriangles", problem, wt.length);
    for (let t = 0; t < wm.length; t++) {
      const before = active.mu.length;
      active.add(wt[4 * t], wt[4 * t + 1], wt[4 * t + 2], wt[4 * t + 3]);
      if (active.mu.length > before) active.mu[before] = wm[t] >= 0 ? wm[t] : 0;
    }
    const sol = innerSolve(graph, active, d, V, r, seed, sweeps);
    if (sol.theta < first.value + ACCEPT_RISE * Math.abs(first.value)) {
      V = sol.V;
      theta = sol.theta;
      bestTheta = Math.min(theta, bestTheta);
      kept = { tri: active.tri.slice(), mu: active.mu.slice(), V: V.slice() };
      keptY = sol.y;
      if (theta - target < stopGap + 0.5) {
        certifyKept();
        if (done()) status = "converged";
      }
    } else {
      active.mu.fill(0);
      kept = { tri: active.tri.slice(), mu: active.mu.slice(), V: V.slice() };
    }
  }
  const history: number[] = [];
  while (status === "iteration-limit" && rounds < iterations) {
    if (performance.now() > deadline) {
      status = "time-limit";
      break;
    }
    rounds++;
    const X = gram(V, n, r);
    // Separation costs n³/6 triple checks, more than the rest of a round: it runs in the first
    // rounds and then every `separateEvery`-th (the multipliers of the set converge in between).
    if (rounds <= 2 || rounds % separateEvery === 0) separate(graph, X, active, perRound);
    const T = active.mu.length;
    const g = new Float64Array(T);
    let norm2 = 0;
    for (let t = 0; t < T; t++) {
      g[t] = -violationOf(X, n, active.tri[4 * t], active.tri[4 * t + 1], active.tri[4 * t + 2], active.tri[4 * t + 3]);
      // Projected: a zero multiplier with a satisfied inequality cannot move.
      if (active.mu[t] > 0 || g[t] < 0) norm2 += g[t] * g[t];
    }
    if (norm2 === 0) {
      status = "converged";
      break;
    }
    // Aim at the target, but never more than 2% below the current value (a far target overshoots).
    const aim = Math.max(target, theta - 0.02 * Math.abs(theta));
    const step = (lambda * Math.max(theta - aim, 1e-3 * Math.abs(theta) + 1e-9)) / norm2;
    for (let t = 0; t < T; t++) active.mu[t] = Math.max(0, active.mu[t] - step * g[t]);
    if (rounds % 5 === 0) active.purge(g);
    const sol = innerSolve(graph, active, d, V, r, seed, sweeps);
    V = sol.V;
    const y = sol.y;
    theta = sol.theta;
    // Steps that raise the dual value a little are kept (the inner solves are inexact, and a
    // non-monotone method gets past flat stretches); larger rises are undone.
    if (theta < bestTheta + ACCEPT_RISE * Math.abs(bestTheta)) {
      bestTheta = Math.min(theta, bestTheta);
      kept = { tri: active.tri.slice(), mu: active.mu.slice(), V: V.slice() };
      keptY = y;
      stall = 0;
    } else {
      // A step that raised the dual value is undone (a descent method with backtracking: a fresh
      // inequality's multiplier bends the dual function sharply), and the next one is shorter.
      active.restore(kept.tri, kept.mu);
      V = kept.V.slice();
      theta = bestTheta;
      if (++stall >= REJECTIONS_PER_HALVING) {
        lambda /= 2;
        stall = 0;
      }
      if (lambda < 1e-4) status = "converged";
      continue;
    }
    history.push(bestTheta);
    // Certify (an O(n³) proof) when the estimate says the bound may reach the target, every fifth
    // round, and at the last one.
    const last = rounds >= iterations || performance.now() > deadline;
    if (theta - target < stopGap + 0.5 || rounds % 5 === 0 || last) {
      certifyKept();
      if (done()) status = "converged";
    }
    if (lambda < 1e-4) status = "converged";
    if (status === "iteration-limit" && options.stopWhenHopeless === true && history.length > HOPELESS_WINDOW) {
      const rate = (history[history.length - 1 - HOPELESS_WINDOW] - bestTheta) / HOPELESS_WINDOW;
      if (bestTheta - (target + stopGap) > 2 * rate * (iterations - rounds)) status = "completed";
    }
  }
  if (certifiedKept !== kept) certifyKept();
  return {
    method: "sdp-triangles",
    value: best.value,
    plainValue: plain.value,
    certificate: best.certificate,
    vectors: V,
    rank: r,
    status,
    rounds,
    inequalities: best.certificate.mu.length,
    seconds: (performance.now() - t0) / 1000,
    solverSeed: seed,
  };
}
