// The extremal search over H-free graphs (halfplus hunt): moves that keep H-freeness, warm-started
// SDP screens, certified brackets for the frontier, known constructions as starts and references.
export * from "./mutable-graph.js";
export * from "./pattern-through-edge.js";
export * from "./objective.js";
export * from "./constructions.js";
export * from "./evaluate.js";
export * from "./search.js";
