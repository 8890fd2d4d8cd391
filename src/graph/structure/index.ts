// Structure checks: degrees, components, bipartiteness, degeneracy, counts, subgraph search,
// strong regularity, and the summary record behind `halfplus graph`. (Spectra are in src/linalg.)
export * from "./degrees.js";
export * from "./components.js";
export * from "./bipartite.js";
export * from "./degeneracy.js";
export * from "./triangles.js";
export * from "./four-cycles.js";
export * from "./cliques.js";
export * from "./cycles.js";
export * from "./girth.js";
export * from "./subgraph.js";
export * from "./patterns.js";
export * from "./describe.js";
export * from "./symmetry.js";
export * from "./complete-bipartite.js";
export * from "./pattern-shape.js";
export * from "./strongly-regular.js";
export * from "./summary-record.js";
