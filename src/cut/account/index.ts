// The per-graph account of the surplus arguments behind `halfplus bounds`: each evaluator against
// the bracket, and the step of its argument that gives most away.
export {
  boundsAccount,
  ACCOUNT_EVALUATORS,
  BOUNDS_ACCOUNT_KIND,
  BOUNDS_ACCOUNT_VERSION,
  type AccountEvaluator,
  type AccountRow,
  type AccountStep,
  type AccountStepName,
  type BoundsAccountOptions,
  type BoundsAccountRecord,
  type VectorChoiceCuts,
} from "./bounds-account.js";
