export * from "./types.js";
export * from "./spec.js";
export * from "./registry.js";
export { completeGraph } from "./complete.js";
