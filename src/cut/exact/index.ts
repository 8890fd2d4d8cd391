// Exact max cut: Gray-code enumeration, branch and bound with tail bounds, and the front door
// that splits a graph into components and picks between them.
export { exactMaxCut, type ExactMaxCutOptions, type ExactMethod } from "./exact-max-cut.js";
export { grayCodeMaxCut, GRAY_MAX_VERTICES, type GrayOptions } from "./gray-code.js";
export { branchAndBoundMaxCut, type BranchAndBoundOptions, type BranchOrder } from "./branch-and-bound.js";
export { type ExactCutRecord, type ExactOptions, type ExactProgress, type ExactStatus } from "./common.js";
export { closingTolerance, componentSlack, exactSearchSlack, graphSlack, GRAY_RESYNC_STEPS } from "./exact-slack.js";
export { bitmaskMaxCut, bitmaskExactMaxCut, adjacencyMasks, BITMASK_MAX_VERTICES, type BitmaskCutStats } from "./bitmask-max-cut.js";
