// The bracket's default and largest budgets. A module of its own (no imports) so that the command
// line can show and check them without loading the solvers.

/** Time budget per graph when neither seconds nor work is given. */
export const DEFAULT_BRACKET_SECONDS = 10;

/** Largest work budget accepted (units; 2^53 keeps every sum of units exact). */
export const MAX_BRACKET_WORK = Number.MAX_SAFE_INTEGER;
