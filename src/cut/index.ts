// Max cut, one sub-folder per job: exact search, heuristic search, the relaxation and its
// certificates, the bracket that combines them into one checkable record, and constructive cuts
// that follow a proof (the decomposition cut).
export * from "./types.js";
export * from "./positive-weights.js";
export * from "./exact/index.js";
export * from "./heuristic/index.js";
export * from "./relaxation/index.js";
export * from "./tree/index.js";
export * from "./bracket/index.js";
export * from "./decomposition/index.js";
export * from "./account/index.js";
