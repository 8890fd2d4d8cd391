// What each growth law regresses on: its predictors on the log scale, read from a stored row or
// from a point a figure asks about, and how it is written for people.

import { InputError } from "../errors.js";
import type { PowerLaw } from "./rows.js";
import type { CurveInput } from "./types.js";

export interface LawSpec {
  law: PowerLaw;
  /** The law with C and its free exponents, as printed: "C·m^a·d^b". */
  formula: string;
  /** Names of the log predictors: ["m", "d"], ["m"], ["m/√d"]. */
  predictorNames: readonly string[];
  /** Log predictors of a row with ln m and ln d (ln d is NaN for the law "m"). */
  predictors(logM: number, logD: number): number[];
  /** Log predictors at a point: a number (the one predictor itself) or {m, d}. */
  predictorsAt(x: CurveInput, owner: string): number[];
}

function positive(owner: string, name: string, v: unknown): number {
  if (typeof v !== "number" || !Number.isFinite(v) || v <= 0) {
    throw new InputError(`${owner}: invalid \`${name}\`: should be a positive finite number (got ${JSON.stringify(v)})`);
  }
  return v;
}

function pair(owner: string, x: CurveInput): { m: number; d: number } {
  if (x === null || typeof x !== "object") throw new InputError(`${owner}: invalid \`x\`: should be a number or { m, d } (got ${JSON.stringify(x)})`);
  return { m: positive(owner, "x.m", x.m), d: positive(owner, "x.d", x.d) };
}

const M_AND_D: LawSpec = {
  law: "m-and-d",
  formula: "C·m^a·d^b",
  predictorNames: ["m", "d"],
  predictors: (lm, ld) => [lm, ld],
  predictorsAt(x, owner) {
    if (typeof x === "number") throw new InputError(`${owner}: invalid \`x\`: the law "m-and-d" needs { m, d }, not a number`);
    const { m, d } = pair(owner, x);
    return [Math.log(m), Math.log(d)];
  },
};

const M_ONLY: LawSpec = {
  law: "m",
  formula: "C·m^a",
  predictorNames: ["m"],
  predictors: (lm) => [lm],
  predictorsAt(x, owner) {
    if (typeof x === "number") return [Math.log(positive(owner, "x", x))];
    if (x === null || typeof x !== "object") throw new InputError(`${owner}: invalid \`x\`: should be a number or { m, d } (got ${JSON.stringify(x)})`);
    return [Math.log(positive(owner, "x.m", x.m))];
  },
};

const M_OVER_SQRT_D: LawSpec = {
  law: "m-over-sqrt-d",
  formula: "C·(m/√d)^a",
  predictorNames: ["m/√d"],
  predictors: (lm, ld) => [lm - 0.5 * ld],
  predictorsAt(x, owner) {
    if (typeof x === "number") return [Math.log(positive(owner, "x", x))];
    const { m, d } = pair(owner, x);
    return [Math.log(m) - 0.5 * Math.log(d)];
  },
};

export const LAW_SPECS: Record<PowerLaw, LawSpec> = { "m-and-d": M_AND_D, m: M_ONLY, "m-over-sqrt-d": M_OVER_SQRT_D };

/** Coefficient names of the free fit of a law: ln C first, then one exponent per predictor. */
export function powerLawTerms(law: PowerLaw): string[] {
  return law === "m-and-d" ? ["constant", "mExponent", "dExponent"] : ["constant", "slope"];
}

/**
 * Conjectured exponents: surplus ≥ c·m/√d for H-free d-degenerate graphs, i.e. a = 1, b = −1/2 for
 * "m-and-d" and slope 1 for "m-over-sqrt-d". The law "m" leaves d out, so the conjecture fixes no
 * exponent for it (pass one, e.g. 5/6 for the polarity graphs); the constant C has none either.
 */
export function defaultConjecture(law: PowerLaw): Record<string, number | null> {
  if (law === "m-and-d") return { constant: null, mExponent: 1, dExponent: -0.5 };
  return { constant: null, slope: law === "m-over-sqrt-d" ? 1 : null };
}
