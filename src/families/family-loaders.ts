// Each family name and alias with a loader of its one module, so that the command line resolves a
// spec by loading only the families it names (nested specs included): the registry
// (./registry.ts) imports every family module, about 60 modules and 0.1 CPU-seconds that
// `halfplus cut petersen` does not need. `halfplus families` and the library still use the
// registry; test/families-loaders.test.ts checks that this table and the registry name the same
// families, alias for alias, and load the same definitions.

import { parseRawSpec, resolveParams } from "./spec.js";
import { familyResolver, unknownFamily } from "./resolver.js";
import type { FamilyDefinition, FamilyGraph } from "./types.js";

const LOADERS: Readonly<Record<string, () => Promise<FamilyDefinition>>> = {
  complete: async () => (await import("./complete.js")).completeFamily,
  "complete-bipartite": async () => (await import("./complete-multipartite.js")).completeBipartiteFamily,
  "complete-multipartite": async () => (await import("./complete-multipartite.js")).completeMultipartiteFamily,
  cycle: async () => (await import("./circulant.js")).cycleFamily,
  path: async () => (await import("./path.js")).pathFamily,
  hypercube: async () => (await import("./cayley-gf2.js")).hypercubeFamily,
  circulant: async () => (await import("./circulant.js")).circulantFamily,
  "cayley-zn": async () => (await import("./circulant.js")).circulantFamily,
  "cayley-gf2": async () => (await import("./cayley-gf2.js")).cayleyGf2Family,
  "generalized-petersen": async () => (await import("./generalized-petersen.js")).generalizedPetersenFamily,
  "generalised-petersen": async () => (await import("./generalized-petersen.js")).generalizedPetersenFamily,
  polarity: async () => (await import("./polarity.js")).polarityFamily,
  "projective-plane": async () => (await import("./projective-plane.js")).projectivePlaneFamily,
  "norm-graph": async () => (await import("./norm-graph.js")).normGraphFamily,
  kneser: async () => (await import("./kneser.js")).kneserFamily,
  paley: async () => (await import("./paley.js")).paleyFamily,
  andrasfai: async () => (await import("./circulant.js")).andrasfaiFamily,
  "mycielski-chain": async () => (await import("./mycielski.js")).mycielskiChainFamily,
  petersen: async () => (await import("./named/petersen.js")).petersenFamily,
  dodecahedron: async () => (await import("./named/petersen.js")).dodecahedronFamily,
  heawood: async () => (await import("./named/heawood.js")).heawoodFamily,
  clebsch: async () => (await import("./named/clebsch.js")).clebschFamily,
  "hoffman-singleton": async () => (await import("./named/hoffman-singleton.js")).hoffmanSingletonFamily,
  "higman-sims": async () => (await import("./named/higman-sims.js")).higmanSimsFamily,
  grotzsch: async () => (await import("./named/grotzsch.js")).grotzschFamily,
  chvatal: async () => (await import("./named/chvatal.js")).chvatalFamily,
  gnp: async () => (await import("./gnp.js")).gnpFamily,
  gnm: async () => (await import("./gnm.js")).gnmFamily,
  "bipartite-gnp": async () => (await import("./bipartite-gnp.js")).bipartiteGnpFamily,
  "random-regular": async () => (await import("./random-regular.js")).randomRegularFamily,
  "hfree-process": async () => (await import("./hfree-process.js")).hfreeProcessFamily,
  "blow-up": async () => (await import("./operations/blow-up.js")).blowUpFamily,
  "disjoint-union": async () => (await import("./operations/disjoint-union.js")).disjointUnionFamily,
  complement: async () => (await import("./operations/complement.js")).complementFamily,
  "induced-subgraph": async () => (await import("./operations/induced-subgraph.js")).inducedSubgraphFamily,
  "mycielski-of": async () => (await import("./mycielski.js")).mycielskiOfFamily,
  "delete-random-edges": async () => (await import("./operations/delete-random-edges.js")).deleteRandomEdgesFamily,
};

/** Is `name` a family name or alias (no module is loaded to answer)? */
export function isFamilyName(name: string): boolean {
  return Object.prototype.hasOwnProperty.call(LOADERS, name);
}

/** Every name and alias the table knows, in catalogue order. */
export function loadableFamilyNames(): readonly string[] {
  return Object.keys(LOADERS);
}

/** The definition of one family (by name or alias), loading its module alone; a one-line InputError for an unknown name. */
export async function loadFamilyDefinition(name: string): Promise<FamilyDefinition> {
  if (!isFamilyName(name)) throw unknownFamily(name);
  return LOADERS[name]();
}

/**
 * Load the family of `spec` and of every spec nested in it (operations' "spec" and "spec-list"
 * parameters), checking parameters on the way as the registry does, into `into`.
 */
async function loadSpecFamilies(spec: string, into: Map<string, FamilyDefinition>): Promise<void> {
  const raw = parseRawSpec(spec);
  let def = into.get(raw.name);
  if (def === undefined) into.set(raw.name, (def = await loadFamilyDefinition(raw.name)));
  const { params } = resolveParams(def, raw.values);
  for (const p of def.params) {
    const v = params[p.name];
    if (p.type === "spec") await loadSpecFamilies(v as string, into);
    else if (p.type === "spec-list") for (const s of v as string[]) await loadSpecFamilies(s, into);
  }
}

/** `familyWithInfo` of the registry, loading only the families the spec names. Same graph, spec, notes and errors. */
export async function loadFamilyWithInfo(spec: string): Promise<FamilyGraph> {
  const loaded = new Map<string, FamilyDefinition>();
  await loadSpecFamilies(spec, loaded);
  return familyResolver((name) => loaded.get(name)).familyWithInfo(spec);
}
