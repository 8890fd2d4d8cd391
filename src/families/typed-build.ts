// The path typed builders (`gnp(n, p, graphSeed)`, `blowUp(g, t)`, ...) share with spec strings:
// the same parameter validation (`resolveParams`, `checkParam`), the same size guard, one PRNG.

import type { Graph } from "../graph/graph.js";
import { Rng } from "../random/prng.js";
import { checkEdgeLimit } from "./limits.js";
import { checkParam, formatSpec, resolveParams } from "./spec.js";
import type { FamilyDefinition, ParamValue } from "./types.js";

/** Check one typed argument against the parameter of the same name in a definition. */
export function checkTypedParam<P>(def: FamilyDefinition<P>, name: string & keyof P, value: ParamValue): void {
  const p = def.params.find((x) => x.name === name);
  if (p === undefined) throw new Error(`${def.name} has no parameter ${name}`);
  checkParam(def.name, p, value);
}

function noNestedSpecs(owner: string): (spec: string) => Graph {
  return (spec) => {
    throw new Error(`${owner}: typed builder cannot resolve nested spec ${JSON.stringify(spec)}`);
  };
}

/** Validated parameters for a typed call, refused up front when the graph would not fit in memory. */
export function resolveTyped<P>(def: FamilyDefinition<P>, given: Partial<P>): P {
  const { params } = resolveParams(def as FamilyDefinition<unknown>, given as Record<string, ParamValue>);
  // resolveParams checked every declared parameter against its type: the one place untyped values become typed.
  const typed = params as unknown as P;
  const size = def.predictedSize(typed);
  checkEdgeLimit(formatSpec(def as FamilyDefinition<unknown>, params), size.m, size.n);
  return typed;
}

/**
 * Build a random family from typed parameters and a graph seed (or a caller's `Rng`, whose seed
 * is validated as the `seed` parameter). A numeric seed gives exactly the graph of the spec string.
 */
export function buildRandomTyped<P extends { seed: number }>(def: FamilyDefinition<P>, given: Omit<P, "seed">, graphSeed: number | Rng): Graph {
  const rng = typeof graphSeed === "number" ? null : graphSeed;
  const params = resolveTyped(def, { ...given, seed: rng === null ? (graphSeed as number) : rng.seed } as Partial<P>);
  return def.build(params, { rng: rng ?? new Rng(params.seed), resolve: noNestedSpecs(def.name), note: () => {} });
}
