// The census's tables in the results store: one row per census (how far into its stream it has
// got, a fingerprint of that prefix, its settings), one per (n, m) cell, one per histogram bar.
// The tables are created with IF NOT EXISTS beside the sweep tables, so stores made before the
// census existed stay valid and gain them when next opened for writing.

import type Database from "better-sqlite3";
import { InputError } from "../../errors.js";
import { sortedCells, type CensusCell } from "./cells.js";

/** The stored state of one census: enough to resume it and to check the stream fed again. */
export interface CensusState {
  name: string;
  /** Graphs of the stream consumed and counted in the cells (the resume position). */
  consumed: number;
  /** sha256 (hex) of the stream's bytes up to the end of the last consumed graph's line. */
  fingerprint: string;
  witnessLimit: number;
  /** Where the stream came from when the census started (a label: a file name or stdin). */
  source: string;
  startedAt: string;
  updatedAt: string;
  /** Set when a run read its stream to the end (a longer stream fed later continues it). */
  finishedAt: string | null;
  version: string;
}

/** What the store offers the census (implemented on the SQLite store's connection). */
export interface CensusTables {
  /** Every census in the store, by name. */
  list(): CensusState[];
  state(name: string): CensusState | undefined;
  /** Its cells in (n, m) order. */
  cells(name: string): CensusCell[];
  /**
   * Write the state and the changed cells in one transaction: after a kill, the store holds
   * the cells of exactly `state.consumed` graphs.
   */
  commit(state: CensusState, changed: Iterable<CensusCell>): void;
  /**
   * Put `state` and exactly `cells` in place of whatever the store holds under `state.name`, in
   * one transaction (merge.ts: a census taken whole from another store).
   */
  replace(state: CensusState, cells: Iterable<CensusCell>): void;
}

const STATE_FIELDS = ["name", "consumed", "fingerprint", "witnessLimit", "source", "startedAt", "updatedAt", "finishedAt", "version"] as const;

/** Create the census tables (writable stores, at open). */
export function createCensusSchema(db: Database.Database): void {
  db.exec(`CREATE TABLE IF NOT EXISTS census_runs (name TEXT PRIMARY KEY NOT NULL, consumed INTEGER NOT NULL, fingerprint TEXT NOT NULL,
    witnessLimit INTEGER NOT NULL, source TEXT NOT NULL, startedAt TEXT NOT NULL, updatedAt TEXT NOT NULL, finishedAt TEXT, version TEXT NOT NULL)`);
  db.exec(`CREATE TABLE IF NOT EXISTS census_cells (name TEXT NOT NULL, n INTEGER NOT NULL, m INTEGER NOT NULL, graphs INTEGER NOT NULL,
    minSurplus REAL NOT NULL, attaining INTEGER NOT NULL, witnesses TEXT NOT NULL, minRatio REAL, ratioWitness TEXT, ratioDegeneracy INTEGER,
    ratioSurplus REAL, PRIMARY KEY (name, n, m))`);
  db.exec(`CREATE TABLE IF NOT EXISTS census_histogram (name TEXT NOT NULL, n INTEGER NOT NULL, m INTEGER NOT NULL, twiceSurplus INTEGER NOT NULL,
    graphs INTEGER NOT NULL, PRIMARY KEY (name, n, m, twiceSurplus))`);
}

interface CellRow {
  n: number;
  m: number;
  graphs: number;
  minSurplus: number;
  attaining: number;
  witnesses: string;
  minRatio: number | null;
  ratioWitness: string | null;
  ratioDegeneracy: number | null;
  ratioSurplus: number | null;
}

/** The census tables of an open store connection; a read-only store made before the census reads as holding none. */
export function censusTables(db: Database.Database, path: string, readonly: boolean): CensusTables {
  const present = (db.prepare(`SELECT count(*) FROM sqlite_master WHERE type = 'table' AND name = 'census_runs'`).pluck().get() as number) > 0;
  const refuseWrite = (): never => {
    throw new Error(`${path}: opened read-only`);
  };
  if (!present) {
    return { list: () => [], state: () => undefined, cells: () => [], commit: refuseWrite, replace: refuseWrite };
  }
  const upsertState = readonly
    ? null
    : db.prepare(
        `INSERT INTO census_runs (${STATE_FIELDS.join(", ")}) VALUES (${STATE_FIELDS.map(() => "?").join(", ")})
         ON CONFLICT(name) DO UPDATE SET consumed = excluded.consumed, fingerprint = excluded.fingerprint, updatedAt = excluded.updatedAt,
         finishedAt = excluded.finishedAt, version = excluded.version`,
      );
  const upsertCell = readonly
    ? null
    : db.prepare(
        `INSERT INTO census_cells (name, n, m, graphs, minSurplus, attaining, witnesses, minRatio, ratioWitness, ratioDegeneracy, ratioSurplus) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)
         ON CONFLICT(name, n, m) DO UPDATE SET graphs = excluded.graphs, minSurplus = excluded.minSurplus, attaining = excluded.attaining,
         witnesses = excluded.witnesses, minRatio = excluded.minRatio, ratioWitness = excluded.ratioWitness, ratioDegeneracy = excluded.ratioDegeneracy, ratioSurplus = excluded.ratioSurplus`,
      );
  const upsertBar = readonly
    ? null
    : db.prepare(`INSERT INTO census_histogram (name, n, m, twiceSurplus, graphs) VALUES (?, ?, ?, ?, ?) ON CONFLICT(name, n, m, twiceSurplus) DO UPDATE SET graphs = excluded.graphs`);
  const commit = readonly
    ? refuseWrite
    : db.transaction((state: CensusState, changed: Iterable<CensusCell>) => {
        upsertState!.run(STATE_FIELDS.map((f) => state[f]));
        for (const c of changed) {
          upsertCell!.run(state.name, c.n, c.m, c.graphs, c.minSurplus, c.attaining, JSON.stringify(c.witnesses), c.minRatio, c.ratioWitness, c.ratioDegeneracy, c.ratioSurplus);
          for (const [twice, count] of c.histogram) upsertBar!.run(state.name, c.n, c.m, twice, count);
        }
      });
  const replace = readonly
    ? refuseWrite
    : db.transaction((state: CensusState, cells: Iterable<CensusCell>) => {
        for (const table of ["census_histogram", "census_cells", "census_runs"]) db.prepare(`DELETE FROM ${table} WHERE name = ?`).run(state.name);
        (commit as (s: CensusState, c: Iterable<CensusCell>) => void)(state, cells);
      });
  return {
    list: () => db.prepare(`SELECT * FROM census_runs ORDER BY name`).all() as CensusState[],
    state: (name) => db.prepare(`SELECT * FROM census_runs WHERE name = ?`).get(name) as CensusState | undefined,
    cells(name) {
      const cells = new Map<string, CensusCell>();
      for (const r of db.prepare(`SELECT * FROM census_cells WHERE name = ?`).all(name) as CellRow[]) {
        let witnesses: unknown;
        try {
          witnesses = JSON.parse(r.witnesses);
        } catch {
          witnesses = null;
        }
        if (!Array.isArray(witnesses) || !witnesses.every((w) => typeof w === "string")) throw new InputError(`${path}: census ${JSON.stringify(name)} cell n=${r.n} m=${r.m}: witnesses are not a JSON list of graph6 strings`);
        cells.set(`${r.n},${r.m}`, { ...r, witnesses, histogram: new Map() });
      }
      for (const b of db.prepare(`SELECT n, m, twiceSurplus, graphs FROM census_histogram WHERE name = ? ORDER BY n, m, twiceSurplus`).all(name) as { n: number; m: number; twiceSurplus: number; graphs: number }[]) {
        const c = cells.get(`${b.n},${b.m}`);
        if (c === undefined) throw new InputError(`${path}: census ${JSON.stringify(name)}: histogram bar for n=${b.n} m=${b.m} without its cell`);
        c.histogram.set(b.twiceSurplus, b.graphs);
      }
      return sortedCells(cells.values());
    },
    commit: (state, changed) => (commit as (s: CensusState, c: Iterable<CensusCell>) => void)(state, changed),
    replace: (state, cells) => (replace as (s: CensusState, c: Iterable<CensusCell>) => void)(state, cells),
  };
}
