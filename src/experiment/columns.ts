// The columns of a stored result row, declared once: the store creates its table from this list
// (and adds columns that an older store lacks), export writes them in this order, merge compares
// the ones that describe the result. Adding a column means adding one entry here and filling it
// in the job adapter (job.ts).

/** How a value is kept: booleans are stored as 0/1 and exported as true/false. */
export type ColumnType = "integer" | "real" | "text" | "boolean" | "blob";

/**
 * identity: what was run (part of or derived from the key); structure: the graph's measures;
 * bracket: the max-cut bracket; bound: a closed-form lower bound on the surplus; budget: which
 * budget governed and the work it used; timing: wall-clock fields, which differ run to run;
 * provenance: where and with what the row was made; evidence: what re-checks the row.
 */
export type ColumnGroup = "identity" | "structure" | "bracket" | "bound" | "budget" | "timing" | "provenance" | "evidence";

export interface ColumnSpec {
  name: string;
  type: ColumnType;
  group: ColumnGroup;
  description: string;
}

export const COLUMNS: readonly ColumnSpec[] = [
  // identity
  { name: "key", type: "text", group: "identity", description: "graph | solverSeed | bracket settings | halfplus version: one row per key" },
  { name: "origin", type: "text", group: "identity", description: "sweep (computed here) or import (measured elsewhere)" },
  { name: "family", type: "text", group: "identity", description: "the plan's family label (the family name unless the plan gives a label)" },
  { name: "graph", type: "text", group: "identity", description: "canonical family spec, or the graph hash for graphs read from files" },
  { name: "spec", type: "text", group: "identity", description: "canonical family spec (null for file graphs)" },
  { name: "params", type: "text", group: "identity", description: "family parameters as a JSON object (null for file graphs)" },
  { name: "graphSeed", type: "integer", group: "identity", description: "seed of a random family (null otherwise)" },
  { name: "sourcePath", type: "text", group: "identity", description: "graph file the graph was read from, as the plan names it (relative to the plan's folder)" },
  { name: "sourcePosition", type: "integer", group: "identity", description: "position of the graph in its file, from 1" },
  { name: "sourceFormat", type: "text", group: "identity", description: "format of that file" },
  { name: "graphHash", type: "text", group: "identity", description: "SHA-256 of the edge list (as in bracket records)" },
  { name: "solverSeed", type: "integer", group: "identity", description: "seed of the randomised solvers" },
  { name: "effort", type: "text", group: "identity", description: "bracket effort: auto, exact, heuristic, quick or deep" },
  { name: "budgetSeconds", type: "real", group: "identity", description: "wall-clock budget given to the bracket" },
  { name: "workLimit", type: "integer", group: "identity", description: "deterministic work budget given to the bracket (null: none)" },
  { name: "version", type: "text", group: "identity", description: "halfplus version that computed the row" },
  // structure
  { name: "n", type: "integer", group: "structure", description: "vertices" },
  { name: "m", type: "integer", group: "structure", description: "edges" },
  { name: "totalWeight", type: "real", group: "structure", description: "sum of edge weights (m when unweighted)" },
  { name: "minDegree", type: "integer", group: "structure", description: "smallest degree" },
  { name: "maxDegree", type: "integer", group: "structure", description: "largest degree" },
  { name: "averageDegree", type: "real", group: "structure", description: "2m/n" },
  { name: "degeneracy", type: "integer", group: "structure", description: "largest minimum degree of a subgraph" },
  { name: "triangles", type: "integer", group: "structure", description: "number of triangles" },
  { name: "fourCycles", type: "integer", group: "structure", description: "number of 4-cycles (not necessarily induced)" },
  { name: "girth", type: "integer", group: "structure", description: "length of a shortest cycle (null for a forest)" },
  { name: "bipartite", type: "boolean", group: "structure", description: "2-colourable" },
  { name: "components", type: "integer", group: "structure", description: "connected components" },
  { name: "freeK3", type: "boolean", group: "structure", description: "no triangle" },
  { name: "freeK4", type: "boolean", group: "structure", description: "no K4 (null: search undecided)" },
  { name: "freeC4", type: "boolean", group: "structure", description: "no 4-cycle" },
  { name: "freeC5", type: "boolean", group: "structure", description: "no 5-cycle (null: search undecided)" },
  // bracket
  { name: "lower", type: "real", group: "bracket", description: "best cut found (the witness partition's value)" },
  { name: "upper", type: "real", group: "bracket", description: "certified upper bound on the max cut" },
  { name: "surplusLower", type: "real", group: "bracket", description: "lower − W/2" },
  { name: "surplusUpper", type: "real", group: "bracket", description: "upper − W/2" },
  { name: "exact", type: "boolean", group: "bracket", description: "the bracket is closed by proof" },
  { name: "upperKind", type: "text", group: "bracket", description: "proven, probable or estimate: how the upper end is established" },
  { name: "lowerMethod", type: "text", group: "bracket", description: "method that found the best cut" },
  { name: "upperMethod", type: "text", group: "bracket", description: "method behind the upper bound" },
  { name: "certificateKind", type: "text", group: "bracket", description: "kind of the upper bound's certificate" },
  { name: "sdpUpper", type: "real", group: "bracket", description: "upper bound from the certified SDP dual, when the SDP ran" },
  // closed-form lower bounds on the surplus (src/bounds), one column per evaluator
  { name: "edwardsEdges", type: "real", group: "bound", description: "Edwards (1973) surplus bound (√(8m+1) − 1)/8" },
  { name: "edwardsVertices", type: "real", group: "bound", description: "Edwards (1975) surplus bound (n − c)/4" },
  { name: "triangleFree", type: "real", group: "bound", description: "triangle-free bound (1/2π)Σ√d_i (null when the graph has triangles)" },
  { name: "vectorMethod", type: "real", group: "bound", description: "guarantee of the explicit vector method with V_i = N(i)" },
  { name: "vectorOptimised", type: "real", group: "bound", description: "guarantee of the explicit vector method with the best (V_i, ε_i) found by block coordinate ascent" },
  { name: "fewTriangles", type: "real", group: "bound", description: "few-triangles form of the vector guarantee: uniform ε, εm/π − (3/2)ε²T" },
  { name: "decompositionCut", type: "real", group: "bound", description: "surplus of the decomposition cut for H-free graphs (a cut, re-evaluated)" },
  { name: "decompositionGuarantee", type: "real", group: "bound", description: "sum of the decomposition cut's stage guarantees" },
  // budget
  { name: "budgetKind", type: "text", group: "budget", description: "which budget governed: time, work or none" },
  { name: "workUsed", type: "integer", group: "budget", description: "solver work used (null under a time budget)" },
  // timing
  { name: "seconds", type: "real", group: "timing", description: "wall-clock seconds of the bracket" },
  { name: "startedAt", type: "text", group: "timing", description: "when the job started (ISO 8601, UTC)" },
  // provenance
  { name: "gitCommit", type: "text", group: "provenance", description: "git commit of the halfplus checkout (null outside a checkout)" },
  { name: "nodeVersion", type: "text", group: "provenance", description: "Node.js version" },
  { name: "platform", type: "text", group: "provenance", description: "operating system and architecture" },
  { name: "notes", type: "text", group: "provenance", description: "notes about the graph or the row, as a JSON array" },
  // evidence
  { name: "witness", type: "blob", group: "evidence", description: "the best cut's partition: packed bits, compressed (see witness.ts)" },
  { name: "certificate", type: "blob", group: "evidence", description: "the upper bound's certificate: JSON text, compressed from 1 KB on" },
  { name: "runs", type: "blob", group: "evidence", description: "each method's summary (with its seconds): JSON text, compressed from 1 KB on" },
  { name: "embedded", type: "text", group: "evidence", description: "the graph itself in graph6 or sparse6 (file graphs only)" },
  { name: "budgetStages", type: "blob", group: "evidence", description: "the bracket's work and seconds per stage (its record's budget.stages): JSON text, compressed from 1 KB on" },
];

export type ColumnName = string;
export type CellValue = number | string | null | Uint8Array;
/** A stored row: one value per column name (missing columns read as null). */
export type StoredRow = Record<ColumnName, CellValue>;

const BY_NAME = new Map(COLUMNS.map((c) => [c.name, c]));

export function columnSpec(name: string): ColumnSpec | undefined {
  return BY_NAME.get(name);
}

/** Columns an export writes by default: everything but the evidence and the wall-clock fields. */
export function exportColumns(options: { timing?: boolean } = {}): ColumnSpec[] {
  return COLUMNS.filter((c) => c.group !== "evidence" && (options.timing === true || c.group !== "timing"));
}

/**
 * Columns two rows with the same key must agree on to be the same result (merge, import). Wall-clock
 * fields, provenance and the evidence may differ: two runs can find different optimal partitions.
 */
export function comparedColumns(): ColumnSpec[] {
  return COLUMNS.filter((c) => c.name !== "key" && c.group !== "timing" && c.group !== "provenance" && c.group !== "evidence");
}

/** Position of each column in COLUMNS (rows cross threads and reach SQLite as value arrays in this order). */
export const COLUMN_INDEX: ReadonlyMap<string, number> = new Map(COLUMNS.map((c, i) => [c.name, i]));

/** A row's values in COLUMNS order (missing columns become null); `extra` fields override the row's. */
export function rowValues(row: StoredRow, extra?: StoredRow): CellValue[] {
  const out = new Array<CellValue>(COLUMNS.length);
  for (let i = 0; i < COLUMNS.length; i++) out[i] = row[COLUMNS[i].name] ?? null;
  if (extra !== undefined) for (const k of Object.keys(extra)) out[COLUMN_INDEX.get(k)!] = extra[k];
  return out;
}

/** The row object of a value array in COLUMNS order. */
export function rowOfValues(values: readonly CellValue[]): StoredRow {
  const row: StoredRow = {};
  for (let i = 0; i < COLUMNS.length; i++) row[COLUMNS[i].name] = values[i] ?? null;
  return row;
}
