// The rows the results store hands to the fits and the figures, and the names of the degree
// measures, declared once. This module imports nothing, so src/fit and src/plot (above the store in
// the layers) can use these shapes without loading any of the store's machinery.

/**
 * The degree measures a row can carry, named by their row fields: the d of m/√d in fits and
 * figures. The store may also keep `minDegree` (see STORED_DEGREES), which no law uses for d.
 */
export type DegreeMeasure = "degeneracy" | "maxDegree" | "averageDegree";
export const DEGREE_MEASURES: readonly DegreeMeasure[] = ["degeneracy", "maxDegree", "averageDegree"];

/** Degree columns a plan may keep in the store (plan field `degrees`) and a CSV `d` column may stand for. */
export type StoredDegree = DegreeMeasure | "minDegree";
export const STORED_DEGREES: readonly StoredDegree[] = ["degeneracy", "maxDegree", "averageDegree", "minDegree"];

/** Words for a degree measure in titles, notes and help text. */
export const DEGREE_WORDS: Readonly<Record<StoredDegree, string>> = {
  degeneracy: "degeneracy",
  maxDegree: "maximum degree",
  averageDegree: "average degree",
  minDegree: "minimum degree",
};

/** One bracketed graph as a fit reads it (from the store, an imported CSV or any caller). */
export interface FitRow {
  /** The store's key for the row (or any label); carried into a fit's `used` and `dropped`. */
  key?: string;
  family?: string;
  n?: number;
  m: number;
  degeneracy?: number;
  maxDegree?: number;
  averageDegree?: number;
  /** max cut lower bound − W/2 (W = m unweighted); null when unknown. */
  surplusLower: number | null;
  /** max cut upper bound − W/2; null when unknown. */
  surplusUpper: number | null;
  /** True when the bracket is closed by proof (surplusLower = surplusUpper = the surplus). */
  exact: boolean;
}

/**
 * One bracketed graph as a figure reads it. Counts are of the graph itself; `surplusLower` /
 * `surplusUpper` bracket max cut − W/2. `bestCut`, `sdpBound`, `vectorGuarantee` and
 * `edwardsBound` are cut values (same units as max cut, not surpluses): the best cut found, the
 * certified SDP upper bound, the explicit vector rounding's guaranteed expected cut and Edwards'
 * lower bound. `degrees` (one per vertex) feeds the degree distribution figure and may be left out.
 */
export interface SurplusRow {
  /** A short label for the graph (the store's key or spec), shown on hover and in exports. */
  key?: string;
  family: string;
  n: number;
  m: number;
  /** Total edge weight W (default m): the figures subtract W/2 from cut values. */
  totalWeight?: number;
  degeneracy: number;
  maxDegree: number;
  averageDegree: number;
  surplusLower: number;
  surplusUpper: number;
  exact: boolean;
  bestCut?: number;
  sdpBound?: number;
  vectorGuarantee?: number;
  edwardsBound?: number;
  degrees?: readonly number[];
}
