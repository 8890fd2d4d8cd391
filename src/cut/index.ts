export * from "./evaluate.js";
export * from "./types.js";
