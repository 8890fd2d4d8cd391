// The path typed builders (`gnp(n, p, seed)`, `blowUp(g, t)`, ...) share with spec strings:
// the same parameter validation (`resolveParams`, `checkParam`), the same size guard, one PRNG.

import { InputError } from "../errors.js";
import type { Graph } from "../graph/graph.js";
import { Rng } from "../random/prng.js";
import { checkParam, formatSpec, resolveParams } from "./spec.js";
import type { FamilyDefinition, ParamValue, Params } from "./types.js";

/**
 * Largest edge count a generated graph may have. Same value as `MAX_FAMILY_EDGES` in
 * registry.ts, which family files cannot import (registry → catalog → family would be an
 * import cycle); one constant in types.ts would serve both (requested from the lead).
 */
export const GENERATED_EDGE_LIMIT = 200_000_000;

/** Refuse, before allocating, a graph of `m` edges that would not fit in memory. */
export function checkEdgeLimit(owner: string, m: number): void {
  if (m > GENERATED_EDGE_LIMIT) {
    throw new InputError(`${owner}: about ${m.toExponential(2)} edges would not fit in memory (limit ${GENERATED_EDGE_LIMIT.toExponential(0)})`);
  }
}

/** Check one typed argument against the parameter of the same name in a definition. */
export function checkTypedParam(def: FamilyDefinition, name: string, value: ParamValue): void {
  const p = def.params.find((x) => x.name === name);
  if (p === undefined) throw new Error(`${def.name} has no parameter ${name}`);
  checkParam(def.name, p, value);
}

function noNestedSpecs(owner: string): (spec: string) => Graph {
  return (spec) => {
    throw new Error(`${owner}: typed builder cannot resolve nested spec ${JSON.stringify(spec)}`);
  };
}

/**
 * Build a random family from typed parameters and a seed (or a caller's `Rng`, whose seed is
 * validated as the `seed` parameter). A numeric seed gives exactly the graph of the spec string.
 */
export function buildRandomTyped(def: FamilyDefinition, given: Params, seed: number | Rng): Graph {
  const rng = typeof seed === "number" ? null : seed;
  const { params } = resolveParams(def, { ...given, seed: rng === null ? (seed as number) : rng.seed });
  const shape = def.expected(params);
  checkEdgeLimit(formatSpec(def, params), shape.m);
  return def.build(params, { rng: rng ?? new Rng(params.seed as number), resolve: noNestedSpecs(def.name) });
}
