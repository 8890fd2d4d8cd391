// The Gray-code search's size limit, apart from the search so that `halfplus bounds --help` can show
// it without loading it.

/** Largest n the Gray-code enumeration accepts (2^33 patterns: tens of seconds without pruning). */
export const GRAY_MAX_VERTICES = 34;
