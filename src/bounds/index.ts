// Closed-form max-cut lower bounds (Edwards, the triangle-free bound, the explicit vector method's
// guarantee, its few-triangles form and its best choice found) and their report against the best cut.
export { type LowerBoundRecord } from "./types.js";
export * from "./edwards.js";
export * from "./triangle-free.js";
export { resolveVectorSets, type VectorSetOptions, type VectorSets } from "./vector-sets.js";
export { vectorMethodGuarantee, type VectorGuaranteeRecord } from "./vector-guarantee.js";
export { fewTrianglesBound, type FewTrianglesRecord, type FewTrianglesRegime } from "./few-triangles.js";
export { optimiseVectorChoice, vectorOptimisedBound, vectorChoiceOptions, type VectorChoiceOptions, type VectorChoiceRecord, type VectorChoiceStart } from "./vector-choice.js";
export * from "./report.js";
