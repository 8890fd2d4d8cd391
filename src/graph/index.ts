export * from "./graph.js";
export * from "./builder.js";
export * from "./graphology.js";
