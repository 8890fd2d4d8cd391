// A census as records: one JSON object per (n, m) cell, the same facts `halfplus census --table`
// lays out, with the census's own state beside them.

import { InputError } from "../../errors.js";
import { parseGraph6 } from "../../graph/formats/graph6.js";
import type { SurplusRow } from "../rows.js";
import type { ResultStore } from "../store.js";
import type { CensusCell } from "./cells.js";
import type { CensusState } from "./census-store.js";

export const CENSUS_CELL_KIND = "halfplus/census-cell";
export const CENSUS_CELL_VERSION = 1;

/** A cell as a record: its fields (CensusCell) with the census's name and state, and the histogram as a list. */
export interface CensusCellRecord extends Omit<CensusCell, "histogram"> {
  kind: typeof CENSUS_CELL_KIND;
  version: number;
  census: string;
  /** Where the graphs came from and how many of the stream are counted. */
  source: { stream: string; graphsCounted: number; complete: boolean };
  /** The max cut that attains the least surplus (m/2 + minSurplus). */
  maxCutAtMin: number;
  /** Graphs per surplus value, in increasing surplus. */
  histogram: { surplus: number; graphs: number }[];
}

export function censusCellRecord(state: CensusState, c: CensusCell): CensusCellRecord {
  return {
    kind: CENSUS_CELL_KIND,
    version: CENSUS_CELL_VERSION,
    census: state.name,
    source: { stream: state.source, graphsCounted: state.consumed, complete: state.finishedAt !== null },
    n: c.n,
    m: c.m,
    graphs: c.graphs,
    minSurplus: c.minSurplus,
    maxCutAtMin: c.m / 2 + c.minSurplus,
    attaining: c.attaining,
    witnesses: c.witnesses,
    minRatio: c.minRatio,
    ratioWitness: c.ratioWitness,
    ratioDegeneracy: c.ratioDegeneracy,
    ratioSurplus: c.ratioSurplus,
    histogram: [...c.histogram.entries()].sort((a, b) => a[0] - b[0]).map(([twice, graphs]) => ({ surplus: twice / 2, graphs })),
  };
}

/**
 * The censuses of a store to show: the one named, else every one. A name the store lacks, or a
 * store with no census, is bad input naming the store.
 */
export function censusesToShow(store: ResultStore, name: string | undefined): CensusState[] {
  const all = store.census().list();
  if (name !== undefined) {
    const hit = all.find((s) => s.name === name);
    if (hit === undefined) throw new InputError(`${store.path}: no census named ${JSON.stringify(name)}${all.length > 0 ? ` (it holds ${all.map((s) => JSON.stringify(s.name)).join(", ")})` : ""}`);
    return [hit];
  }
  if (all.length === 0) throw new InputError(`${store.path}: holds no census (run one with halfplus census - --store ${store.path})`);
  return all;
}

/** Every cell of the census as a record, in (n, m) order. */
export function censusRecords(store: ResultStore, state: CensusState): CensusCellRecord[] {
  return store.census().cells(state.name).map((c) => censusCellRecord(state, c));
}

/**
 * The census's extremal graphs as rows for the fits and figures: per (n, m) with m > 0, the first
 * graph attaining the least surplus·√d/m (its surplus is exact: `exact: true`), family = the
 * census name, key = its graph6. Degrees are read off the decoded witness.
 */
export function censusSurplusRows(store: ResultStore, state: CensusState): SurplusRow[] {
  const rows: SurplusRow[] = [];
  for (const c of store.census().cells(state.name)) {
    if (c.ratioWitness === null || c.ratioSurplus === null || c.ratioDegeneracy === null) continue;
    const g = parseGraph6(c.ratioWitness, { file: `${store.path} census ${state.name}` });
    let maxDegree = 0;
    for (let v = 0; v < g.n; v++) maxDegree = Math.max(maxDegree, g.degree(v));
    rows.push({
      key: c.ratioWitness,
      family: state.name,
      n: c.n,
      m: c.m,
      degeneracy: c.ratioDegeneracy,
      maxDegree,
      averageDegree: (2 * c.m) / c.n,
      surplusLower: c.ratioSurplus,
      surplusUpper: c.ratioSurplus,
      exact: true,
    });
  }
  return rows;
}
