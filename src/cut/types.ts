// Result records shared by every max-cut method. Records are plain data (numbers, strings,
// typed arrays) so they cross worker threads by structured clone and serialise with
// `toPlainRecord`. Each carries its own evidence: a partition for a lower bound, a dual
// vector and eigenvalue shift for an upper bound.

import { cutValue, type Partition } from "../graph/cut-value.js";
import type { Graph } from "../graph/graph.js";

/**
 * Why a method stopped. optimal: proven optimum. converged: an iterative method met its
 * tolerance. completed: it did the fixed amount of work asked for (all rounding trials), with no
 * optimality claim. time-limit: its wall-clock budget (`seconds`) ran out. iteration-limit: its
 * count of iterations (restarts, rounds, sweeps) ran out. work-limit: its deterministic work
 * budget (`work`, e.g. an exact search's nodes) ran out.
 */
export type SolverStatus = "optimal" | "converged" | "completed" | "time-limit" | "iteration-limit" | "work-limit";

/** A cut found by some method: the value is `cutValue(graph, partition)`. */
export interface CutRecord {
  method: string;
  value: number;
  partition: Partition;
  status: SolverStatus;
  seconds: number;
  /** Seed of the method's own randomness; null for methods that use none. */
  solverSeed: number | null;
  /** Method-specific numbers (trials, iterations, guarantee, ...), all plain. */
  details?: Record<string, number | string | boolean | null>;
}

/**
 * How the shift of a dual certificate is established. cholesky: proved by a floating-point
 * Cholesky factorisation with a rounding-error margin. gershgorin: proved by Gershgorin's circle
 * theorem. sparse-cholesky: the same proof on a sparse factor (reverse Cuthill–McKee envelope).
 * chebyshev-probable: holds with probability ≥ 1 − δ over a seeded start vector.
 * lanczos-estimate: a Lanczos Ritz value plus residual, a high-confidence estimate
 * rather than a proof (see src/cut/relaxation/certificate.ts).
 */
export type ShiftProof = "cholesky" | "gershgorin" | "sparse-cholesky" | "chebyshev-probable" | "lanczos-estimate";

/**
 * What re-derives a probable shift (shiftProof "chebyshev-probable"): the Chebyshev filter of
 * `degree` on [bottom, top] applied to the Gaussian start drawn from `solverSeed`; the shift then
 * bounds λmax(L − Diag(y)) with probability ≥ 1 − failureProbability (src/linalg/probable-top-bound.ts).
 */
export interface ProbableShift {
  failureProbability: number;
  solverSeed: number;
  degree: number;
  top: number;
  bottom: number;
}

/**
 * How far an upper bound can be trusted. proven: a theorem, checked in floating point with
 * rounding margins (exhaustive search, a Cholesky or Gershgorin shift, the positive-weight sum).
 * probable: holds with a stated probability over a recorded seed (a Chebyshev shift). estimate: a
 * high-confidence numerical estimate, not a proof (a Lanczos shift).
 */
export type UpperKind = "proven" | "probable" | "estimate";

/** The record of a cut a method found: a copy of its partition, the value confirmed by `cutValue`. */
export function cutRecordOf(
  method: string,
  graph: Graph,
  partition: Partition,
  status: SolverStatus,
  seconds: number,
  solverSeed: number | null,
  details: CutRecord["details"],
): CutRecord {
  const copy = partition.slice();
  return { method, value: cutValue(graph, copy), partition: copy, status, seconds, solverSeed, details };
}

/**
 * Certificate for upper ≤ ¼·(Σ y_i + n·shift): the matrix Diag(y) + shift·I − L is PSD
 * because shift ≥ λmax(L − Diag(y)). The eigenvalue bound is the case y = 0.
 */
export interface DualCertificate {
  kind: "psd-dual";
  y: Float64Array;
  /** Upper estimate of λmax(L − Diag(y)), rounded up. */
  shift: number;
  shiftProof: ShiftProof;
  /** Present for shiftProof "chebyshev-probable": what verify re-runs. */
  probable?: ProbableShift;
}

export interface UpperBoundRecord {
  method: string;
  value: number;
  certificate: DualCertificate | null;
  status: SolverStatus;
  seconds: number;
  /** Objective of the (primal) relaxation when the method solved one. */
  relaxationValue?: number;
  details?: Record<string, number | string | boolean | null>;
}

/** Typed arrays become plain arrays, so JSON.stringify writes a record readably. */
export function toPlainRecord<T>(record: T): unknown {
  return JSON.parse(
    JSON.stringify(record, (_k, v: unknown) => (ArrayBuffer.isView(v) && !(v instanceof DataView) ? Array.from(v as unknown as ArrayLike<number>) : v)),
  );
}
