// The family registry: every family, looked up by name or alias, and the spec entry points over
// them (./resolver.ts does the resolving). `family("kneser:n=8,k=3")` is the one entry point. The
// command line resolves specs through ./family-loaders.ts instead, which loads only the families a
// spec names.

import type { Graph } from "../graph/graph.js";
import { OPERATION_FAMILIES } from "./catalog-operations.js";
import { RANDOM_FAMILIES } from "./catalog-random.js";
import { STRUCTURED_FAMILIES } from "./catalog-structured.js";
import { familyResolver } from "./resolver.js";
import type { FamilyDefinition, FamilyGraph, Params, PredictedSize } from "./types.js";

export { MAX_FAMILY_EDGES } from "./limits.js";
export { renamedFamily } from "./resolver.js";

const ALL: readonly FamilyDefinition[] = [...STRUCTURED_FAMILIES, ...RANDOM_FAMILIES, ...OPERATION_FAMILIES];
const BY_NAME = new Map<string, FamilyDefinition>();
for (const def of ALL) {
  for (const name of [def.name, ...(def.aliases ?? [])]) {
    if (BY_NAME.has(name)) throw new Error(`family name ${name} registered twice`);
    BY_NAME.set(name, def);
  }
}

const resolver = familyResolver((name) => BY_NAME.get(name));

/** Predicted size of a spec without building it (operations ask this of their nested specs). */
export function predictedSizeOf(spec: string): PredictedSize {
  return resolver.predictedSizeOf(spec);
}

/** Every family, each once, in catalogue order. */
export function listFamilies(): readonly FamilyDefinition[] {
  return ALL;
}

/** The family a spec name (or one of its aliases) denotes, or undefined. */
export function getFamily(name: string): FamilyDefinition | undefined {
  return BY_NAME.get(name);
}

/** Build a family graph from a spec string, with its canonical spec and notes. */
export function familyWithInfo(spec: string): FamilyGraph {
  return resolver.familyWithInfo(spec);
}

/** Build a family graph from parameters by name, e.g. `buildFamily("kneser", { n: 8, k: 3 })`. */
export function buildFamily(name: string, params: Params = {}): FamilyGraph {
  return resolver.buildFamily(name, params);
}

/** Just the graph: `family("polarity:q=7")`. */
export function family(spec: string): Graph {
  return familyWithInfo(spec).graph;
}
