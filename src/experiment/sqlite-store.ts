// The results store in an embedded SQLite file (better-sqlite3): one table of rows keyed by
// `key`, one log of sweeps, one table of facts about the file. WAL journal with synchronous =
// NORMAL: a committed transaction survives the process being killed at any moment (it is in the
// WAL file before commit returns), and a kill mid-transaction leaves nothing of it.

import type Database from "better-sqlite3";
import { createRequire } from "node:module";
import { existsSync, mkdirSync, readSync, openSync, closeSync, statSync } from "node:fs";
import { dirname } from "node:path";
import { Worker } from "node:worker_threads";
import { InputError } from "../errors.js";
import { COLUMNS, columnSpec, rowValues, type CellValue, type ColumnSpec, type StoredRow } from "./columns.js";
import type { OpenStoreOptions, ResultStore, RowFilter, SweepLogEntry, UnionOutcome } from "./store.js";
import { censusTables, createCensusSchema, type CensusTables } from "./census/census-store.js";
import { huntRows, putHuntRow, type HuntFrontierFilter, type HuntFrontierRow } from "./hunt-store.js";

/**
 * The native binding is loaded on first use, so commands that never open a store (graph, cut, ...)
 * neither pay for it nor fail where it could not be built.
 */
let driver: typeof Database | undefined;
function sqlite(): typeof Database {
  driver ??= createRequire(import.meta.url)("better-sqlite3") as typeof Database;
  return driver;
}

// DEFAULT_STORE lives in ./default-store.ts (`--help` shows it without loading SQLite).
import { DEFAULT_STORE } from "./default-store.js";
export { DEFAULT_STORE };

const FORMAT = "halfplus-results";
const SCHEMA_VERSION = "1";

const SQL_TYPE: Record<ColumnSpec["type"], string> = { integer: "INTEGER", real: "REAL", text: "TEXT", boolean: "INTEGER", blob: "BLOB" };

/** Identifiers are our own column names (letters only), quoted anyway. */
const q = (name: string): string => `"${name}"`;

/** The temporary table a merge loads a source's compared columns into (one connection's temp schema). */
const INCOMING = "merge_incoming";

/** Columns the export order sorts by (rows(), and the first conflict a merge reports). */
const ORDER = ["family", "n", "m", "key"];

const SWEEP_FIELDS = ["id", "plan", "planText", "startedAt", "finishedAt", "shard", "workers", "version", "gitCommit", "computed", "status"] as const;

/** Does the file start with SQLite's header? (An empty or missing file is a new store.) */
function looksLikeSqlite(path: string): boolean {
  const fd = openSync(path, "r");
  try {
    const head = Buffer.alloc(16);
    const got = readSync(fd, head, 0, 16, 0);
    return got === 16 && head.toString("latin1") === "SQLite format 3\u0000";
  } finally {
    closeSync(fd);
  }
}

/** True when `path` is an SQLite file (used by verify to tell a store from a JSON record file). */
export function isStoreFile(path: string): boolean {
  try {
    return statSync(path).isFile() && looksLikeSqlite(path);
  } catch {
    return false;
  }
}

function toCell(v: CellValue | boolean | undefined): unknown {
  if (v === undefined || v === null) return null;
  if (typeof v === "boolean") return v ? 1 : 0;
  if (v instanceof Uint8Array && !Buffer.isBuffer(v)) return Buffer.from(v.buffer, v.byteOffset, v.byteLength);
  return v;
}

/** No cell needs toCell: none is undefined or a boolean (Uint8Array binds as a blob as it is). */
function bindsAsIs(r: readonly (CellValue | boolean | undefined)[]): boolean {
  for (let i = 0; i < r.length; i++) {
    const v = r[i];
    if (v === undefined || typeof v === "boolean") return false;
  }
  return true;
}

/**
 * A thread that copies the write-ahead log into the database file (PASSIVE checkpoints, which
 * never block the writer) every CHECKPOINT_EVERY_MS while the main connection only appends. A
 * checkpoint syncs the files to disk, which takes tens of milliseconds on a busy disk: done on
 * the writing thread it stalls the sweep's scheduling. Checkpoints are crash-safe by SQLite's
 * design, and a commit is in the log before it returns, whichever thread checkpoints.
 */
const CHECKPOINT_EVERY_MS = 250;
/** The writer checkpoints itself only when the log passes this many pages (4 KiB each): a safety net. */
const WRITER_CHECKPOINT_PAGES = 16384;
const CHECKPOINTER = `
const { parentPort, workerData } = require("node:worker_threads");
const Database = require(workerData.driver);
const db = new Database(workerData.path, { fileMustExist: true });
db.pragma("busy_timeout = 0");
db.pragma("synchronous = NORMAL");
const tick = () => { try { db.pragma("wal_checkpoint(PASSIVE)"); } catch {} };
const timer = setInterval(tick, workerData.every);
parentPort.on("message", () => { clearInterval(timer); db.close(); parentPort.postMessage("closed"); });
`;

class SqliteStore implements ResultStore {
  private readonly db: Database.Database;
  private readonly present: Set<string>;
  private readonly insertStmt: Database.Statement;
  private readonly hasStmt: Database.Statement;
  private readonly getStmt: Database.Statement;
  private readonly insertMany: (rows: readonly (readonly CellValue[])[]) => number;
  /** For each column this store has, its position in COLUMNS (an older store may lack some). */
  private readonly positions: number[];

  constructor(
    readonly path: string,
    readonly readonly: boolean,
  ) {
    if (readonly) {
      if (!existsSync(path)) throw new InputError(`${path}: no such results store`);
      if (!statSync(path).isFile()) throw new InputError(`${path}: is a directory, expected a results store`);
    } else if (!existsSync(path)) {
      mkdirSync(dirname(path), { recursive: true });
    }
    if (existsSync(path) && statSync(path).size > 0 && !looksLikeSqlite(path)) throw new InputError(`${path}: not a halfplus results store (not an SQLite file)`);
    try {
      const Driver = sqlite();
      this.db = new Driver(path, { readonly, fileMustExist: readonly });
    } catch (e) {
      throw new InputError(`${path}: cannot open results store (${(e as Error).message})`);
    }
    try {
      this.db.pragma("busy_timeout = 30000");
      // A new (empty) file becomes a store; any other SQLite file must already be one.
      const fresh = (this.db.prepare(`SELECT count(*) FROM sqlite_master`).pluck().get() as number) === 0;
      if (!fresh || readonly) this.checkFormat();
      if (!readonly) {
        this.db.pragma("journal_mode = WAL");
        this.db.pragma("synchronous = NORMAL");
        this.createSchema();
      }
    } catch (e) {
      this.db.close();
      if (e instanceof InputError) throw e;
      throw new InputError(`${path}: not a usable results store (${(e as Error).message})`);
    }
    this.present = new Set((this.db.prepare(`PRAGMA table_info(results)`).all() as { name: string }[]).map((r) => r.name));
    const cols = COLUMNS.filter((c) => this.present.has(c.name));
    this.positions = cols.map((c) => COLUMNS.indexOf(c));
    const all = this.positions.length === COLUMNS.length;
    this.insertStmt = readonly
      ? this.db.prepare("SELECT 1")
      : this.db.prepare(`INSERT INTO results (${cols.map((c) => q(c.name)).join(", ")}) VALUES (${cols.map(() => "?").join(", ")}) ON CONFLICT(key) DO NOTHING`);
    this.hasStmt = this.db.prepare(`SELECT 1 FROM results WHERE key = ?`).pluck();
    this.getStmt = this.db.prepare(`SELECT * FROM results WHERE key = ?`);
    this.insertMany = this.db.transaction((rows: readonly (readonly CellValue[])[]) => {
      let added = 0;
      const cells = new Array<unknown>(this.positions.length);
      for (const r of rows) {
        if (r.length !== COLUMNS.length) throw new Error(`row of ${r.length} values, expected ${COLUMNS.length}`);
        // A sweep's value arrays hold only what the driver binds as is (null, numbers, strings, byte
        // arrays: it takes any Uint8Array as a blob): bound directly, without a converted copy.
        added += this.insertStmt.run(all && bindsAsIs(r) ? r : this.cellsOf(r, cells)).changes;
      }
      return added;
    });
  }

  private cellsOf(r: readonly CellValue[], cells: unknown[]): unknown[] {
    for (let i = 0; i < cells.length; i++) cells[i] = toCell(r[this.positions.length === COLUMNS.length ? i : this.positions[i]]);
    return cells;
  }

  private createSchema(): void {
    this.db.exec(`CREATE TABLE IF NOT EXISTS meta (name TEXT PRIMARY KEY, value TEXT NOT NULL)`);
    const cols = COLUMNS.map((c) => `${q(c.name)} ${SQL_TYPE[c.type]}${c.name === "key" ? " PRIMARY KEY NOT NULL" : ""}`);
    this.db.exec(`CREATE TABLE IF NOT EXISTS results (${cols.join(", ")})`);
    // A store made by an older halfplus lacks newer columns: add them (their values read as null).
    const have = new Set((this.db.prepare(`PRAGMA table_info(results)`).all() as { name: string }[]).map((r) => r.name));
    for (const c of COLUMNS) if (!have.has(c.name)) this.db.exec(`ALTER TABLE results ADD COLUMN ${q(c.name)} ${SQL_TYPE[c.type]}`);
    this.db.exec(`CREATE TABLE IF NOT EXISTS sweeps (${SWEEP_FIELDS.map((f) => `${q(f)} ${f === "workers" || f === "computed" ? "INTEGER" : "TEXT"}${f === "id" ? " PRIMARY KEY" : ""}`).join(", ")})`);
    this.db.prepare(`INSERT OR IGNORE INTO meta (name, value) VALUES ('format', ?), ('schema', ?)`).run(FORMAT, SCHEMA_VERSION);
    createCensusSchema(this.db);
  }

  private checkFormat(): void {
    let format: string | undefined;
    try {
      format = this.db.prepare(`SELECT value FROM meta WHERE name = 'format'`).pluck().get() as string | undefined;
    } catch {
      format = undefined; // no meta table: some other SQLite file
    }
    if (format !== FORMAT) throw new InputError(`${this.path}: an SQLite file, but not a halfplus results store`);
  }

  has(key: string): boolean {
    return this.hasStmt.get(key) !== undefined;
  }

  get(key: string): StoredRow | undefined {
    return this.getStmt.get(key) as StoredRow | undefined;
  }

  /** `name`, or NULL where this (older) store lacks the column: it reads as null, as in rows(). */
  private selectable(name: string): string {
    return this.present.has(name) ? q(name) : `NULL AS ${q(name)}`;
  }

  /**
   * Set-based union: the source's rows go into a temporary table of this connection (ATTACH would
   * be shorter, but a transaction cannot DETACH and at most 10 files can be attached, while one
   * merge takes any number of shard stores in one transaction). One join on key with `IS NOT`
   * (null-safe) counts the disagreements; only when there are none is anything copied, by one
   * INSERT … SELECT of the rows whose key is new.
   */
  unionFrom(source: ResultStore, compared: readonly string[]): UnionOutcome | undefined {
    if (!(source instanceof SqliteStore)) return undefined;
    if (this.readonly) throw new Error(`${this.path}: opened read-only`);
    for (const name of compared) if (columnSpec(name) === undefined) throw new Error(`unionFrom: unknown column ${JSON.stringify(name)}`);
    // This store's columns (all of COLUMNS once opened for writing); a column the source lacks reads as null.
    const cols = this.positions.map((i) => COLUMNS[i]);
    const list = cols.map((c) => q(c.name)).join(", ");
    const incoming = `temp.${q(INCOMING)}`;
    return this.db.transaction((): UnionOutcome => {
      this.db.exec(`DROP TABLE IF EXISTS ${incoming}`);
      this.db.exec(`CREATE TABLE ${incoming} (${cols.map((c) => `${q(c.name)} ${SQL_TYPE[c.type]}${c.name === "key" ? " PRIMARY KEY NOT NULL" : ""}`).join(", ")})`);
      try {
        const load = this.db.prepare(`INSERT INTO ${incoming} (${list}) VALUES (${cols.map(() => "?").join(", ")})`);
        let rows = 0;
        for (const r of source.db.prepare(`SELECT ${cols.map((c) => source.selectable(c.name)).join(", ")} FROM results`).raw().iterate() as IterableIterator<unknown[]>) {
          load.run(r);
          rows++;
        }
        const joined = `FROM ${incoming} i JOIN main.results r ON r.key = i.key`;
        const differ = compared.map((c) => `i.${q(c)} IS NOT r.${q(c)}`).join(" OR ") || "0";
        const found = this.db.prepare(`SELECT count(*) AS present, coalesce(sum(${differ}), 0) AS conflicting ${joined}`).get() as { present: number; conflicting: number };
        if (found.conflicting > 0) {
          const first = this.db.prepare(`SELECT i.key ${joined} WHERE ${differ} ORDER BY ${ORDER.map((c) => `i.${q(c)}`).join(", ")} LIMIT 1`).pluck().get() as string;
          return { rows, added: 0, alreadyThere: found.present - found.conflicting, conflicting: found.conflicting, firstConflict: first };
        }
        const added = this.db.prepare(`INSERT INTO main.results (${list}) SELECT ${list} FROM ${incoming} WHERE key NOT IN (SELECT key FROM main.results)`).run().changes;
        return { rows, added, alreadyThere: found.present, conflicting: 0 };
      } finally {
        this.db.exec(`DROP TABLE IF EXISTS ${incoming}`);
      }
    })();
  }

  insert(rows: readonly StoredRow[]): number {
    return this.insertValues(rows.map((r) => rowValues(r)));
  }

  insertValues(rows: readonly (readonly CellValue[])[]): number {
    if (this.readonly) throw new Error(`${this.path}: opened read-only`);
    if (rows.length === 0) return 0;
    return this.insertMany(rows);
  }

  private where(filter: RowFilter | undefined): { sql: string; args: unknown[] } {
    const parts: string[] = [];
    const args: unknown[] = [];
    if (filter?.family !== undefined) {
      const fams = typeof filter.family === "string" ? [filter.family] : [...filter.family];
      parts.push(`family IN (${fams.map(() => "?").join(", ") || "NULL"})`);
      args.push(...fams);
    }
    if (filter?.keys !== undefined) {
      parts.push(`key IN (${filter.keys.map(() => "?").join(", ") || "NULL"})`);
      args.push(...filter.keys);
    }
    if (filter?.origin !== undefined) {
      parts.push(`origin = ?`);
      args.push(filter.origin);
    }
    return { sql: parts.length === 0 ? "" : ` WHERE ${parts.join(" AND ")}`, args };
  }

  *rows(filter?: RowFilter, columns?: readonly string[]): IterableIterator<StoredRow> {
    const wanted = columns ?? COLUMNS.map((c) => c.name);
    const have = wanted.filter((c) => this.present.has(c));
    const missing = wanted.filter((c) => !this.present.has(c));
    const w = this.where(filter);
    const sel = have.length === 0 ? "key" : have.map(q).join(", ");
    // BINARY collation compares text bytewise: the same order on every machine.
    const stmt = this.db.prepare(`SELECT ${sel} FROM results${w.sql} ORDER BY family, n, m, key`);
    for (const r of stmt.iterate(...w.args) as IterableIterator<StoredRow>) {
      for (const c of missing) r[c] = null;
      yield r;
    }
  }

  count(filter?: RowFilter): number {
    const w = this.where(filter);
    return this.db.prepare(`SELECT count(*) FROM results${w.sql}`).pluck().get(...w.args) as number;
  }

  transaction<T>(fn: () => T): T {
    return this.db.transaction(fn)();
  }

  logSweep(e: SweepLogEntry): void {
    if (this.readonly) throw new Error(`${this.path}: opened read-only`);
    this.db
      .prepare(`INSERT INTO sweeps (${SWEEP_FIELDS.map(q).join(", ")}) VALUES (${SWEEP_FIELDS.map(() => "?").join(", ")}) ON CONFLICT(id) DO UPDATE SET finishedAt = excluded.finishedAt, computed = excluded.computed, status = excluded.status`)
      .run(SWEEP_FIELDS.map((f) => e[f]));
  }

  sweeps(): SweepLogEntry[] {
    return this.db.prepare(`SELECT * FROM sweeps ORDER BY startedAt, id`).all() as SweepLogEntry[];
  }

  // The census's tables (src/experiment/census/census-store.ts), prepared on first use.
  private censusCache: CensusTables | undefined;
  census(): CensusTables {
    this.censusCache ??= censusTables(this.db, this.path, this.readonly);
    return this.censusCache;
  }

  // ---- hunt frontier (hunt-store.ts holds the table's definition) ----

  putHuntEntry(row: HuntFrontierRow): boolean {
    if (this.readonly) throw new Error(`${this.path}: opened read-only`);
    return putHuntRow(this.db, row);
  }

  huntEntries(filter: HuntFrontierFilter = {}): HuntFrontierRow[] {
    return huntRows(this.db, filter);
  }

  backgroundMaintenance(): () => Promise<void> {
    if (this.readonly || this.path === ":memory:" || this.db.pragma("journal_mode", { simple: true }) !== "wal") return async () => {};
    const driver = createRequire(import.meta.url).resolve("better-sqlite3");
    const worker = new Worker(CHECKPOINTER, { eval: true, workerData: { path: this.path, driver, every: CHECKPOINT_EVERY_MS } });
    worker.unref();
    // A checkpointer that fails (the file taken away, say) only leaves the checkpoints to the writer.
    worker.on("error", () => {});
    const exited = new Promise<void>((resolve) => worker.once("exit", () => resolve()));
    this.db.pragma(`wal_autocheckpoint = ${WRITER_CHECKPOINT_PAGES}`);
    let stopped: Promise<void> | null = null;
    return () => {
      stopped ??= (async () => {
        try {
          const closed = new Promise<void>((resolve) => worker.once("message", () => resolve()));
          worker.postMessage("stop");
          await Promise.race([closed, exited]);
        } finally {
          await worker.terminate();
          if (this.db.open) this.db.pragma("wal_autocheckpoint = 1000");
        }
      })();
      return stopped;
    };
  }

  close(): void {
    if (this.db.open) this.db.close();
  }
}

/** Open (or create, unless read-only) a results store; the folder is created as needed. */
export function openStore(path: string = DEFAULT_STORE, options: OpenStoreOptions = {}): ResultStore {
  return new SqliteStore(path, options.readonly === true);
}
