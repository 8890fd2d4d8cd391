// The hunt's frontier in the results store: table `hunt_frontier`, one row per (pattern, n,
// objective, m) holding the best certified graph found so far (graph6 and its bracket record).
// The table is created on the first write, so stores made before it existed stay valid and
// read as holding no frontier; the `results` table and the schema version are untouched.

import type Database from "better-sqlite3";

export interface HuntFrontierRow {
  /** H: its preset or pattern name, or "graph6:<text>" for a pattern read from a file. */
  pattern: string;
  n: number;
  /** "ratio", "power:<α>" or "surplus:<m>". */
  objective: string;
  m: number;
  /** The certified objective value (from the record's surplus upper end). */
  value: number;
  surplusLower: number;
  surplusUpper: number;
  degeneracy: number;
  graph6: string;
  graphHash: string;
  /** Where the chain that found it started. */
  start: string;
  solverSeed: number;
  iteration: number;
  /** ISO time it was stored (provenance only). */
  foundAt: string;
  /** The bracket record, one line of JSON: `halfplus verify` re-checks it. */
  record: string;
}

export interface HuntFrontierFilter {
  pattern?: string;
  n?: number;
  objective?: string;
}

const FIELDS = ["pattern", "n", "objective", "m", "value", "surplusLower", "surplusUpper", "degeneracy", "graph6", "graphHash", "start", "solverSeed", "iteration", "foundAt", "record"] as const;
const TYPES: Record<(typeof FIELDS)[number], string> = {
  pattern: "TEXT NOT NULL", n: "INTEGER NOT NULL", objective: "TEXT NOT NULL", m: "INTEGER NOT NULL", value: "REAL NOT NULL",
  surplusLower: "REAL", surplusUpper: "REAL", degeneracy: "INTEGER", graph6: "TEXT NOT NULL", graphHash: "TEXT NOT NULL",
  start: "TEXT", solverSeed: "INTEGER", iteration: "INTEGER", foundAt: "TEXT", record: "TEXT NOT NULL",
};

function hasTable(db: Database.Database): boolean {
  return db.prepare(`SELECT 1 FROM sqlite_master WHERE type = 'table' AND name = 'hunt_frontier'`).get() !== undefined;
}

/** Store `row` unless a row for the same (pattern, n, objective, m) is at least as good; true when stored. */
export function putHuntRow(db: Database.Database, row: HuntFrontierRow): boolean {
  db.exec(`CREATE TABLE IF NOT EXISTS hunt_frontier (${FIELDS.map((f) => `"${f}" ${TYPES[f]}`).join(", ")}, PRIMARY KEY (pattern, n, objective, m))`);
  const info = db
    .prepare(
      `INSERT INTO hunt_frontier (${FIELDS.map((f) => `"${f}"`).join(", ")}) VALUES (${FIELDS.map(() => "?").join(", ")}) ` +
        `ON CONFLICT(pattern, n, objective, m) DO UPDATE SET ${FIELDS.filter((f) => !["pattern", "n", "objective", "m"].includes(f)).map((f) => `"${f}" = excluded."${f}"`).join(", ")} ` +
        `WHERE excluded.value < hunt_frontier.value`,
    )
    .run(FIELDS.map((f) => row[f]));
  return info.changes > 0;
}

/** The stored frontier rows matching the filter, ordered by (pattern, n, objective, m). */
export function huntRows(db: Database.Database, filter: HuntFrontierFilter): HuntFrontierRow[] {
  if (!hasTable(db)) return [];
  const where: string[] = [];
  const args: (string | number)[] = [];
  if (filter.pattern !== undefined) { where.push(`pattern = ?`); args.push(filter.pattern); }
  if (filter.n !== undefined) { where.push(`n = ?`); args.push(filter.n); }
  if (filter.objective !== undefined) { where.push(`objective = ?`); args.push(filter.objective); }
  const sql = `SELECT ${FIELDS.map((f) => `"${f}"`).join(", ")} FROM hunt_frontier${where.length > 0 ? ` WHERE ${where.join(" AND ")}` : ""} ORDER BY pattern, n, objective, m`;
  return db.prepare(sql).all(...args) as HuntFrontierRow[];
}
