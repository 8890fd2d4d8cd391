// `halfplus verify store.db` beyond the results rows: what the census tables and the hunt frontier
// store can be re-checked from the store alone.
//
// - A census cell: its histogram adds up to its graph count, its least surplus is the lowest bar
//   and `attaining` that bar's height; every witness is a graph with the cell's n and m whose
//   exact max cut (bitmaskMaxCut, re-run here) gives the least surplus; the ratio witness has the
//   stated degeneracy and exact surplus, gives minRatio by the census's own formula, and no
//   least-surplus witness has a smaller ratio. A census run: its cells add up to the graphs it
//   says it counted. (That the counts are those of the stream cannot be re-checked without it.)
// - A hunt frontier row: its graph6 has the row's n, m and graph hash, contains no copy of H
//   (findSubgraph, exhaustive), its bracket record passes verifyBracket on that graph, and the
//   row's surplus ends, degeneracy and objective value are the ones the record and graph give.
//
// Verdicts use verify's words: `rejected` when a check fails; a frontier row otherwise takes its
// bracket's verdict (verified, probable, estimate), a census row is `verified`.

import { bitmaskMaxCut, adjacencyMasks, BITMASK_MAX_VERTICES } from "../cut/exact/bitmask-max-cut.js";
import { parseBracketRecord, verifyBracket, type BracketCheck, type BracketVerdict } from "../cut/bracket/verify.js";
import type { BracketRecord } from "../cut/bracket/record.js";
import { surplusOf } from "../graph/cut-value.js";
import { parseGraph6 } from "../graph/formats/graph6.js";
import type { Graph } from "../graph/graph.js";
import { graphHash } from "../graph/hash.js";
import { degeneracy } from "../graph/structure/degeneracy.js";
import { patternGraph } from "../graph/structure/patterns.js";
import { findSubgraph } from "../graph/structure/subgraph.js";
import { objectiveValue, parseObjectiveKey } from "../hunt/objective.js";
import type { CensusCell } from "./census/cells.js";
import type { CensusState } from "./census/census-store.js";
import type { HuntFrontierRow } from "./hunt-store.js";
import type { ResultStore } from "./store.js";

/** A verdict on a census row: every check passed (`verified`) or some failed (`rejected`). */
export interface CensusVerdict {
  table: "census-runs" | "census-cells";
  census: string;
  /** The cell's n and m (census-cells only). */
  n?: number;
  m?: number;
  ok: boolean;
  verdict: "verified" | "rejected";
  checks: BracketCheck[];
}

/** A verdict on a hunt frontier row: its bracket's verdict, rejected when a frontier check fails. */
export interface FrontierVerdict extends BracketVerdict {
  table: "hunt-frontier";
  pattern: string;
  n: number;
  objective: string;
  m: number;
  /** The row's record when it could be read (for the verdict line's range). */
  record: BracketRecord | null;
}

const plural = (k: number, word: string): string => `${k} ${word}${k === 1 ? "" : "s"}`;

const check = (name: string, failure: string | null, passed: string): BracketCheck => ({ name, ok: failure === null, message: failure ?? passed });

/** The first of `tests` that fails, as its message, or null. */
const firstFailure = (...tests: (() => string | null)[]): string | null => {
  for (const t of tests) {
    const f = t();
    if (f !== null) return f;
  }
  return null;
};

function decode(text: string, what: string): { graph: Graph } | { error: string } {
  try {
    return { graph: parseGraph6(text) };
  } catch (e) {
    return { error: `${what} ${JSON.stringify(text)} is not graph6 (${(e as Error).message})` };
  }
}

/** Exact surplus of a census graph (the census's own solver, run again). */
function exactSurplus(g: Graph): number {
  return surplusOf(g, bitmaskMaxCut(adjacencyMasks(g), g.n));
}

function cellChecks(c: CensusCell, witnessLimit: number): BracketCheck[] {
  const bars = [...c.histogram.entries()].sort((a, b) => a[0] - b[0]);
  const sum = bars.reduce((s, [, k]) => s + k, 0);
  const histogram = firstFailure(
    () => (bars.some(([t, k]) => !Number.isInteger(t) || !Number.isInteger(k) || k <= 0) ? "a bar is not a positive count at an integer 2·surplus" : null),
    () => (sum !== c.graphs ? `the bars add up to ${sum} graphs, the cell says ${c.graphs}` : null),
  );
  const least = firstFailure(
    () => (bars.length === 0 ? "no bars" : null),
    () => (2 * c.minSurplus !== bars[0][0] ? `least surplus ${c.minSurplus}, but the lowest bar is at ${bars[0][0] / 2}` : null),
    () => (c.attaining !== bars[0][1] ? `${c.attaining} graphs attain it, the lowest bar holds ${bars[0][1]}` : null),
  );
  const shape = (g: Graph, what: string): string | null =>
    g.n !== c.n || g.m !== c.m ? `${what} has n=${g.n}, m=${g.m}, not the cell's n=${c.n}, m=${c.m}` : g.n > BITMASK_MAX_VERTICES ? `${what} has more than ${BITMASK_MAX_VERTICES} vertices` : null;
  const witnessGraphs: Graph[] = [];
  const witnesses = firstFailure(
    () => (c.witnesses.length !== Math.min(c.attaining, witnessLimit) ? `${c.witnesses.length} witnesses kept, expected min(attaining ${c.attaining}, witness limit ${witnessLimit})` : null),
    () => (new Set(c.witnesses).size !== c.witnesses.length ? "a witness is listed twice" : null),
    () => {
      for (const [i, w] of c.witnesses.entries()) {
        const d = decode(w, `witness ${i + 1}`);
        if ("error" in d) return d.error;
        const bad = shape(d.graph, `witness ${i + 1}`);
        if (bad !== null) return bad;
        const s = exactSurplus(d.graph);
        if (s !== c.minSurplus) return `witness ${i + 1} (${w}) has surplus ${s}, not the least surplus ${c.minSurplus}`;
        witnessGraphs.push(d.graph);
      }
      return null;
    },
  );
  const ratio = firstFailure(() => {
    const fields = [c.minRatio, c.ratioWitness, c.ratioDegeneracy, c.ratioSurplus];
    if (c.m === 0) return fields.every((x) => x === null) ? null : "a cell without edges has no ratio, but one is stored";
    if (fields.some((x) => x === null) || c.ratioWitness === null || c.ratioDegeneracy === null || c.ratioSurplus === null || c.minRatio === null) return "the ratio or its witness is missing";
    const d = decode(c.ratioWitness, "ratio witness");
    if ("error" in d) return d.error;
    const bad = shape(d.graph, "ratio witness");
    if (bad !== null) return bad;
    const deg = degeneracy(d.graph).degeneracy;
    if (deg !== c.ratioDegeneracy) return `ratio witness has degeneracy ${deg}, the cell says ${c.ratioDegeneracy}`;
    const s = exactSurplus(d.graph);
    if (s !== c.ratioSurplus) return `ratio witness has surplus ${s}, the cell says ${c.ratioSurplus}`;
    // The census's formula, evaluated the same way (census/batch.ts), so equality is exact.
    const r = (s * Math.sqrt(deg)) / c.m;
    if (r !== c.minRatio) return `ratio witness gives surplus·√d/m = ${r}, the cell says ${c.minRatio}`;
    if (!c.histogram.has(2 * s)) return `no histogram bar at the ratio witness's surplus ${s}`;
    for (const [i, g] of witnessGraphs.entries()) {
      const wr = (c.minSurplus * Math.sqrt(degeneracy(g).degeneracy)) / c.m;
      if (wr < c.minRatio) return `witness ${i + 1} has surplus·√d/m = ${wr}, below the least ratio ${c.minRatio}`;
    }
    return null;
  });
  return [
    check("histogram", histogram, `${plural(bars.length, "bar")} add${bars.length === 1 ? "s" : ""} up to the cell's ${plural(c.graphs, "graph")}`),
    check("leastSurplus", least, `least surplus ${c.minSurplus} is the lowest bar; ${plural(c.attaining, "graph")} attain${c.attaining === 1 ? "s" : ""} it`),
    check("witnesses", witnesses, `${c.witnesses.length} witness${c.witnesses.length === 1 ? "" : "es"} re-solved exactly: surplus ${c.minSurplus}`),
    check("ratio", ratio, c.m === 0 ? "no edges, no ratio" : `the ratio witness re-solved: degeneracy ${c.ratioDegeneracy}, surplus ${c.ratioSurplus}, surplus·√d/m = ${c.minRatio}`),
  ];
}

const verdictOf = (checks: BracketCheck[]): Pick<CensusVerdict, "ok" | "verdict" | "checks"> => {
  const ok = checks.every((c) => c.ok);
  return { ok, verdict: ok ? "verified" : "rejected", checks };
};

/** Verdicts on every census of the store (or the one named): its run row, then its cells in (n, m) order. */
export function* verifyCensusTables(store: ResultStore, name?: string): Generator<CensusVerdict> {
  const tables = store.census();
  for (const state of tables.list() as CensusState[]) {
    if (name !== undefined && state.name !== name) continue;
    const cells = tables.cells(state.name);
    const total = cells.reduce((s, c) => s + c.graphs, 0);
    const counted = check("graphCount", total === state.consumed ? null : `the cells hold ${total} graphs, the census says it counted ${state.consumed}`, `the cells hold the ${state.consumed} graphs counted`);
    yield { table: "census-runs", census: state.name, ...verdictOf([counted]) };
    for (const c of cells) yield { table: "census-cells", census: state.name, n: c.n, m: c.m, ...verdictOf(cellChecks(c, state.witnessLimit)) };
  }
}

/** H of a frontier row: a pattern name, or "graph6:<text>" for a pattern read from a file. */
function patternOf(pattern: string): { graph: Graph } | { error: string } {
  if (pattern.startsWith("graph6:")) return decode(pattern.slice("graph6:".length), "pattern");
  try {
    return { graph: patternGraph(pattern) };
  } catch (e) {
    return { error: (e as Error).message };
  }
}

/** Re-check one frontier row (see the head of this file). `seconds`: verifyBracket's budget for an exact re-run. */
export function verifyFrontierRow(row: HuntFrontierRow, seconds = 60): FrontierVerdict {
  const id = { table: "hunt-frontier" as const, pattern: row.pattern, n: row.n, objective: row.objective, m: row.m };
  const rejected = (checks: BracketCheck[], record: BracketRecord | null = null): FrontierVerdict => ({ ...id, ok: false, verdict: "rejected", upperKind: null, checks, record });
  const d = decode(row.graph6, "graph6");
  if ("error" in d) return rejected([check("frontierGraph", d.error, "")]);
  const g = d.graph;
  const shape = firstFailure(
    () => (g.n !== row.n || g.m !== row.m ? `graph6 has n=${g.n}, m=${g.m}, the row says n=${row.n}, m=${row.m}` : null),
    () => (graphHash(g) !== row.graphHash ? `graph6 hashes to ${graphHash(g)}, the row says ${row.graphHash}` : null),
  );
  const h = patternOf(row.pattern);
  let free: string | null;
  let freeText = "";
  if ("error" in h) free = `pattern ${JSON.stringify(row.pattern)}: ${h.error}`;
  else {
    const found = findSubgraph(g, h.graph);
    free = found.found ? `contains a copy of ${row.pattern} (at vertices ${[...found.embedding].join(", ")})` : !found.exhaustive ? "the subgraph search did not finish" : null;
    freeText = `no copy of ${row.pattern} (exhaustive search)`;
  }
  let record: BracketRecord;
  try {
    record = parseBracketRecord(JSON.parse(row.record) as unknown, "record");
  } catch (e) {
    return rejected([check("frontierGraph", shape, `n=${g.n}, m=${g.m}, graph hash as stored`), check("patternFree", free, freeText), check("record", (e as Error).message, "")]);
  }
  const objective = parseObjectiveKey(row.objective);
  const deg = degeneracy(g).degeneracy;
  const bounds = firstFailure(
    () => (row.surplusLower !== record.surplusLower || row.surplusUpper !== record.surplusUpper ? `surplus [${row.surplusLower}, ${row.surplusUpper}], the record says [${record.surplusLower}, ${record.surplusUpper}]` : null),
    () => (row.degeneracy !== deg ? `degeneracy ${row.degeneracy}, the graph's is ${deg}` : null),
    () => (objective === null ? `objective ${JSON.stringify(row.objective)} is not one of ratio, power:<α>, surplus:<m>` : null),
    () => {
      const v = objectiveValue(objective!, record.surplusUpper, g.m, deg);
      return v !== row.value ? `value ${row.value}, but the record's surplus upper end gives ${v}` : null;
    },
  );
  const bracket = verifyBracket(g, record, { seconds });
  const mine = [
    check("frontierGraph", shape, `n=${g.n}, m=${g.m}, graph hash as stored`),
    check("patternFree", free, freeText),
    check("frontierValue", bounds, `surplus ends, degeneracy ${deg} and value ${row.value} follow from the record and the graph`),
  ];
  const checks = [...mine, ...bracket.checks];
  if (mine.some((c) => !c.ok)) return { ...rejected(checks, record) };
  return { ...id, ...bracket, checks, record };
}

/** Verdicts on every hunt frontier row of the store, in (pattern, n, objective, m) order. */
export function* verifyFrontierTable(store: ResultStore, seconds = 60): Generator<FrontierVerdict> {
  for (const row of store.huntEntries()) yield verifyFrontierRow(row, seconds);
}
