// The census's defaults, apart from the census run so that `halfplus census --help` can show them
// without loading it.

/** The census name when none is given. */
export const DEFAULT_CENSUS = "census";
/** Witness graphs kept per (n, m) when not told otherwise. */
export const DEFAULT_WITNESS_LIMIT = 8;
/** Graphs per batch: at n = 12 about 20–40 ms of work, so a kill loses little and messages stay few. */
export const DEFAULT_BATCH_GRAPHS = 2000;
