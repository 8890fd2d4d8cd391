// One census batch: decode its graph6/sparse6 lines, solve each graph exactly with the bitmask
// search, measure its degeneracy, and fold the results into cells per (n, m). Runs in a worker
// thread (or the main one for 0 workers); pure apart from the solver's scratch space.

import { bitmaskMaxCut, BITMASK_MAX_VERTICES } from "../../cut/exact/bitmask-max-cut.js";
import { adjacencyMasks } from "../../cut/exact/bitmask-max-cut.js";
import { inputErrorAt, isInputError } from "../../errors.js";
import { surplusOf } from "../../graph/cut-value.js";
import { encodeGraph6 } from "../../graph/formats/graph6.js";
import { decodeNautyLine } from "../../graph/formats/nauty-line.js";
import { degeneracy } from "../../graph/structure/degeneracy.js";
import { cellKey, emptyCell, toPlainCell, type CensusCell, type PlainCell } from "./cells.js";

export interface CensusBatchRequest {
  seq: number;
  /** Whole lines of the stream, each ending in "\n". */
  bytes: Uint8Array;
  /** The stream's name in messages, and the line number of the first line of `bytes`. */
  file: string;
  firstLine: number;
  witnessLimit: number;
}

export type CensusBatchResult =
  | { seq: number; graphs: number; cells: PlainCell[]; seconds: number; error?: undefined }
  | { seq: number; error: string; inputError: boolean };

/** The census of one batch. Errors in the input come back as one-line messages naming file:line. */
export function runCensusBatch(req: CensusBatchRequest): CensusBatchResult {
  const t0 = performance.now();
  try {
    const { graphs, cells } = censusOfLines(req.bytes, req.file, req.firstLine, req.witnessLimit);
    return { seq: req.seq, graphs, cells: [...cells.values()].map(toPlainCell), seconds: (performance.now() - t0) / 1000 };
  } catch (e) {
    return { seq: req.seq, error: e instanceof Error ? e.message : String(e), inputError: isInputError(e) };
  }
}

const masks = new Int32Array(BITMASK_MAX_VERTICES);

/** Cells of the graphs on the lines of `buf`, in line order. */
export function censusOfLines(buf: Uint8Array, file: string, firstLine: number, witnessLimit: number): { graphs: number; cells: Map<number, CensusCell> } {
  const cells = new Map<number, CensusCell>();
  let graphs = 0;
  let line = firstLine - 1;
  let p = 0;
  while (p < buf.length) {
    let nl = buf.indexOf(10, p);
    if (nl < 0) nl = buf.length;
    line++;
    const r = decodeNautyLine(buf, p, nl, { file, line }, undefined);
    const start = p;
    p = nl + 1;
    if (r === null) continue;
    const g = r.graph;
    graphs++;
    if (g.n > BITMASK_MAX_VERTICES) throw inputErrorAt(file, line, `graph has ${g.n} vertices; the census solves graphs of at most ${BITMASK_MAX_VERTICES}`);
    const maxCut = bitmaskMaxCut(adjacencyMasks(g, masks), g.n);
    const surplus = surplusOf(g, maxCut);
    const key = cellKey(g.n, g.m);
    let cell = cells.get(key);
    if (cell === undefined) {
      cell = emptyCell(g.n, g.m);
      cells.set(key, cell);
    }
    cell.graphs++;
    const twice = 2 * surplus;
    cell.histogram.set(twice, (cell.histogram.get(twice) ?? 0) + 1);
    // graph6 text only for graphs kept as witnesses: graph6 input is copied, sparse6 re-encoded.
    const text = (): string => (r.format === "graph6" && buf[start] !== 62 ? String.fromCharCode(...buf.subarray(start, buf[nl - 1] === 13 ? nl - 1 : nl)) : encodeGraph6(g));
    if (surplus < cell.minSurplus) {
      cell.minSurplus = surplus;
      cell.attaining = 1;
      cell.witnesses = [text()];
    } else if (surplus === cell.minSurplus) {
      cell.attaining++;
      if (cell.witnesses.length < witnessLimit) cell.witnesses.push(text());
    }
    if (g.m > 0) {
      const d = degeneracy(g).degeneracy;
      const ratio = (surplus * Math.sqrt(d)) / g.m;
      if (cell.minRatio === null || ratio < cell.minRatio) {
        cell.minRatio = ratio;
        cell.ratioWitness = text();
        cell.ratioDegeneracy = d;
        cell.ratioSurplus = surplus;
      }
    }
  }
  return { graphs, cells };
}
