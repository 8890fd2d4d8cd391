// Figures as data (plotly { data, layout }), our palette and typography, and their exporters.
export * from "./types.js";
export * from "./colour.js";
export * from "./palette.js";
export * from "./tex.js";
export { axis, baseLayout, emptyNote, shortNumber } from "./theme.js";
export { logSpaced, conjectureConstant } from "./curves.js";
export * from "./figures/index.js";
export * from "./export/index.js";
