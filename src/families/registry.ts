// The family registry: looks a spec up, validates it, guards memory, and builds the graph
// with a PRNG seeded from the spec. `family("kneser:n=8,k=3")` is the one entry point.

import { InputError } from "../errors.js";
import type { Graph } from "../graph/graph.js";
import { Rng } from "../random/prng.js";
import { RANDOM_FAMILIES } from "./catalog-random.js";
import { STRUCTURED_FAMILIES } from "./catalog-structured.js";
import { checkEdgeLimit } from "./limits.js";
import { formatSpec, parseRawSpec, resolveParams } from "./spec.js";
import type { ExpectedShape, FamilyDefinition, FamilyGraph, Params, ShapeContext } from "./types.js";

export { MAX_FAMILY_EDGES } from "./limits.js";

const ALL: FamilyDefinition[] = [...STRUCTURED_FAMILIES, ...RANDOM_FAMILIES];
const BY_NAME = new Map<string, FamilyDefinition>();
for (const def of ALL) {
  if (BY_NAME.has(def.name)) throw new Error(`family ${def.name} registered twice`);
  BY_NAME.set(def.name, def);
}

/** Predicted shape of a spec without building it (operations ask this of their nested specs). */
export function expectedShape(spec: string): ExpectedShape {
  const raw = parseRawSpec(spec);
  const def = lookup(raw.name);
  return def.expected(resolveParams(def, raw.values).params, SHAPES);
}

const SHAPES: ShapeContext = { expectedOf: expectedShape };

export function listFamilies(): readonly FamilyDefinition[] {
  return ALL;
}

export function getFamily(name: string): FamilyDefinition | undefined {
  return BY_NAME.get(name);
}

export function isFamilyName(name: string): boolean {
  return BY_NAME.has(name);
}

function lookup(name: string): FamilyDefinition {
  const def = BY_NAME.get(name);
  if (def === undefined) {
    throw new InputError(`unknown family ${JSON.stringify(name)} (run halfplus families for the list)`);
  }
  return def;
}

function buildResolved(def: FamilyDefinition, params: Params, defaulted: string[]): FamilyGraph {
  const shape = def.expected(params, SHAPES);
  checkEdgeLimit(formatSpec(def, params), shape.m, shape.n);
  const seed = def.random ? (params.seed as number) : null;
  const notes: string[] = [];
  if (def.random && defaulted.includes("seed")) notes.push("no seed given: using seed 0");
  const graph = def.build(params, { rng: new Rng(seed ?? 0), resolve: family, note: (msg) => notes.push(msg) });
  return { graph, spec: formatSpec(def, params), family: def.name, params, seed, notes };
}

/** Build a family graph from a spec string, with its canonical spec and notes. */
export function familyWithInfo(spec: string): FamilyGraph {
  const raw = parseRawSpec(spec);
  const def = lookup(raw.name);
  const { params, defaulted } = resolveParams(def, raw.values);
  return buildResolved(def, params, defaulted);
}

/** Build a family graph from typed parameters, e.g. `buildFamily("kneser", { n: 8, k: 3 })`. */
export function buildFamily(name: string, params: Params = {}): FamilyGraph {
  const def = lookup(name);
  const r = resolveParams(def, params);
  return buildResolved(def, r.params, r.defaulted);
}

/** Just the graph: `family("polarity:q=7")`. */
export function family(spec: string): Graph {
  return familyWithInfo(spec).graph;
}
