// Sources: opening what the command line calls a graph (file, stream, family spec) with the
// GraphSource every record keeps, and finding a record's graph again from that source.
export * from "./open.js";
export * from "./resolve.js";
