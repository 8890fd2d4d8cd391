// Re-exports of this folder's modules (append one line per module).
export * from "./types.js";
export * from "./graph-size.js";
export * from "./graph6.js";
export * from "./sparse6.js";
export * from "./nauty-line.js";
export * from "./edgelist.js";
export * from "./gset.js";
export * from "./dimacs.js";
export * from "./detect.js";
export * from "./read.js";
export * from "./write.js";
