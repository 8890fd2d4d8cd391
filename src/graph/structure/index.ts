// Structure checks: degrees, components, bipartiteness, degeneracy, counts, subgraph search,
// strong regularity, and the summary record behind `halfplus graph`. (Spectra are in src/linalg.)
export * from "./degrees.js";
export * from "./components.js";
export * from "./bipartite.js";
export * from "./degeneracy.js";
export { countTriangles, type TriangleCount } from "./triangles.js";
export { countFourCycles, type FourCycleCount } from "./four-cycles.js";
export { findClique, MAX_CLIQUE_ORDER, type SearchBudget, type CliqueSearchResult } from "./cliques.js";
export { findCycle, MAX_CYCLE_LENGTH, type CycleSearchResult } from "./cycles.js";
export * from "./girth.js";
export { findSubgraph, MAX_PATTERN_VERTICES, type SubgraphMethod, type SubgraphSearchOptions, type SubgraphSearchResult } from "./subgraph.js";
export * from "./patterns.js";
export { symmetryConditions } from "./symmetry.js";
export { findCompleteBipartite, type CompleteBipartiteResult } from "./complete-bipartite.js";
export * from "./strongly-regular.js";
export * from "./describe.js";
export * from "./summary-record.js";
export { listAutomorphisms, isAutomorphism, type AutomorphismList, type AutomorphismOptions } from "./automorphisms.js";
