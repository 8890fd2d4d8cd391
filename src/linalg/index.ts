// Linear algebra for certified bounds: symmetric operators of a graph, eigen-solvers (dense and
// Lanczos), extreme eigenvalues of a graph's matrices, floating-point PSD proofs (dense and in a sparse
// envelope) and a probable bound on the largest eigenvalue. The vector
// kernels and rounding constants stay internal.
export * from "./operator.js";
export { symmetricEigen, type DenseEigen } from "./dense-eigen.js";
export { lanczosExtreme, rayleighResidual, type EigenEnd, type LanczosOptions, type LanczosResult } from "./lanczos.js";
export * from "./spectrum.js";
export { provePsdByCholesky, certifyCholesky, type CholeskyProofInput, type PsdProof } from "./cholesky.js";
export { envelopePlan, reverseCuthillMcKee, provePsdByEnvelopeCholesky, type EnvelopePlan } from "./envelope-cholesky.js";
export { probableTopBound, probableFilterDegree, type ProbableTopBound, type ProbableTopOptions } from "./probable-top-bound.js";
