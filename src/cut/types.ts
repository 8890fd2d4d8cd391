// Result records shared by every max-cut method. Records are plain data (numbers, strings,
// typed arrays) so they cross worker threads by structured clone and serialise with
// `toPlainRecord`. Each carries its own evidence: a partition for a lower bound, a dual
// vector and eigenvalue shift for an upper bound.

import type { Partition } from "../graph/cut-value.js";

/**
 * optimal: proven optimum. timeout / budget: stopped by the time or iteration budget.
 * converged: an iterative method met its tolerance. heuristic: a best-effort answer.
 */
export type SolverStatus = "optimal" | "timeout" | "budget" | "converged" | "heuristic";

/** A cut found by some method: the value is `cutValue(graph, partition)`. */
export interface CutRecord {
  method: string;
  value: number;
  partition: Partition;
  status: SolverStatus;
  seconds: number;
  seed: number | null;
  /** Method-specific numbers (trials, iterations, guarantee, ...), all plain. */
  details?: Record<string, number | string | boolean | null>;
}

/**
 * Certificate for upper ≤ ¼·(Σ y_i + n·shift): the matrix Diag(y) + shift·I − L is PSD
 * because shift ≥ λmax(L − Diag(y)). The eigenvalue bound is the case y = 0.
 */
export interface DualCertificate {
  kind: "psd-dual";
  y: Float64Array;
  /** Rigorous upper estimate of λmax(L − Diag(y)), rounded up. */
  shift: number;
  /**
   * How `shift` was established: "cholesky-verified" and "gershgorin" are proofs;
   * "lanczos-ritz-residual" is a high-confidence estimate (see src/cut/certificate.ts).
   */
  shiftMethod: string;
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
