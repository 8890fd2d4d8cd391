// A named graph as a parameterless family: its published size, degree and what it is free of,
// stated once here and checked against the built graph in the tests.

import type { Graph } from "../../graph/graph.js";
import type { FamilyDefinition } from "../types.js";

export interface NamedGraphFacts {
  name: string;
  summary: string;
  n: number;
  m: number;
  /** Degree range (equal for regular graphs). */
  minDegree: number;
  maxDegree: number;
  freeOf: { pattern: string; source: string }[];
  notes?: string;
  build: () => Graph;
}

export function namedFamily(f: NamedGraphFacts): FamilyDefinition {
  return {
    name: f.name,
    summary: f.summary,
    params: [],
    random: false,
    freeOf: () => f.freeOf,
    expected: () => ({ n: f.n, m: f.m, mExact: true, minDegree: f.minDegree, maxDegree: f.maxDegree }),
    build: () => f.build(),
    ...(f.notes === undefined ? {} : { notes: f.notes }),
  };
}
