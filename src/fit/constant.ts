// The conjectured line with its exponents held fixed, e.g. surplus = C·(m/√d): only C is fitted
// (ln C = mean of ln surplus − slope·ln x), with its t-interval, bootstrap interval and band.

import { InputError } from "../errors.js";
import { LAW_SPECS } from "./laws.js";
import { LogLinearFit, type Interval } from "./model.js";
import { checkBootstrap, checkDegree, checkKnownOptions, checkLaw, checkLevel, checkResponse, DEFAULT_LEVEL, type BootstrapOptions } from "./options.js";
import { commonFamily } from "./power-law.js";
import { lawNeedsDegree, screenRows, type DegreeMeasure, type FitRow, type PowerLaw, type SurplusResponse } from "./rows.js";
import type { CurveFit, FitTableRow } from "./types.js";

export interface ConstantFitOptions {
  /** "m-over-sqrt-d" (default): C·(m/√d)^slope; "m": C·m^slope; "m-and-d": C·m^a·d^b with both fixed. */
  law?: PowerLaw;
  /**
   * The fixed exponent(s): a number for the one-predictor laws (default 1), or
   * { mExponent, dExponent } for "m-and-d" (default { mExponent: 1, dExponent: −1/2 }).
   */
  slope?: number | { mExponent: number; dExponent: number };
  response?: SurplusResponse;
  degree?: DegreeMeasure;
  level?: number;
  bootstrap?: BootstrapOptions | false;
}

const KNOWN = ["law", "slope", "response", "degree", "level", "bootstrap"];

/** A fitted constant under fixed exponents. Its one term is "constant" = ln C; `scale()` gives C itself. */
export class ConstantFit extends LogLinearFit implements CurveFit {
  /** The fixed exponents, in the order of the law's predictors. */
  get slopes(): readonly number[] {
    return this.fixedExponents ?? [];
  }

  /** C = e^{ln C} on the original scale with the t-interval mapped through exp. */
  scale(level?: number): { estimate: number; lower: number; upper: number; level: number } {
    const c = this.coefficient("constant");
    const ci: Interval = this.interval("constant", level);
    return { estimate: Math.exp(c.estimate), lower: Math.exp(ci.lower), upper: Math.exp(ci.upper), level: ci.level };
  }

  /** The ln C row, then a derived row for C itself (interval and bootstrap mapped through exp). */
  override tableRows(level?: number): FitTableRow[] {
    const rows = super.tableRows(level);
    const ln = rows[0];
    rows.push({
      ...ln,
      term: "C",
      estimate: Math.exp(ln.estimate),
      standardError: null,
      lower: Math.exp(ln.lower),
      upper: Math.exp(ln.upper),
      bootstrapLower: ln.bootstrapLower === null ? null : Math.exp(ln.bootstrapLower),
      bootstrapUpper: ln.bootstrapUpper === null ? null : Math.exp(ln.bootstrapUpper),
    });
    return rows;
  }
}

function checkSlope(owner: string, law: PowerLaw, slope: ConstantFitOptions["slope"]): number[] {
  const finite = (name: string, v: unknown): number => {
    if (typeof v !== "number" || !Number.isFinite(v)) throw new InputError(`${owner}: invalid \`${name}\`: should be a finite number (got ${JSON.stringify(v)})`);
    return v;
  };
  if (law === "m-and-d") {
    if (slope === undefined) return [1, -0.5];
    if (slope === null || typeof slope !== "object") {
      throw new InputError(`${owner}: invalid \`slope\`: the law "m-and-d" takes { mExponent, dExponent } (got ${JSON.stringify(slope)})`);
    }
    return [finite("slope.mExponent", slope.mExponent), finite("slope.dExponent", slope.dExponent)];
  }
  if (slope === undefined) return [1];
  if (typeof slope !== "number") throw new InputError(`${owner}: invalid \`slope\`: the law "${law}" takes a number (got ${JSON.stringify(slope)})`);
  return [finite("slope", slope)];
}

/**
 * Fits the constant C of surplus = C·(m/√d)^slope (or another law with all exponents fixed) on the
 * log scale: ln C is the mean of ln surplus − slope·ln x, with the one-sample t-interval
 * (Student 1908; any regression text, e.g. Seber & Lee ch. 5, as the intercept-only model).
 */
export function fitConstant(rows: readonly FitRow[], options: ConstantFitOptions = {}): ConstantFit {
  const owner = "fitConstant";
  if (options === null || typeof options !== "object") throw new InputError(`${owner}: options should be an object (got ${JSON.stringify(options)})`);
  checkKnownOptions(owner, options, KNOWN);
  const law = checkLaw(owner, options.law, "m-over-sqrt-d");
  const slopes = checkSlope(owner, law, options.slope);
  const response = checkResponse(owner, options.response, "lower");
  const degree = checkDegree(owner, options.degree);
  const level = options.level === undefined ? DEFAULT_LEVEL : checkLevel(owner, options.level);
  const bootstrap = checkBootstrap(owner, options.bootstrap);
  const screened = screenRows(rows, { response, degree, needsDegree: lawNeedsDegree(law), owner });
  return new ConstantFit(
    {
      kind: "constant",
      owner,
      spec: LAW_SPECS[law],
      response,
      degree,
      terms: ["constant"],
      fixedExponents: slopes,
      conjecture: { constant: null },
      level,
      bootstrap,
      family: commonFamily(rows),
    },
    screened,
  );
}
