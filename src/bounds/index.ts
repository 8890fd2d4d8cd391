// Closed-form max-cut lower bounds (Edwards, the triangle-free bound, the explicit vector method's
// guarantee) and their report against the best cut found.
export { type LowerBoundRecord } from "./types.js";
export * from "./edwards.js";
export * from "./triangle-free.js";
export { resolveVectorSets, type VectorSetOptions, type VectorSets } from "./vector-sets.js";
export { vectorMethodGuarantee, type VectorGuaranteeRecord } from "./vector-guarantee.js";
export * from "./report.js";
