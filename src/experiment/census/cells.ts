// The census's aggregate per (n, m): the least surplus, how many graphs attain it and the first
// of them, the least surplus/(m/√d), and the histogram of surplus. Cells merge in stream order,
// so the witnesses kept are the first ones of the stream whatever the batching or the workers.

/** One (n, m) of a census. Surpluses are max cut − m/2: integers or halves, exact in doubles. */
export interface CensusCell {
  n: number;
  m: number;
  /** Graphs read with this n and m. */
  graphs: number;
  /** The least surplus among them. */
  minSurplus: number;
  /** Graphs whose surplus is minSurplus. */
  attaining: number;
  /** graph6 of the first `witnessLimit` graphs attaining minSurplus, in stream order. */
  witnesses: string[];
  /** Least surplus·√d/m (d the degeneracy) over these graphs; null when m = 0. */
  minRatio: number | null;
  /** graph6 of the first graph attaining minRatio, its degeneracy and its surplus. */
  ratioWitness: string | null;
  ratioDegeneracy: number | null;
  ratioSurplus: number | null;
  /** Graphs per value of 2·surplus (an integer), so the keys are exact. */
  histogram: Map<number, number>;
}

/** A cell as it crosses from a worker (structured clone keeps Maps, but arrays are cheaper). */
export interface PlainCell extends Omit<CensusCell, "histogram"> {
  histogram: [number, number][];
}

export const cellKey = (n: number, m: number): number => n * 4096 + m;

export function toPlainCell(c: CensusCell): PlainCell {
  return { ...c, histogram: [...c.histogram.entries()] };
}

export function fromPlainCell(p: PlainCell): CensusCell {
  return { ...p, witnesses: [...p.witnesses], histogram: new Map(p.histogram) };
}

export function emptyCell(n: number, m: number): CensusCell {
  return { n, m, graphs: 0, minSurplus: Infinity, attaining: 0, witnesses: [], minRatio: null, ratioWitness: null, ratioDegeneracy: null, ratioSurplus: null, histogram: new Map() };
}

/**
 * Fold `later` (cells of graphs that come after `into`'s in the stream) into `into`. Ties keep
 * the earlier witness, so folding batches in stream order gives the same cell as one pass.
 */
export function mergeCell(into: CensusCell, later: CensusCell, witnessLimit: number): void {
  into.graphs += later.graphs;
  if (later.minSurplus < into.minSurplus) {
    into.minSurplus = later.minSurplus;
    into.attaining = later.attaining;
    into.witnesses = later.witnesses.slice(0, witnessLimit);
  } else if (later.minSurplus === into.minSurplus) {
    into.attaining += later.attaining;
    for (const w of later.witnesses) {
      if (into.witnesses.length >= witnessLimit) break;
      into.witnesses.push(w);
    }
  }
  if (later.minRatio !== null && (into.minRatio === null || later.minRatio < into.minRatio)) {
    into.minRatio = later.minRatio;
    into.ratioWitness = later.ratioWitness;
    into.ratioDegeneracy = later.ratioDegeneracy;
    into.ratioSurplus = later.ratioSurplus;
  }
  for (const [k, v] of later.histogram) into.histogram.set(k, (into.histogram.get(k) ?? 0) + v);
}

/** Cells in (n, m) order. */
export function sortedCells(cells: Iterable<CensusCell>): CensusCell[] {
  return [...cells].sort((a, b) => a.n - b.n || a.m - b.m);
}
