// Exact max cut bounded by the SDP relaxation (plain or with triangle inequalities): the search and
// the reduced problem of a node.
export * from "./reduced-graph.js";
export * from "./relaxation-tree.js";
export * from "./tree-codec.js";
