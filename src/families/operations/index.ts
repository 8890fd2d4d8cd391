// Graph operations as families on nested specs, and their typed functions (a Graph in, a Graph out).
export { complement, complementFamily } from "./complement.js";
export { blowUp, blowUpFamily } from "./blow-up.js";
export { disjointUnion, disjointUnionFamily } from "./disjoint-union.js";
export { inducedSubgraphFamily } from "./induced-subgraph.js";
export { deleteRandomEdges, deleteRandomEdgesFamily } from "./delete-random-edges.js";
