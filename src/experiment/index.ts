// Sweeps and the results store: plans, the worker pool, the SQLite store behind a small
// interface, export, import, merge, and rows for the fits and figures (their shapes in rows.ts).
export * from "./columns.js";
export * from "./store.js";
export { openStore, isStoreFile, DEFAULT_STORE } from "./sqlite-store.js";
export * from "./plan.js";
export { parseShard, jobKey, shardSize, type Shard } from "./jobs.js";
export { budgetSeconds, jobCost, planJobCosts, planSlices, predictedJobSeconds, sliceByCost, WORK_UNITS_PER_SECOND, type PlanSlices } from "./shards.js";
export { EFFORTS, EVALUATOR_NAMES, WORK_BUDGETS_AVAILABLE, type BracketSettings, type Effort } from "./job.js";
export * from "./rows.js";
export * from "./sweep.js";
export * from "./progress.js";
export * from "./export.js";
export * from "./export-tables.js";
export * from "./import.js";
export * from "./merge.js";
export { cellDisagreements, extensionFailure, mergeCensuses, mergeFrontier, type CensusMergeReport, type FrontierMergeReport } from "./merge-tables.js";
export * from "./fit-rows.js";
export * from "./records.js";
export { verifyCensusTables, verifyFrontierRow, verifyFrontierTable, type CensusVerdict, type FrontierVerdict } from "./verify-tables.js";
export { packPartition, unpackPartition } from "./witness.js";
export { halfplusVersion } from "./provenance.js";
export * from "./cluster/index.js";
export * from "./census/index.js";
export type { HuntFrontierRow, HuntFrontierFilter } from "./hunt-store.js";
