// Graph file formats: graph6, sparse6, edge lists, the benchmark `n m` format ("gset"), DIMACS;
// detection, lazy streaming readers and one writer entry point. Byte-level decoders stay internal.
export { GRAPH_FORMATS, type GraphFormat, type ReadOptions, type LoadedGraph, type TextParseOptions, type Where } from "./types.js";
export { encodeGraphSize, decodeGraphSize } from "./graph-size.js";
export { parseGraph6, encodeGraph6 } from "./graph6.js";
export { parseSparse6, encodeSparse6 } from "./sparse6.js";
export { parseEdgeList, writeEdgeList, type EdgeListOptions } from "./edgelist.js";
export { parseGset, writeGset } from "./gset.js";
export { parseDimacs, writeDimacs } from "./dimacs.js";
export { detectFormat, formatFromExtension } from "./detect.js";
export { readGraphs, readGraphFile, exactlyOneGraph, type GraphInput } from "./read.js";
export { writeGraph } from "./write.js";
