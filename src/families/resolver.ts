// Resolving a family spec against a set of family definitions: looks the name up (aliases
// included), validates the parameters, guards memory, and builds the graph with a PRNG seeded from
// the spec. The set is given as a lookup, so the registry (every family, ./registry.ts) and the
// command line's loader (only the families a spec names, ./family-loaders.ts) share this code.

import { InputError, echo } from "../errors.js";
import { Rng } from "../random/prng.js";
import { checkEdgeLimit } from "./limits.js";
import { formatSpec, parseRawSpec, resolveParams } from "./spec.js";
import type { FamilyDefinition, FamilyGraph, Params, PredictedSize, SizeContext } from "./types.js";

/** Names that were retired, and what replaces them: a spec using one gets a one-line pointer. */
const RETIRED_NAMES: Readonly<Record<string, string>> = {
  regular: "random-regular",
  mycielski: "mycielski-chain (iterates from K2) or mycielski-of (of a given graph)",
  blowup: "blow-up",
  union: "disjoint-union",
  induced: "induced-subgraph",
  "delete-edges": "delete-random-edges",
};

/** What replaced a retired family name (e.g. "regular" → "random-regular"), or undefined. */
export function renamedFamily(name: string): string | undefined {
  return Object.prototype.hasOwnProperty.call(RETIRED_NAMES, name) ? RETIRED_NAMES[name] : undefined;
}

/** The one-line error for a name that denotes no family. */
export function unknownFamily(name: string): InputError {
  const now = renamedFamily(name);
  return new InputError(now === undefined ? `unknown family ${echo(name)} (run halfplus families for the list)` : `unknown family ${echo(name)}: it is now called ${now}`);
}

export interface FamilyResolver {
  familyWithInfo(spec: string): FamilyGraph;
  buildFamily(name: string, params?: Params): FamilyGraph;
  predictedSizeOf(spec: string): PredictedSize;
}

/** Spec resolution over the families `find` knows (by name or alias). */
export function familyResolver(find: (name: string) => FamilyDefinition | undefined): FamilyResolver {
  /**
   * One resolution of a spec and everything nested in it: each nested spec is parsed and sized once
   * (re-parsing at every level made deep nesting cubic in the depth).
   */
  interface Resolution {
    sizes: Map<string, PredictedSize>;
    context: SizeContext;
  }

  function newResolution(): Resolution {
    const res: Resolution = { sizes: new Map(), context: { predictedSizeOf: (spec) => predictedSizeIn(spec, res) } };
    return res;
  }

  function predictedSizeIn(spec: string, res: Resolution): PredictedSize {
    let size = res.sizes.get(spec);
    if (size === undefined) {
      const raw = parseRawSpec(spec);
      const def = lookup(raw.name);
      size = def.predictedSize(resolveParams(def, raw.values).params, res.context);
      res.sizes.set(spec, size);
    }
    return size;
  }

  function lookup(name: string): FamilyDefinition {
    const def = find(name);
    if (def === undefined) throw unknownFamily(name);
    return def;
  }

  function buildResolved(def: FamilyDefinition, params: Params, defaulted: string[], usedName: string, res: Resolution): FamilyGraph {
    const size = def.predictedSize(params, res.context);
    const spec = formatSpec(def, params);
    checkEdgeLimit(spec, size.m, size.n);
    const graphSeed = def.random ? (params.seed as number) : null;
    const notes: string[] = [];
    if (usedName !== def.name) notes.push(`${usedName} is another name for ${def.name}`);
    if (def.random && defaulted.includes("seed")) notes.push("no seed given: using graph seed 0");
    const graph = def.build(params, { rng: new Rng(graphSeed ?? 0), resolve: (nested) => familyIn(nested, res).graph, note: (msg) => notes.push(msg) });
    return { graph, spec, family: def.name, params, graphSeed, notes };
  }

  function familyIn(spec: string, res: Resolution): FamilyGraph {
    const raw = parseRawSpec(spec);
    const def = lookup(raw.name);
    const { params, defaulted } = resolveParams(def, raw.values);
    return buildResolved(def, params, defaulted, raw.name, res);
  }

  return {
    familyWithInfo: (spec) => familyIn(spec, newResolution()),
    buildFamily(name, params = {}) {
      const def = lookup(name);
      const r = resolveParams(def, params);
      return buildResolved(def, r.params, r.defaulted, name, newResolution());
    },
    predictedSizeOf: (spec) => predictedSizeIn(spec, newResolution()),
  };
}
