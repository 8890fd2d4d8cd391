// Stored rows back as bracket records with their graphs, so anything that re-checks a bracket
// record (verifyBracket, `halfplus verify`) can re-check a store: the witness partition and the
// certificate are in the row, the graph is embedded in it or rebuilt from its spec or file.

import type { Graph } from "../graph/graph.js";
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

/**
 * Every swept row as a bracket record and its graph, in export order. Imported rows carry no
 * bracket (they were measured elsewhere) and are passed over; `positions` picks rows by position.
 */
export async function* storedBrackets(store: ResultStore, filter?: RowFilter, positions?: ReadonlySet<number>): AsyncGenerator<StoredBracket> {
  let position = 0;
  for (const row of store.rows(filter)) {
    position++;
    if (positions !== undefined && !positions.has(position)) continue;
    if (row.origin !== "sweep") continue;
    const record = bracketRecordFromRow(row);
    const graph = await graphOfRow(row);
    yield { key: String(row.key), position, row, record, graph };
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
