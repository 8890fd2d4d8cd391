// Linear algebra for certified bounds: symmetric operators of a graph, eigen-solvers (dense and
// Lanczos), extreme eigenvalues of a graph's matrices, and a floating-point PSD proof. The vector
// kernels and rounding constants stay internal.
export * from "./operator.js";
export { symmetricEigen, type DenseEigen } from "./dense-eigen.js";
export { lanczosExtreme, rayleighResidual, type EigenEnd, type LanczosOptions, type LanczosResult } from "./lanczos.js";
export * from "./spectrum.js";
export { provePsdByCholesky, type PsdProof } from "./cholesky.js";
