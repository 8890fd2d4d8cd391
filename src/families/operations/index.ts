// Graph operations as families on nested specs, and their typed functions.
export * from "./nested-shape.js";
export * from "./complement.js";
export * from "./blow-up.js";
export * from "./disjoint-union.js";
export * from "./induced-subgraph.js";
export * from "./delete-edges.js";
