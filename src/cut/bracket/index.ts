// The max-cut bracket: the record it writes, the run that fills it, and the independent check.
export * from "./record.js";
export * from "./bracket.js";
export { BracketRunner, runBracket, type RunningBracket } from "./bracket-runner.js";
export { EXIT_ESTIMATE, parseBracketRecord, verifyBracket, verifyExitStatus, type BracketCheck, type BracketVerdict, type BracketVerifyOptions, type VerdictWord } from "./verify.js";
export * from "./read-records.js";
export { BUDGET_KINDS, type BracketBudget, type BudgetKind, type BudgetStage } from "./budget.js";
export { workCosts, type WorkCosts } from "./work-units.js";
