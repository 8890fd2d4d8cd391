// One exit status of `halfplus verify`, apart from verify itself so that `halfplus verify --help`
// can show it without loading the checks.

/** `halfplus verify`'s exit status when every check passed but an upper end is an estimate (0 with --accept-estimates). */
export const EXIT_ESTIMATE = 3;
