// A named graph as a parameterless family: its published size, degree and what it is free of,
// stated once here and checked against the built graph in the tests.

import type { Graph } from "../../graph/graph.js";
import { defineFamily, type FamilyDefinition, type FreeOfClaim } from "../types.js";

export interface NamedGraphFacts {
  name: string;
  summary: string;
  n: number;
  m: number;
  /** Degree range (equal for regular graphs). */
  minDegree: number;
  maxDegree: number;
  freeOf: FreeOfClaim[];
  notes?: readonly string[];
  build: () => Graph;
}

export function namedFamily(f: NamedGraphFacts): FamilyDefinition<unknown> {
  return defineFamily({
    name: f.name,
    summary: f.summary,
    params: [],
    random: false,
    freeOf: () => f.freeOf,
    predictedSize: () => ({ n: f.n, m: f.m, mExact: true, minDegree: f.minDegree, maxDegree: f.maxDegree }),
    build: () => f.build(),
    notes: f.notes ?? [],
  });
}
