// What every family file declares: its parameters (validated up front, each error naming
// the parameter), what it is proven to be free of, the n/m/degrees the literature
// predicts, and a seeded builder.

import type { Graph } from "../graph/graph.js";
import type { Rng } from "../random/prng.js";

/** "spec" / "spec-list": nested family specs, written in brackets: `of=[petersen]`, `of=[cycle:n=5]+[petersen]`. */
export type ParamType = "integer" | "number" | "string" | "boolean" | "integer-list" | "spec" | "spec-list";
export type ParamValue = number | string | boolean | number[] | string[];

export interface ParamSpec {
  name: string;
  type: ParamType;
  description: string;
  /** Omitted means required. */
  default?: ParamValue;
  min?: number;
  max?: number;
  choices?: readonly string[];
}

export type Params = Record<string, ParamValue>;

export interface ExpectedShape {
  n: number;
  /** Exact edge count when known, else the expectation (say which in `mExact`). */
  m: number;
  mExact: boolean;
  /** Degree range when known. */
  minDegree?: number;
  maxDegree?: number;
}

/** Lets an operation's `expected` ask for the predicted shape of a nested spec (passed by the registry). */
export interface ShapeContext {
  expectedOf: (spec: string) => ExpectedShape;
}

/** What a builder gets: its PRNG and a way to build nested specs (for operations like blow-up). */
export interface BuildContext {
  rng: Rng;
  resolve: (spec: string) => Graph;
  /** Tell the user something about this graph (shown with it, stored with its results). */
  note: (message: string) => void;
}

export interface FamilyDefinition {
  /** The spec name, e.g. "kneser". Lower case, hyphenated. */
  name: string;
  summary: string;
  params: readonly ParamSpec[];
  /** True for families whose graphs depend on a seed; they get an implicit `seed` parameter. */
  random: boolean;
  /** Subgraphs it is proven free of, in the names used by `halfplus graph` (K3, C4, C5, K4, K2,3, ...), with the citation. */
  freeOf: (params: Params) => { pattern: string; source: string }[];
  /** Predicted size, used for `halfplus families` and to refuse graphs that would not fit in memory. */
  expected: (params: Params, ctx?: ShapeContext) => ExpectedShape;
  /** Cross-parameter checks beyond the per-parameter ranges (e.g. k ≤ n/2); throw InputError via `invalidParameter`. */
  validate?: (params: Params) => void;
  build: (params: Params, ctx: BuildContext) => Graph;
  /** Facts about the family and its source, shown by `halfplus families`. */
  notes?: string;
}

export interface FamilyGraph {
  graph: Graph;
  /** Canonical spec with every parameter written out (seed included for random families). */
  spec: string;
  family: string;
  params: Params;
  /** Seed used (random families), else null. */
  seed: number | null;
  /** Messages for the user, e.g. "no seed given: using seed 0". */
  notes: string[];
}
