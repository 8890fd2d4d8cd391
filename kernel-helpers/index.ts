// halfplus/notebook: helpers for TypeScript notebooks (tslab kernel). Each shows one output:
// figures, tables, a bracket card, a graph summary, live sweep progress, a provenance table.
// Imports only the package's public entry point ("halfplus").
export * from "./channel.js";
export * from "./figure.js";
export * from "./sketch-svg.js";
export * from "./table.js";
export * from "./describe.js";
export * from "./bracket-card.js";
export * from "./progress.js";
export * from "./provenance.js";
export * from "./style.js";
