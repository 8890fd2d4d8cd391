// The Goemans–Williamson relaxation and what makes its bounds trustworthy: the mixing-method
// solver, dual certificates (established and re-checked), the eigenvalue bound, SDPA export.
export { dualBoundValue } from "./dual-bound.js";
export * from "./sdp-mixing.js";
export * from "./certificate.js";
export * from "./sdp-bound.js";
export * from "./eigenvalue-bound.js";
export * from "./sdpa.js";
export * from "./triangle-dual.js";
export * from "./triangle-sdp.js";
