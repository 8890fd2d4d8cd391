// Re-exports of this folder's modules (append one line per module).
export * from "./rounding.js";
export * from "./vector.js";
export * from "./operator.js";
export * from "./dense-eigen.js";
export * from "./lanczos.js";
export * from "./cholesky.js";
