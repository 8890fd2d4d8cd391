// The public API, in layer order (each layer imports only those above it in this list): each
// folder's index re-exports its public modules, so this file is the map.
export * from "./errors.js";
export * from "./decimal.js";
export * from "./limits/index.js";
export * from "./random/index.js";
export * from "./graph/index.js";
export * from "./graph/formats/index.js";
export * from "./graph/record/index.js";
export * from "./graph/structure/index.js";
export * from "./linalg/index.js";
export * from "./families/index.js";
export * from "./bounds/index.js";
export * from "./cut/index.js";
export * from "./sources/index.js";
export * from "./hunt/index.js";
export * from "./experiment/index.js";
export * from "./fit/index.js";
export * from "./plot/index.js";
