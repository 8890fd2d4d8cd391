// The bracket record: its shape, format tag and version, kept apart from the code that makes it
// (bracket.ts) and the code that checks it (verify.ts), so neither imports the other.

import type { SourceRef } from "../../graph/source.js";

/** Format tag written into every bracket record, so verify can refuse other JSON. */
export const BRACKET_RECORD_KIND = "halfplus-maxcut-bracket";
export const BRACKET_RECORD_VERSION = 1;

/**
 * auto: exact search when the graph is small, heuristics and certified bounds otherwise;
 * exact: exact search only (plus the eigenvalue bound if it stops early);
 * heuristic: never exact search; quick: cheap methods only, for large batches of graphs.
 */
export type BracketMethod = "auto" | "exact" | "heuristic" | "quick";
export const BRACKET_METHODS: readonly BracketMethod[] = ["auto", "exact", "heuristic", "quick"];

/** How `upper` is proven. `floored`: integer weights, so the bound was rounded down to an integer. */
export type BracketCertificate =
  | { kind: "psd-dual"; y: number[]; shift: number; shiftMethod: string; floored: boolean; tolerance: number }
  | { kind: "exhaustive"; search: string; nodes: number; floored: boolean; tolerance: number }
  | { kind: "search-bound"; search: string; nodes: number; floored: boolean; tolerance: number }
  | { kind: "positive-weights"; floored: boolean; tolerance: number };

/** One method's contribution, summarised. */
export interface BracketRun {
  method: string;
  /** lower: produced a cut; upper: produced a bound; exact: both; relaxation: an SDP objective. */
  role: "lower" | "upper" | "exact" | "relaxation";
  value: number;
  /** For exact searches: their proven upper bound. */
  upper?: number;
  status: string;
  seconds: number;
  seed: number | null;
  details?: Record<string, number | string | boolean | null>;
}

export interface BracketRecord {
  kind: typeof BRACKET_RECORD_KIND;
  version: typeof BRACKET_RECORD_VERSION;
  n: number;
  m: number;
  totalWeight: number;
  lower: number;
  upper: number;
  /** True when the bracket is closed by proof (for non-integer weights: within certificate.tolerance). */
  exact: boolean;
  /**
   * False when `upper` rests on a Lanczos estimate of the shift (large n) rather than a proof
   * (exhaustive search, Cholesky, Gershgorin, the positive-weight sum).
   */
  upperProven: boolean;
  surplusLower: number;
  surplusUpper: number;
  lowerMethod: string;
  upperMethod: string;
  seconds: number;
  seed: number;
  method: BracketMethod;
  partition: number[];
  certificate: BracketCertificate;
  runs: BracketRun[];
  graphHash: string;
  source: SourceRef | null;
}

