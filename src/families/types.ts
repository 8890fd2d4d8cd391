// What every family file declares: its parameters (validated up front, each error naming the
// parameter), what it is proven to be free of, the n/m/degrees the literature predicts, and a
// seeded builder. `defineFamily` derives the TypeScript type of the parameters from the declared
// list, so builders read `p.n` as a number with no casts.

import type { Graph } from "../graph/graph.js";
import type { Rng } from "../random/prng.js";

/** "spec" / "spec-list": nested family specs, written in brackets: `of=[petersen]`, `of=[cycle:n=5]+[petersen]`. */
export type ParamType = "integer" | "number" | "string" | "boolean" | "integer-list" | "spec" | "spec-list";
export type ParamValue = number | string | boolean | number[] | string[];

/** The TypeScript type a parameter of each ParamType holds. */
export interface ParamValueOf {
  integer: number;
  number: number;
  string: string;
  boolean: boolean;
  "integer-list": number[];
  spec: string;
  "spec-list": string[];
}

export interface ParamSpec {
  readonly name: string;
  readonly type: ParamType;
  readonly description: string;
  /** Omitted means required. */
  readonly default?: ParamValue;
  readonly min?: number;
  readonly max?: number;
  readonly choices?: readonly string[];
}

/** Parameters as the registry handles them: by name, untyped. */
export type Params = Record<string, ParamValue>;

/** The typed parameters a declared list describes: each name to its value type (strings with choices to the union of the choices). */
export type ParamsOf<S extends readonly ParamSpec[]> = {
  [P in S[number] as P["name"]]: P extends { readonly choices: readonly (infer C)[] } ? C : ParamValueOf[P["type"]];
};

/** A family's typed parameters: its declared list, plus the implicit `seed` (the graph seed) of random families. */
export type FamilyParams<S extends readonly ParamSpec[], R extends boolean> = ParamsOf<S> & (R extends true ? { seed: number } : unknown);

/** The n, m and degree range a family predicts for given parameters (before building anything). */
export interface PredictedSize {
  n: number;
  /** Exact edge count when known, else the expectation (say which in `mExact`). */
  m: number;
  mExact: boolean;
  /** Degree range when known. */
  minDegree?: number;
  maxDegree?: number;
}

/** Lets an operation's `predictedSize` ask for the predicted size of a nested spec (passed by the registry). */
export interface SizeContext {
  predictedSizeOf: (spec: string) => PredictedSize;
}

/** A subgraph a family is proven free of, in the names `halfplus graph` uses (K3, C4, K2,3, ...), with the published reason. */
export interface FreeOfClaim {
  pattern: string;
  citation: string;
}

/** What a builder gets: its PRNG and a way to build nested specs (for operations like blow-up). */
export interface BuildContext {
  rng: Rng;
  resolve: (spec: string) => Graph;
  /** Tell the user something about this graph (shown with it, stored with its results). */
  note: (message: string) => void;
}

export interface FamilyDefinition<P = Params> {
  /** The spec name, e.g. "kneser". Lower case, hyphenated. */
  name: string;
  /** Other spec names that build this family; using one adds a note naming the family. */
  aliases?: readonly string[];
  summary: string;
  params: readonly ParamSpec[];
  /** True for families whose graphs depend on a seed; they get an implicit `seed` parameter (the graph seed). */
  random: boolean;
  /** Subgraphs it is proven free of, with the citation. */
  freeOf(params: P): FreeOfClaim[];
  /**
   * Predicted size, used by `halfplus families` and to refuse graphs that would not fit in memory.
   * Never depends on a random family's graph seed: a sweep plan sizes one seed per grid point.
   */
  predictedSize(params: P, ctx?: SizeContext): PredictedSize;
  /** Cross-parameter checks beyond the per-parameter ranges (e.g. k ≤ n/2); throw InputError via `invalidParameter`. */
  validate?(params: P): void;
  build(params: P, ctx: BuildContext): Graph;
  /** Facts about the family and their sources, shown by `halfplus families` (possibly none). */
  notes: readonly string[];
}

/** A definition whose parameter type is derived from its declared `params` (and `random`). */
export function defineFamily<const S extends readonly ParamSpec[], const R extends boolean>(
  def: Omit<FamilyDefinition<FamilyParams<S, R>>, "params" | "random" | "notes"> & { params: S; random: R; notes?: readonly string[] },
): FamilyDefinition<FamilyParams<S, R>> {
  return { ...def, notes: def.notes ?? [] };
}

export interface FamilyGraph {
  graph: Graph;
  /** Canonical spec with every parameter written out (seed included for random families). */
  spec: string;
  /** The family's name (an alias used in the spec resolves to it). */
  family: string;
  params: Params;
  /** The graph seed (random families), else null. */
  graphSeed: number | null;
  /** Messages for the user, e.g. "no seed given: using seed 0". */
  notes: string[];
}
