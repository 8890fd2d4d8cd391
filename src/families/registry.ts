// The family registry: looks a spec up, validates it, guards memory, and builds the graph
// with a PRNG seeded from the spec. `family("kneser:n=8,k=3")` is the one entry point.

import { InputError, echo } from "../errors.js";
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

/**
 * One resolution of a spec and everything nested in it: each nested spec is parsed and sized once
 * (re-parsing at every level made deep nesting cubic in the depth).
 */
interface Resolution {
  shapes: Map<string, ExpectedShape>;
  context: ShapeContext;
}

function newResolution(): Resolution {
  const res: Resolution = { shapes: new Map(), context: { expectedOf: (spec) => expectedShapeIn(spec, res) } };
  return res;
}

function expectedShapeIn(spec: string, res: Resolution): ExpectedShape {
  let shape = res.shapes.get(spec);
  if (shape === undefined) {
    const raw = parseRawSpec(spec);
    const def = lookup(raw.name);
    shape = def.expected(resolveParams(def, raw.values).params, res.context);
    res.shapes.set(spec, shape);
  }
  return shape;
}

/** Predicted shape of a spec without building it (operations ask this of their nested specs). */
export function expectedShape(spec: string): ExpectedShape {
  return expectedShapeIn(spec, newResolution());
}

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
    throw new InputError(`unknown family ${echo(name)} (run halfplus families for the list)`);
  }
  return def;
}

function buildResolved(def: FamilyDefinition, params: Params, defaulted: string[], res: Resolution): FamilyGraph {
  const shape = def.expected(params, res.context);
  checkEdgeLimit(formatSpec(def, params), shape.m, shape.n);
  const seed = def.random ? (params.seed as number) : null;
  const notes: string[] = [];
  if (def.random && defaulted.includes("seed")) notes.push("no seed given: using seed 0");
  const graph = def.build(params, { rng: new Rng(seed ?? 0), resolve: (nested) => familyIn(nested, res).graph, note: (msg) => notes.push(msg) });
  return { graph, spec: formatSpec(def, params), family: def.name, params, seed, notes };
}

function familyIn(spec: string, res: Resolution): FamilyGraph {
  const raw = parseRawSpec(spec);
  const def = lookup(raw.name);
  const { params, defaulted } = resolveParams(def, raw.values);
  return buildResolved(def, params, defaulted, res);
}

/** Build a family graph from a spec string, with its canonical spec and notes. */
export function familyWithInfo(spec: string): FamilyGraph {
  return familyIn(spec, newResolution());
}

/** Build a family graph from typed parameters, e.g. `buildFamily("kneser", { n: 8, k: 3 })`. */
export function buildFamily(name: string, params: Params = {}): FamilyGraph {
  const def = lookup(name);
  const r = resolveParams(def, params);
  return buildResolved(def, r.params, r.defaulted, newResolution());
}

/** Just the graph: `family("polarity:q=7")`. */
export function family(spec: string): Graph {
  return familyWithInfo(spec).graph;
}
