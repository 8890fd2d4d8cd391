// The path typed builders (`gnp(n, p, seed)`, `blowUp(g, t)`, ...) share with spec strings:
// the same parameter validation (`resolveParams`, `checkParam`), the same size guard, one PRNG.

import type { Graph } from "../graph/graph.js";
import { Rng } from "../random/prng.js";
import { checkEdgeLimit } from "./limits.js";
import { checkParam, formatSpec, resolveParams } from "./spec.js";
import type { FamilyDefinition, ParamValue, Params } from "./types.js";

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
  const params = resolveTyped(def, { ...given, seed: rng === null ? (seed as number) : rng.seed });
  return def.build(params, { rng: rng ?? new Rng(params.seed as number), resolve: noNestedSpecs(def.name), note: () => {} });
}

/** Validated parameters for a typed call, refused up front when the graph would not fit in memory. */
export function resolveTyped(def: FamilyDefinition, given: Params): Params {
  const { params } = resolveParams(def, given);
  const shape = def.expected(params);
  checkEdgeLimit(formatSpec(def, params), shape.m, shape.n);
  return params;
}
