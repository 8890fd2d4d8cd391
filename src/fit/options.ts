// Validation of the options every fit shares (law, response, degree, level, bootstrap), each error
// one line naming the option and its valid values.

import { InputError, invalidParameter } from "../errors.js";
import { checkSeed } from "../random/index.js";
import { DEGREE_MEASURES, POWER_LAWS, SURPLUS_RESPONSES, type DegreeMeasure, type PowerLaw, type SurplusResponse } from "./rows.js";

/** Bootstrap settings: at least 1000 resamples (percentile intervals need the far tails; Efron & Tibshirani 1993, ch. 19, from memory). */
export interface BootstrapOptions {
  /** Number of case resamples, 1000 to 1,000,000 (default 1000). */
  resamples?: number;
  /** Seed of the resampling stream, a solver seed (default 0, noted in the fit's notes). */
  solverSeed?: number;
}

export const DEFAULT_LEVEL = 0.95;
export const DEFAULT_RESAMPLES = 1000;
export const MIN_RESAMPLES = 1000;
export const MAX_RESAMPLES = 1_000_000;

export function checkLevel(owner: string, level: unknown, name = "level"): number {
  if (typeof level !== "number" || !(level > 0 && level < 1)) {
    throw invalidParameter(owner, name, "should be a number strictly between 0 and 1, e.g. 0.95", level);
  }
  return level;
}

export function checkChoice<T extends string>(owner: string, name: string, value: unknown, choices: readonly T[], fallback: T): T {
  if (value === undefined) return fallback;
  if (typeof value !== "string" || !choices.includes(value as T)) {
    throw invalidParameter(owner, name, `should be one of ${choices.map((c) => `"${c}"`).join(", ")}`, value);
  }
  return value as T;
}

export const checkLaw = (owner: string, v: unknown, fallback: PowerLaw): PowerLaw => checkChoice(owner, "law", v, POWER_LAWS, fallback);
export const checkResponse = (owner: string, v: unknown, fallback: SurplusResponse): SurplusResponse =>
  checkChoice(owner, "response", v, SURPLUS_RESPONSES, fallback);
export const checkDegree = (owner: string, v: unknown): DegreeMeasure => checkChoice(owner, "degree", v, DEGREE_MEASURES, "degeneracy");

/** Resolved bootstrap settings, or null when the caller turned it off; `defaulted` notes a default seed. */
export function checkBootstrap(owner: string, b: unknown): { resamples: number; solverSeed: number; defaultSeed: boolean } | null {
  if (b === false) return null;
  if (b === undefined || b === true) return { resamples: DEFAULT_RESAMPLES, solverSeed: 0, defaultSeed: true };
  if (b === null || typeof b !== "object") throw invalidParameter(owner, "bootstrap", "should be false or { resamples, solverSeed }", b);
  const o = b as Record<string, unknown>;
  for (const k of Object.keys(o)) {
    if (k !== "resamples" && k !== "solverSeed") throw new InputError(`${owner}: unknown option \`bootstrap.${k}\`: bootstrap takes resamples and solverSeed`);
  }
  const resamples = o.resamples ?? DEFAULT_RESAMPLES;
  if (typeof resamples !== "number" || !Number.isInteger(resamples) || resamples < MIN_RESAMPLES || resamples > MAX_RESAMPLES) {
    throw invalidParameter(owner, "bootstrap.resamples", `should be an integer from ${MIN_RESAMPLES} to ${MAX_RESAMPLES}`, o.resamples);
  }
  const solverSeed = checkSeed(owner, "bootstrap.solverSeed", o.solverSeed);
  return { resamples, solverSeed, defaultSeed: o.solverSeed === undefined };
}

/** Refuses option names the function does not know (a misspelt option must not be ignored). */
export function checkKnownOptions(owner: string, options: object, known: readonly string[]): void {
  for (const k of Object.keys(options)) {
    if (!known.includes(k)) throw new InputError(`${owner}: unknown option \`${k}\`: valid options are ${known.join(", ")}`);
  }
}
