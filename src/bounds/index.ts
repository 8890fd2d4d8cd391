// Closed-form max-cut lower bounds (Edwards, the explicit vector method) and their report.
export * from "./types.js";
export * from "./edwards.js";
export * from "./triangle-free.js";
export { resolveVectorSets, type VectorSetOptions, type VectorSets } from "./vector-sets.js";
export * from "./vector-guarantee.js";
export * from "./report.js";
