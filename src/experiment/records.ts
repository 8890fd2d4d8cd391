// Stored rows back as bracket records with their graphs, so anything that re-checks a bracket
// record (verifyBracket, `halfplus verify`) can re-check a store: the witness partition and the
// certificate are in the row, the graph is embedded in it or rebuilt from its spec or file.

import type { Graph } from "../graph/graph.js";
import { SourceResolver } from "../sources/index.js";
import type { StoredRow } from "./columns.js";
import { bracketRecordFromRow, graphOfRow, verifyRowRecord, type BracketRecord, type RowVerdict } from "./job.js";
import type { ResultStore, RowFilter } from "./store.js";

export interface StoredBracket {
  key: string;
  /** Position in export order, from 1 (what `halfplus verify store.db --row N` selects). */
  position: number;
  row: StoredRow;
  record: BracketRecord;
  graph: Graph;
}

function matches(row: StoredRow, filter: RowFilter | undefined): boolean {
  if (filter === undefined) return true;
  if (filter.family !== undefined) {
    const fams = typeof filter.family === "string" ? [filter.family] : filter.family;
    if (!fams.includes(String(row.family))) return false;
  }
  if (filter.keys !== undefined && !filter.keys.includes(String(row.key))) return false;
  return filter.origin === undefined || row.origin === filter.origin;
}

/**
 * Every swept row as a bracket record and its graph, in export order. Imported rows carry no
 * bracket (they were measured elsewhere) and are passed over. `positions` picks rows by their
 * position in the whole store's export order (from 1), whatever the filter.
 */
export async function* storedBrackets(store: ResultStore, filter?: RowFilter, positions?: ReadonlySet<number>): AsyncGenerator<StoredBracket> {
  let position = 0;
  // Walk the light columns for positions, then read each chosen row whole.
  const chosen: { key: string; position: number }[] = [];
  for (const head of store.rows(undefined, ["key", "family", "origin"])) {
    position++;
    if (positions !== undefined && !positions.has(position)) continue;
    if (head.origin !== "sweep" || !matches(head, filter)) continue;
    chosen.push({ key: String(head.key), position });
  }
  const resolver = new SourceResolver();
  for (const c of chosen) {
    const row = store.get(c.key);
    if (row === undefined) continue; // removed meanwhile by another process
    const record = bracketRecordFromRow(row);
    const graph = await graphOfRow(row, resolver);
    yield { key: c.key, position: c.position, row, record, graph };
  }
}

export interface StoredVerdict extends RowVerdict {
  key: string;
  position: number;
  record: BracketRecord;
}

/** Re-check stored rows: the partition's cut by cutValue, the upper bound from its certificate. */
export async function* verifyStoredRows(store: ResultStore, options: { filter?: RowFilter; positions?: ReadonlySet<number>; seconds?: number } = {}): AsyncGenerator<StoredVerdict> {
  for await (const b of storedBrackets(store, options.filter, options.positions)) {
    const v = verifyRowRecord(b.graph, b.record, options.seconds ?? 60);
    yield { ...v, key: b.key, position: b.position, record: b.record };
  }
}
