// Linear algebra for certified bounds: operators, vector kernels, eigen-solvers, a PSD proof.
export * from "./rounding.js";
export * from "./vector.js";
export * from "./operator.js";
export * from "./dense-eigen.js";
export * from "./lanczos.js";
export * from "./cholesky.js";
