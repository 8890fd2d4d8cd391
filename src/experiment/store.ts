// The results store as the rest of halfplus sees it: a small interface over rows keyed by
// `key` (columns.ts), so the SQLite binding behind it (sqlite-store.ts, better-sqlite3 today)
// can be swapped for Node's built-in SQLite without touching sweeps, exports or merges.

import type { CellValue, StoredRow } from "./columns.js";
import type { CensusTables } from "./census/census-store.js";
import type { HuntFrontierFilter, HuntFrontierRow } from "./hunt-store.js";

export interface RowFilter {
  /** Only rows of these family labels. */
  family?: string | readonly string[];
  /** Only these keys. */
  keys?: readonly string[];
  origin?: "sweep" | "import";
}

/** One sweep run, logged in the store with its plan (provenance; not part of any row). */
export interface SweepLogEntry {
  id: string;
  plan: string;
  planText: string;
  startedAt: string;
  finishedAt: string | null;
  shard: string | null;
  workers: number;
  version: string;
  gitCommit: string | null;
  /** Rows this run added. */
  computed: number;
  /** running, finished, stopped (interrupted) or failed. */
  status: string;
}

/** What adding one source's rows to a store found (merge.ts). */
export interface UnionOutcome {
  /** Rows in the source. */
  rows: number;
  /** Rows copied (0 whenever `conflicting` > 0: then nothing is written). */
  added: number;
  /** Rows this store already held, equal on every compared column. */
  alreadyThere: number;
  /** Rows whose key is here but which differ on some compared column. */
  conflicting: number;
  /** The first of those keys in export order (family, n, m, key). */
  firstConflict?: string;
}

export interface ResultStore {
  /** The file, as opened. */
  readonly path: string;
  readonly readonly: boolean;
  has(key: string): boolean;
  get(key: string): StoredRow | undefined;
  /**
   * Write rows in one transaction: all of them or none. A key already stored is left as it is
   * (the caller checks agreement where that matters). Returns how many rows were new.
   */
  insert(rows: readonly StoredRow[]): number;
  /** The same for rows given as value arrays in COLUMNS order (the sweep's path: no objects per row). */
  insertValues(rows: readonly (readonly CellValue[])[]): number;
  /** Rows in export order (family, n, m, key); `columns` limits what is read (default: all). */
  rows(filter?: RowFilter, columns?: readonly string[]): IterableIterator<StoredRow>;
  count(filter?: RowFilter): number;
  /** Run fn in one transaction (nested calls join it). */
  transaction<T>(fn: () => T): T;
  /**
   * Add the rows of `source` whose key is new here and compare the others on the columns named by
   * `compared`, all or nothing: on any disagreement nothing is written and the outcome says where.
   * A backend does this set-based where it can; undefined means it cannot for this source (another
   * kind of store), and the caller goes row by row (merge.ts) with the same result.
   */
  unionFrom(source: ResultStore, compared: readonly string[]): UnionOutcome | undefined;
  logSweep(entry: SweepLogEntry): void;
  sweeps(): SweepLogEntry[];
  /** The census tables: per-(n, m) aggregates of exhaustive graph streams and their resume state. */
  census(): CensusTables;
  /** Hunt frontier (table `hunt_frontier`, see hunt-store.ts): keep `row` when it is new or beats the stored one; true if kept. */
  putHuntEntry(row: HuntFrontierRow): boolean;
  /** Stored frontier rows, ordered by (pattern, n, objective, m); none when the store has no hunt table. */
  huntEntries(filter?: HuntFrontierFilter): HuntFrontierRow[];
  /**
   * For a long run of small writes (a sweep): move the store's own housekeeping off the calling
   * thread where the backend can (the SQLite store copies its write-ahead log into the file from a
   * thread of its own). Call the returned function before closing. Optional; commits stay as durable.
   */
  backgroundMaintenance?(): () => Promise<void>;
  close(): void;
}

export interface OpenStoreOptions {
  /** Open for reading only; the file must exist. */
  readonly?: boolean;
}
