// Limits on what input may cost: the memory budget, input size caps, strict JSON for records.
export * from "./memory.js";
export * from "./input.js";
export * from "./strict-json.js";
