// Shapes other layers rely on: what a figure needs from a fitted curve, an exponent with its
// interval, and one row of a fit table.

/** Where x is a number for one-predictor laws (m, or m/√d) or the pair {m, d}. */
export type CurveInput = number | { m: number; d: number };

/** A prediction on the original (not log) scale with its confidence band for the mean response. */
export interface CurvePrediction {
  estimate: number;
  lower: number;
  upper: number;
}

/**
 * Anything a figure can draw as a fitted curve with a band: PowerLawFit and ConstantFit satisfy it.
 * `predict` returns the fitted surplus at x and the `level` confidence band of the fitted line.
 */
export interface CurveFit {
  law: string;
  response: string;
  /** The family the fit was made on, when it was made on one (a figure then draws it in that family's style). */
  family?: string;
  predict(x: CurveInput, level?: number): CurvePrediction;
}

/** One fitted exponent with its t-interval and the conjectured value (null when there is none). */
export interface ExponentEstimate {
  family?: string;
  name: string;
  estimate: number;
  lower: number;
  upper: number;
  conjectured: number | null;
}

/** One coefficient of one fit, as plain data for a table (text, LaTeX, JSON). */
export interface FitTableRow {
  family: string | null;
  law: string;
  response: string;
  degree: string;
  term: string;
  estimate: number;
  /** Null for a derived row (C = e^constant) whose interval is mapped, not estimated. */
  standardError: number | null;
  level: number;
  lower: number;
  upper: number;
  bootstrapLower: number | null;
  bootstrapUpper: number | null;
  conjectured: number | null;
  t: number | null;
  pValue: number | null;
  /** Exponents held fixed in this fit (ConstantFit), e.g. "slope = 1"; null for free fits. */
  fixed: string | null;
  rows: number;
  df: number;
  rSquared: number | null;
}

/** Anything that can be laid out as fit-table rows (PowerLawFit, ConstantFit, SurplusBand). */
export interface Tabulable {
  tableRows(level?: number): FitTableRow[];
}
