// Power-law fits of the surplus: ln surplus = ln C + a·ln m (+ b·ln d) by QR least squares, with
// t-intervals, a seeded bootstrap, tests of the conjectured exponents and the fitted curve's band.

import { InputError } from "../errors.js";
import { defaultConjecture, LAW_SPECS, powerLawTerms } from "./laws.js";
import { LogLinearFit } from "./model.js";
import { checkBootstrap, checkDegree, checkKnownOptions, checkLaw, checkLevel, checkResponse, DEFAULT_LEVEL, type BootstrapOptions } from "./options.js";
import { lawNeedsDegree, screenRows, type DegreeMeasure, type FitRow, type PowerLaw, type ScreenedRows, type SurplusResponse } from "./rows.js";
import type { CurveFit, ExponentEstimate } from "./types.js";

export interface PowerLawOptions {
  /** "m-and-d" (default): C·m^a·d^b; "m": C·m^a; "m-over-sqrt-d": C·(m/√d)^a. */
  law?: PowerLaw;
  /** Bracket end to fit: "lower" (default), "upper", or "exact" (closed brackets only). */
  response?: SurplusResponse;
  /** d is the degeneracy (default), the maximum degree ("maxDegree") or the average degree ("averageDegree"): the row fields. */
  degree?: DegreeMeasure;
  /** Default level of intervals and bands (default 0.95). */
  level?: number;
  /** Case-resampling bootstrap (default { resamples: 1000, solverSeed: 0 }); false to skip it. */
  bootstrap?: BootstrapOptions | false;
  /**
   * Conjectured value per term, tested by `test(name)`. Defaults: mExponent 1, dExponent −1/2
   * (surplus ≥ c·m/√d); slope 1 for "m-over-sqrt-d"; none for the slope of "m" or the constant.
   */
  conjecture?: Partial<Record<string, number | null>>;
}

const KNOWN = ["law", "response", "degree", "level", "bootstrap", "conjecture"];

/**
 * A fitted power law, computed once. Terms (natural logs): "constant" = ln C; "mExponent" a and
 * "dExponent" b for the law "m-and-d"; "slope" a for the one-predictor laws.
 */
export class PowerLawFit extends LogLinearFit implements CurveFit {
  /** The fitted exponents (every term but the constant) with their t-intervals and conjectured values. */
  exponents(level?: number): ExponentEstimate[] {
    const lv = this.checkLevel(level);
    return this.terms
      .filter((t) => t !== "constant")
      .map((name) => {
        const c = this.coefficient(name);
        const ci = this.interval(name, lv);
        const e: ExponentEstimate = { name, estimate: c.estimate, lower: ci.lower, upper: ci.upper, conjectured: this.conjectured(name) };
        if (this.family !== undefined) e.family = this.family;
        return e;
      });
  }
}

/** Resolved options shared by the power-law entry points. */
export interface ResolvedPowerLawOptions {
  law: PowerLaw;
  response: SurplusResponse;
  degree: DegreeMeasure;
  level: number;
  bootstrap: ReturnType<typeof checkBootstrap>;
  conjecture: Record<string, number | null>;
}

export function resolvePowerLawOptions(owner: string, options: PowerLawOptions, known = KNOWN): ResolvedPowerLawOptions {
  if (options === null || typeof options !== "object") throw new InputError(`${owner}: options should be an object (got ${JSON.stringify(options)})`);
  checkKnownOptions(owner, options, known);
  const law = checkLaw(owner, options.law, "m-and-d");
  const terms = powerLawTerms(law);
  const conjecture = defaultConjecture(law);
  if (options.conjecture !== undefined) {
    if (options.conjecture === null || typeof options.conjecture !== "object") {
      throw new InputError(`${owner}: invalid \`conjecture\`: should be an object keyed by term (${terms.join(", ")})`);
    }
    for (const [k, v] of Object.entries(options.conjecture)) {
      if (!terms.includes(k)) throw new InputError(`${owner}: invalid \`conjecture.${k}\`: law "${law}" has terms ${terms.join(", ")}`);
      if (v !== null && (typeof v !== "number" || !Number.isFinite(v))) {
        throw new InputError(`${owner}: invalid \`conjecture.${k}\`: should be a finite number or null (got ${JSON.stringify(v)})`);
      }
      conjecture[k] = v ?? null;
    }
  }
  return {
    law,
    response: checkResponse(owner, options.response, "lower"),
    degree: checkDegree(owner, options.degree),
    level: options.level === undefined ? DEFAULT_LEVEL : checkLevel(owner, options.level),
    bootstrap: checkBootstrap(owner, options.bootstrap),
    conjecture,
  };
}

/** Fits a power law to screened rows (used by fitPowerLaw, fitSurplusBand and fitByFamily). */
export function powerLawFromScreened(owner: string, screened: ScreenedRows, o: ResolvedPowerLawOptions, family?: string): PowerLawFit {
  return new PowerLawFit(
    {
      kind: "power-law",
      owner,
      spec: LAW_SPECS[o.law],
      response: o.response,
      degree: o.degree,
      terms: powerLawTerms(o.law),
      fixedExponents: null,
      conjecture: o.conjecture,
      level: o.level,
      bootstrap: o.bootstrap,
      family,
    },
    screened,
  );
}

/** The family every row shares, or undefined when they differ or none is given. */
export function commonFamily(rows: readonly FitRow[]): string | undefined {
  const f = rows[0]?.family;
  if (f === undefined) return undefined;
  return rows.every((r) => r?.family === f) ? f : undefined;
}

/**
 * Fits surplus ≈ C·m^a·d^b (or a one-predictor law) by least squares on ln surplus, solved by
 * Householder QR, with classical t-intervals and t-tests (e.g. Seber & Lee, Linear Regression
 * Analysis, 2nd ed., ch. 3 and 5) and a seeded case-resampling percentile bootstrap (Efron &
 * Tibshirani 1993). Rows whose response, m or d is missing, not positive or not finite are dropped
 * and listed in `dropped` with the reason.
 */
export function fitPowerLaw(rows: readonly FitRow[], options: PowerLawOptions = {}): PowerLawFit {
  const owner = "fitPowerLaw";
  const o = resolvePowerLawOptions(owner, options);
  const screened = screenRows(rows, { response: o.response, degree: o.degree, needsDegree: lawNeedsDegree(o.law), owner });
  return powerLawFromScreened(owner, screened, o, commonFamily(rows));
}
