// The relaxation tree's choices (node bound, branching rule). A module of its own (no imports) so
// that the command line can list them without loading the search.

/** Which relaxation bounds the nodes: the plain SDP, or the SDP with triangle inequalities. */
export type TreeRelaxation = "plain" | "triangles";
export const TREE_RELAXATIONS: readonly TreeRelaxation[] = ["plain", "triangles"];

/** Which free vertex a node branches on (see `TreeSearchOptions.branching`). */
export type TreeBranching = "auto" | "least-decided" | "most-decided";
export const TREE_BRANCHINGS: readonly TreeBranching[] = ["auto", "least-decided", "most-decided"];
