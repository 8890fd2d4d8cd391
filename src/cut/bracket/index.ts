// The max-cut bracket: the record it writes, the run that fills it, and the independent check.
export * from "./record.js";
export * from "./bracket.js";
export { parseBracketRecord, verifyBracket, type BracketCheck, type BracketVerdict, type BracketVerifyOptions } from "./verify.js";
export * from "./read-records.js";
