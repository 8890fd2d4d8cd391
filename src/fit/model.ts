// The fitted log-linear model behind every fit: ln surplus = offset + Σ βⱼ zⱼ + ε, computed once
// (QR least squares, optional bootstrap) and then asked for intervals, tests, predictions and tables.

import { InputError } from "../errors.js";
import { bootstrapCoefficients, percentileInterval, type BootstrapReplicates } from "./bootstrap.js";
import { describeFitText, fitsToLatex, type LatexOptions } from "./format.js";
import type { LawSpec } from "./laws.js";
import { leastSquares } from "./least-squares.js";
import { checkLevel } from "./options.js";
import { DEGREE_WORDS } from "../experiment/rows.js";
import { droppedCounts, type DegreeMeasure, type DroppedRow, type ScreenedRows, type SurplusResponse, type UsedRow } from "./rows.js";
import { studentTQuantile, studentTTwoSided } from "./student-t.js";
import type { CurveInput, CurvePrediction, FitTableRow } from "./types.js";

/** What a model regresses: free terms on [1, predictors] or only the constant with fixed exponents. */
export interface ModelDefinition {
  kind: "power-law" | "constant";
  owner: string;
  spec: LawSpec;
  response: SurplusResponse;
  degree: DegreeMeasure;
  terms: readonly string[];
  /** Fixed exponents on the predictors (constant fits); null when the exponents are fitted. */
  fixedExponents: readonly number[] | null;
  /** Conjectured value per term (null: none). */
  conjecture: Readonly<Record<string, number | null>>;
  level: number;
  bootstrap: { resamples: number; solverSeed: number; defaultSeed: boolean } | null;
  family?: string;
}

export interface Coefficient {
  estimate: number;
  standardError: number;
}

export interface Interval {
  lower: number;
  upper: number;
  level: number;
}

export interface TTest {
  /** The hypothesised value tested against. */
  value: number;
  t: number;
  df: number;
  /** Two-sided p-value. */
  pValue: number;
}

/** A used row as a figure plots it: original-scale m, d (null if the law does not use it), surplus. */
export interface FitPoint {
  index: number;
  key?: string;
  m: number;
  d: number | null;
  /** The one predictor (m or m/√d) for one-predictor laws; null for "m-and-d". */
  x: number | null;
  surplus: number;
}

const RESPONSE_WORDS: Record<SurplusResponse, string> = {
  lower: "surplus lower end",
  upper: "surplus upper end",
  exact: "surplus (closed brackets)",
};

export function responseWords(r: SurplusResponse): string {
  return RESPONSE_WORDS[r];
}

/** Shared core of PowerLawFit and ConstantFit. */
export class LogLinearFit {
  readonly kind: "power-law" | "constant";
  readonly law: string;
  readonly response: SurplusResponse;
  readonly degree: DegreeMeasure;
  readonly family?: string;
  /** Default level for intervals and bands. */
  readonly level: number;
  readonly terms: readonly string[];
  /** Rows used (positions in the input array, 0-based, and keys) and rows dropped with reasons. */
  readonly used: readonly UsedRow[];
  readonly dropped: readonly DroppedRow[];
  /** Residual degrees of freedom n − p. */
  readonly df: number;
  /** R² of the log-scale regression (null for a constant-only fit, where it is 0 by construction). */
  readonly rSquared: number | null;
  /** Residual standard deviation on the log scale. */
  readonly residualStandardDeviation: number;
  /** Log-scale residuals ln surplus − fitted, in the order of `used`. */
  readonly residuals: Float64Array;
  /** Hat-matrix diagonal, in the order of `used`. */
  readonly leverage: Float64Array;
  readonly bootstrap: { resamples: number; solverSeed: number; failed: number } | null;
  readonly notes: string[];

  protected readonly spec: LawSpec;
  protected readonly owner: string;
  protected readonly fixedExponents: readonly number[] | null;
  private readonly conjecture: Readonly<Record<string, number | null>>;
  private readonly estimates: Float64Array;
  private readonly standardErrors: Float64Array;
  private readonly unscaledCovariance: Float64Array;
  private readonly replicates: BootstrapReplicates | null;
  private readonly logM: Float64Array;
  private readonly logD: Float64Array;
  private readonly logSurplus: Float64Array;

  constructor(def: ModelDefinition, screened: ScreenedRows) {
    this.kind = def.kind;
    this.owner = def.owner;
    this.spec = def.spec;
    this.law = def.spec.law;
    this.response = def.response;
    this.degree = def.degree;
    if (def.family !== undefined) this.family = def.family;
    this.level = def.level;
    this.terms = def.terms;
    this.fixedExponents = def.fixedExponents;
    this.conjecture = def.conjecture;
    this.used = screened.used;
    this.dropped = screened.dropped;
    this.logM = screened.logM;
    this.logD = screened.logD;
    this.logSurplus = screened.logSurplus;
    this.notes = [];

    const n = screened.used.length;
    const p = def.terms.length;
    if (n < p + 1) {
      const why = droppedCounts(screened.dropped).map((d) => `${d.count} × ${d.reason}`).join("; ");
      throw new InputError(
        `${def.owner}: needs at least ${p + 1} usable rows for ${p} coefficient${p === 1 ? "" : "s"} (law "${def.spec.law}", response "${def.response}"), got ${n}` +
          (screened.dropped.length > 0 ? ` (dropped: ${why})` : ""),
      );
    }
    // Columns [1, predictors…] (free fit) or [1] with the fixed part moved into an offset.
    const k = def.spec.predictorNames.length;
    const preds: Float64Array[] = [];
    for (let j = 0; j < k; j++) preds.push(new Float64Array(n));
    for (let i = 0; i < n; i++) {
      const z = def.spec.predictors(this.logM[i], this.logD[i]);
      for (let j = 0; j < k; j++) preds[j][i] = z[j];
    }
    const y = Float64Array.from(this.logSurplus);
    const columns: Float64Array[] = [new Float64Array(n).fill(1)];
    if (def.fixedExponents === null) {
      for (let j = 0; j < k; j++) {
        if (isConstant(preds[j])) {
          throw new InputError(
            `${def.owner}: ${def.spec.predictorNames[j]} takes the same value in all ${n} used rows, so its exponent cannot be fitted` +
              (def.spec.law === "m-and-d" && j === 1 ? ` (try law "m" or "m-over-sqrt-d")` : ""),
          );
        }
        columns.push(preds[j]);
      }
    } else {
      for (let i = 0; i < n; i++) for (let j = 0; j < k; j++) y[i] -= def.fixedExponents[j] * preds[j][i];
    }
    const X = new Float64Array(n * p);
    for (let j = 0; j < p; j++) X.set(columns[j], j * n);
    const ls = leastSquares({ columnMajor: X, rows: n, columns: p }, y, { names: def.terms, owner: def.owner });
    this.estimates = ls.coefficients;
    this.standardErrors = ls.standardErrors;
    this.unscaledCovariance = ls.unscaledCovariance;
    this.df = ls.df;
    this.residualStandardDeviation = ls.residualStandardDeviation;
    this.residuals = ls.residuals;
    this.leverage = ls.leverage;
    this.rSquared = p > 1 ? ls.rSquared : null;

    if (def.bootstrap === null) {
      this.replicates = null;
      this.bootstrap = null;
    } else {
      this.replicates = bootstrapCoefficients(columns, y, def.bootstrap);
      this.bootstrap = { resamples: def.bootstrap.resamples, solverSeed: def.bootstrap.solverSeed, failed: this.replicates.failed };
      if (def.bootstrap.defaultSeed) this.notes.push(`bootstrap solver seed 0 (the default; pass bootstrap.solverSeed to choose another)`);
      if (this.replicates.failed > 0) {
        this.notes.push(`${this.replicates.failed} of ${def.bootstrap.resamples} bootstrap resamples could not separate the coefficients (rank-deficient) and were skipped`);
      }
    }
    if (screened.dropped.length > 0) {
      this.notes.push(`dropped ${screened.dropped.length} row${screened.dropped.length === 1 ? "" : "s"}: ${droppedCounts(screened.dropped).map((d) => `${d.count} × ${d.reason}`).join("; ")}`);
    }
  }

  /** Number of rows the fit used. */
  get rows(): number {
    return this.used.length;
  }

  protected termIndex(name: string): number {
    const j = this.terms.indexOf(name);
    if (j < 0) throw new InputError(`${this.owner}: unknown term ${JSON.stringify(name)}: terms are ${this.terms.join(", ")}`);
    return j;
  }

  protected checkLevel(level: number | undefined): number {
    return level === undefined ? this.level : checkLevel(this.owner, level);
  }

  /** Estimate and standard error of a term (log scale for "constant" = ln C). */
  coefficient(name: string): Coefficient {
    const j = this.termIndex(name);
    return { estimate: this.estimates[j], standardError: this.standardErrors[j] };
  }

  /** t-interval estimate ± t_{df, (1+level)/2} · standard error. */
  interval(name: string, level?: number): Interval {
    const j = this.termIndex(name);
    const lv = this.checkLevel(level);
    const half = studentTQuantile((1 + lv) / 2, this.df) * this.standardErrors[j];
    return { lower: this.estimates[j] - half, upper: this.estimates[j] + half, level: lv };
  }

  /** Percentile interval of the seeded case-resampling bootstrap (fitted once, read here). */
  bootstrapInterval(name: string, level?: number): Interval {
    const j = this.termIndex(name);
    const lv = this.checkLevel(level);
    if (this.replicates === null) throw new InputError(`${this.owner}: no bootstrap interval: the fit was made with \`bootstrap: false\``);
    const sorted = this.replicates.sorted[j];
    // Each end must lie between replicates, not beyond the last one.
    if (sorted.length * ((1 - lv) / 2) < 1) {
      throw new InputError(`${this.owner}: invalid \`level\`: ${lv} needs more than ${sorted.length} successful resamples (at least one beyond each end)`);
    }
    const { lower, upper } = percentileInterval(sorted, lv);
    return { lower, upper, level: lv };
  }

  /** The conjectured value of a term, or null. */
  conjectured(name: string): number | null {
    this.termIndex(name);
    return this.conjecture[name] ?? null;
  }

  /** Two-sided t-test of H₀: term = value (default: the conjectured value). */
  test(name: string, value?: number): TTest {
    const j = this.termIndex(name);
    const v = value ?? this.conjecture[name] ?? null;
    if (v === null) throw new InputError(`${this.owner}: no conjectured value for ${JSON.stringify(name)}: pass the value to test against`);
    if (typeof v !== "number" || !Number.isFinite(v)) throw new InputError(`${this.owner}: invalid \`value\`: should be a finite number (got ${JSON.stringify(v)})`);
    const t = (this.estimates[j] - v) / this.standardErrors[j];
    return { value: v, t, df: this.df, pValue: studentTTwoSided(t, this.df) };
  }

  /**
   * Fitted surplus at x on the original scale, e^{ŷ}, with the confidence band of the fitted line
   * e^{ŷ ± t·s·√(zᵀ(XᵀX)⁻¹z)} (a band for the median surplus under log-normal errors, not a
   * prediction interval for a new graph).
   */
  predict(x: CurveInput, level?: number): CurvePrediction {
    const lv = this.checkLevel(level);
    const preds = this.spec.predictorsAt(x, this.owner);
    const p = this.terms.length;
    const z = new Float64Array(p);
    z[0] = 1;
    let offset = 0;
    if (this.fixedExponents === null) for (let j = 0; j < preds.length; j++) z[j + 1] = preds[j];
    else for (let j = 0; j < preds.length; j++) offset += this.fixedExponents[j] * preds[j];
    let est = offset;
    for (let j = 0; j < p; j++) est += z[j] * this.estimates[j];
    let q = 0;
    for (let i = 0; i < p; i++) for (let j = 0; j < p; j++) q += z[i] * this.unscaledCovariance[i * p + j] * z[j];
    const half = studentTQuantile((1 + lv) / 2, this.df) * this.residualStandardDeviation * Math.sqrt(Math.max(0, q));
    return { estimate: Math.exp(est), lower: Math.exp(est - half), upper: Math.exp(est + half) };
  }

  /** The used rows on the original scale, for plotting the data under the curve. */
  points(): FitPoint[] {
    const oneX = this.spec.predictorNames.length === 1;
    return this.used.map((u, i) => {
      const m = Math.exp(this.logM[i]);
      const d = Number.isNaN(this.logD[i]) ? null : Math.exp(this.logD[i]);
      const x = oneX ? Math.exp(this.spec.predictors(this.logM[i], this.logD[i])[0]) : null;
      const pt: FitPoint = { index: u.index, m, d, x, surplus: Math.exp(this.logSurplus[i]) };
      if (u.key !== undefined) pt.key = u.key;
      return pt;
    });
  }

  /** Fixed exponents in words ("slope = 1"), or null for a free fit. */
  fixedText(): string | null {
    if (this.fixedExponents === null) return null;
    const names = this.spec.predictorNames.length === 1 ? ["slope"] : ["mExponent", "dExponent"];
    return this.fixedExponents.map((v, j) => `${names[j]} = ${v}`).join(", ");
  }

  /** One plain row per term (and for constant fits, C = e^constant on the original scale). */
  tableRows(level?: number): FitTableRow[] {
    const lv = this.checkLevel(level);
    const fixed = this.fixedText();
    const rows: FitTableRow[] = [];
    for (const term of this.terms) {
      const c = this.coefficient(term);
      const ci = this.interval(term, lv);
      const boot = this.replicates === null ? null : this.bootstrapIntervalOrNull(term, lv);
      const conj = this.conjectured(term);
      const tt = conj === null ? null : this.test(term);
      rows.push({
        family: this.family ?? null,
        law: this.law,
        response: this.response,
        degree: this.degree,
        term,
        estimate: c.estimate,
        standardError: c.standardError,
        level: lv,
        lower: ci.lower,
        upper: ci.upper,
        bootstrapLower: boot?.lower ?? null,
        bootstrapUpper: boot?.upper ?? null,
        conjectured: conj,
        t: tt?.t ?? null,
        pValue: tt?.pValue ?? null,
        fixed,
        rows: this.rows,
        df: this.df,
        rSquared: this.rSquared,
      });
    }
    return rows;
  }

  private bootstrapIntervalOrNull(term: string, level: number): Interval | null {
    try {
      return this.bootstrapInterval(term, level);
    } catch (e) {
      if (e instanceof InputError) return null;
      throw e;
    }
  }

  /** Readable text: the law, rows used and dropped, one line per term, fit statistics, notes. */
  summary(level?: number): string {
    return describeFitText(this.headline(), this.tableRows(level), this.footer());
  }

  /** A booktabs table fragment for a paper (needs \usepackage{booktabs}). */
  latex(options: LatexOptions = {}): string {
    return fitsToLatex([this], options);
  }

  protected headline(): string {
    const d = this.spec.predictorNames.some((n) => n.includes("d")) ? `, d = ${DEGREE_WORDS[this.degree]}` : "";
    const fixed = this.fixedText();
    const what = fixed === null ? `surplus ≈ ${this.spec.formula}` : `surplus ≈ ${this.spec.formula} with ${fixed} held fixed`;
    const fam = this.family === undefined ? "" : `family ${this.family}: `;
    return `${fam}${what} (log-scale least squares; response: ${responseWords(this.response)}${d})`;
  }

  protected footer(): string[] {
    const lines: string[] = [];
    const stats = [`${this.rows} rows used, ${this.dropped.length} dropped`, `df ${this.df}`];
    if (this.rSquared !== null) stats.push(`R² ${this.rSquared.toFixed(4)}`);
    stats.push(`residual s.d. ${this.residualStandardDeviation.toPrecision(3)} (ln scale)`);
    let hmax = 0;
    for (const h of this.leverage) hmax = Math.max(hmax, h);
    stats.push(`max leverage ${hmax.toFixed(3)}`);
    lines.push(stats.join(" · "));
    if (this.bootstrap !== null) lines.push(`bootstrap: ${this.bootstrap.resamples} case resamples, solver seed ${this.bootstrap.solverSeed}, percentile intervals`);
    for (const n of this.notes) lines.push(`note: ${n}`);
    return lines;
  }

  /** Plain JSON-ready record of the fit (kind "halfplus/fit"). */
  toJSON(): Record<string, unknown> {
    return {
      kind: "halfplus/fit",
      version: 1,
      model: this.kind,
      law: this.law,
      response: this.response,
      degree: this.degree,
      family: this.family ?? null,
      fixed: this.fixedText(),
      level: this.level,
      terms: this.tableRows().map((r) => ({
        name: r.term,
        estimate: r.estimate,
        standardError: r.standardError,
        lower: r.lower,
        upper: r.upper,
        bootstrapLower: r.bootstrapLower,
        bootstrapUpper: r.bootstrapUpper,
        conjectured: r.conjectured,
        t: r.t,
        pValue: r.pValue,
      })),
      rows: this.rows,
      df: this.df,
      rSquared: this.rSquared,
      residualStandardDeviation: this.residualStandardDeviation,
      bootstrap: this.bootstrap,
      used: this.used,
      dropped: this.dropped,
      notes: this.notes,
    };
  }
}

function isConstant(a: Float64Array): boolean {
  for (let i = 1; i < a.length; i++) if (a[i] !== a[0]) return false;
  return true;
}
