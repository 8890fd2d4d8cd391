// Where results go when no store is named, apart from the store itself so that `--help` can show
// it without loading SQLite.

/** Where `halfplus sweep` writes when no --store is given. */
export const DEFAULT_STORE = "results/halfplus.db";
