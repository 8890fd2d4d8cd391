// Graph file formats: graph6, sparse6, edge lists, the benchmark `n m` format, DIMACS; readers and writers.
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
