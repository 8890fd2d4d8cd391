// The family registry: looks a spec up (aliases included), validates it, guards memory, and builds
// the graph with a PRNG seeded from the spec. `family("kneser:n=8,k=3")` is the one entry point.

import { InputError, echo } from "../errors.js";
import type { Graph } from "../graph/graph.js";
import { Rng } from "../random/prng.js";
import { OPERATION_FAMILIES } from "./catalog-operations.js";
import { RANDOM_FAMILIES } from "./catalog-random.js";
import { STRUCTURED_FAMILIES } from "./catalog-structured.js";
import { checkEdgeLimit } from "./limits.js";
import { formatSpec, parseRawSpec, resolveParams } from "./spec.js";
import type { FamilyDefinition, FamilyGraph, Params, PredictedSize, SizeContext } from "./types.js";

export { MAX_FAMILY_EDGES } from "./limits.js";

const ALL: readonly FamilyDefinition[] = [...STRUCTURED_FAMILIES, ...RANDOM_FAMILIES, ...OPERATION_FAMILIES];
const BY_NAME = new Map<string, FamilyDefinition>();
for (const def of ALL) {
  for (const name of [def.name, ...(def.aliases ?? [])]) {
    if (BY_NAME.has(name)) throw new Error(`family name ${name} registered twice`);
    BY_NAME.set(name, def);
  }
}

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

/** Predicted size of a spec without building it (operations ask this of their nested specs). */
export function predictedSizeOf(spec: string): PredictedSize {
  return predictedSizeIn(spec, newResolution());
}

/** Every family, each once, in catalogue order. */
export function listFamilies(): readonly FamilyDefinition[] {
  return ALL;
}

/** The family a spec name (or one of its aliases) denotes, or undefined. */
export function getFamily(name: string): FamilyDefinition | undefined {
  return BY_NAME.get(name);
}

function lookup(name: string): FamilyDefinition {
  const def = BY_NAME.get(name);
  if (def === undefined) {
    const now = renamedFamily(name);
    throw new InputError(
      now === undefined ? `unknown family ${echo(name)} (run halfplus families for the list)` : `unknown family ${echo(name)}: it is now called ${now}`,
    );
  }
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

/** Build a family graph from a spec string, with its canonical spec and notes. */
export function familyWithInfo(spec: string): FamilyGraph {
  return familyIn(spec, newResolution());
}

/** Build a family graph from parameters by name, e.g. `buildFamily("kneser", { n: 8, k: 3 })`. */
export function buildFamily(name: string, params: Params = {}): FamilyGraph {
  const def = lookup(name);
  const r = resolveParams(def, params);
  return buildResolved(def, r.params, r.defaulted, name, newResolution());
}

/** Just the graph: `family("polarity:q=7")`. */
export function family(spec: string): Graph {
  return familyWithInfo(spec).graph;
}
