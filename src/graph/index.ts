// The graph core: the CSR Graph, its one validating builder, and the facts every layer above
// reads off a graph (cut value, weights, hash, induced subgraphs). Formats, records and structure
// checks are the sub-folders, re-exported by src/index.ts.
export * from "./graph.js";
export * from "./builder.js";
export * from "./graphology.js";
export { cutValue, surplusOf, checkPartition, type Partition } from "./cut-value.js";
export * from "./weights.js";
export * from "./hash.js";
export * from "./induced.js";
