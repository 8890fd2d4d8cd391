// Where the hunt's chains start, apart from the search so that `halfplus hunt --help` can list the
// choices without loading it.

/** Where chains start: known constructions and process outputs, process outputs only, or the empty graph (filled greedily). */
export type HuntStarts = "references" | "process" | "empty";
export const HUNT_STARTS: readonly HuntStarts[] = ["references", "process", "empty"];
