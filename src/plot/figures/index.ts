// The five figure builders: each takes rows (or fitted exponents) and options and returns a plain
// plotly figure { data, layout }.
export * from "./surplus-scaling.js";
export * from "./normalised-ratio.js";
export * from "./exponents.js";
export * from "./bound-tightness.js";
export * from "./degree-distribution.js";
export * from "./hunt-frontier.js";
export { barsFromEnds } from "./points.js";
