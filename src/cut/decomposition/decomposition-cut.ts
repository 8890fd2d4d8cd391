// The decomposition cut: a cut built the way the surplus argument for H-free graphs with many
// triangles goes, with the guarantee each stage of that argument gives.
//
// How it is built.
// 1. Setting pieces aside. Count the triangles T of the remaining graph R (at first the whole
//    graph). While T > c·m_R·√Δ_R (m_R edges, Δ_R the maximum degree of R), pick the vertex v of R
//    that lies in the most triangles of R — equivalently whose neighbourhood in R holds the most
//    edges — and move its neighbourhood N_R(v) out of R as a piece (v itself stays in R). Each step
//    removes at least one edge, so this stops.
// 2. The remainder. R now has few triangles, so the explicit vector method keeps a surplus of
//    order m_R/√Δ_R on it (the few-triangles form). R is cut by rounding the best vector choice
//    found for it (src/bounds/vector-choice.ts), each rounded cut climbed to a 1-flip local
//    optimum, with more trials until one reaches the choice's guarantee (the expectation is at
//    least the guarantee, so some cut does).
// 3. The pieces. A piece lies inside the neighbourhood of one vertex. If the graph is H-free, a
//    copy of H − u (any vertex u of H) inside a neighbourhood would give a copy of H with the centre
//    playing u, so every piece is H′-free with H′ = H − u. A piece is cut exactly when it is small,
//    by the same decomposition (with H′ in place of H) when it still has too many triangles and
//    the depth allows, and by vector rounding otherwise.
// 4. Joining. The remainder's cut is fixed first; then, piece by piece, each piece keeps its own
//    cut or takes it flipped, whichever cuts more of its edges to the vertices already placed. A
//    random flip would cut half of those edges in expectation; choosing the better flip is the
//    method of conditional expectations, so at least half of all edges between parts are cut.
// Every edge lies in exactly one stage (inside the remainder, inside a piece, or between parts),
// so the cut's surplus is the sum of the stages' surpluses, and each stage reaches its guarantee:
// the remainder and rounded pieces their vector guarantee, exact pieces their max-cut surplus, the
// edges between parts 0. The sum of the stage guarantees is the decomposition's guarantee.

import { InputError, invalidParameter } from "../../errors.js";
import { cutValue, surplusOf } from "../../graph/cut-value.js";
import type { Graph } from "../../graph/graph.js";
import { inducedSubgraph } from "../../graph/induced.js";
import { findClique, MAX_CLIQUE_ORDER } from "../../graph/structure/cliques.js";
import { parsePatternName } from "../../graph/structure/patterns.js";
import { sharedTriangleCount } from "../../graph/structure/triangles.js";
import { fewTrianglesBound } from "../../bounds/few-triangles.js";
import { boundApplies, boundDoesNotApply, type LowerBoundRecord } from "../../bounds/types.js";
import { optimiseVectorChoice, sharedVectorChoice, vectorChoiceOptions } from "../../bounds/vector-choice.js";
import { checkSeed } from "../../random/seed.js";
import { exactMaxCut } from "../exact/exact-max-cut.js";
import { GRAY_MAX_VERTICES } from "../exact/gray-code.js";
import { vectorMethodExpectedCut, vectorMethodRoundCut, type VectorRoundingCut } from "../heuristic/vector-rounding.js";
import { cutRecordOf, type CutRecord } from "../types.js";

const OWNER = "decomposition cut";

// The defaults live in ./defaults.ts (the command line shows them without loading this file).
import { DEFAULT_EXACT_VERTICES, DEFAULT_TRIANGLE_FACTOR } from "./defaults.js";
export { DEFAULT_EXACT_VERTICES, DEFAULT_TRIANGLE_FACTOR };

export interface DecompositionOptions {
  /** H, a pattern name (K4, C5, K2,3, …) the graph is free of. Default: K_{ω+1}, ω the clique number. */
  pattern?: string;
  /** c in the stopping rule T ≤ c·m·√Δ (default 1/(3π), see DEFAULT_TRIANGLE_FACTOR). */
  triangleFactor?: number;
  /**
   * Deepest level of pieces that may be decomposed again (pieces set aside from the whole graph
   * are level 1). Default for H = K_r: r − 4, since level-ℓ pieces are K_{r−ℓ}-free and from level
   * r − 3 on they are triangle-free, where the stopping rule holds at once; 1 for other patterns.
   */
  maxDepth?: number;
  /** Pieces with at most this many vertices are cut exactly (default 24). */
  exactVertices?: number;
  /** Rounding trials per rounded stage before checking its guarantee (default 32). */
  trials?: number;
  /** Most rounding trials per rounded stage (default 1024). */
  maxTrials?: number;
  /** Optimise the sets V_i of the vector choice as well as ε (default true). */
  optimiseSets?: boolean;
  /** Seed of the roundings (default 0); each rounded stage gets a seed derived from it. */
  solverSeed?: number;
}

/** How a stage's edges were cut. */
export type DecompositionMethod = "vector-rounding" | "exact" | "no-edges" | "decomposition" | "greedy-orientation";

/** A set-aside piece: the neighbourhood of `centre` in what remained when it was taken. */
export interface DecompositionPiece {
  /** Index in `pieces`. */
  id: number;
  /** The piece it was set aside from, or null when set aside from the whole graph. */
  parent: number | null;
  /** 1 for pieces of the whole graph, 2 for pieces of those, … */
  level: number;
  /** The vertex whose neighbourhood it is (numbered as in the input graph). */
  centre: number;
  /** Its vertices, ascending (numbered as in the input graph). */
  vertices: number[];
  n: number;
  m: number;
  triangles: number;
  /** H′ = H minus a vertex of largest degree, which the piece cannot contain; null when H is unknown or H′ unnamed. */
  freeOf: string | null;
  method: Exclude<DecompositionMethod, "greedy-orientation">;
  /** The surplus its method guarantees on the piece's own edges. */
  guarantee: number;
  /** The surplus of the final cut on the piece's own edges. */
  surplus: number;
  /** Whether the join flipped the piece's cut. */
  flipped: boolean;
}

/** One stage of the argument: its edges are disjoint from every other stage's. */
export interface DecompositionStage {
  kind: "remainder" | "piece" | "between";
  /** The piece whose decomposition the stage belongs to, or null for the whole graph's. */
  within: number | null;
  /** For kind "piece": the piece's id; otherwise null. */
  piece: number | null;
  method: DecompositionMethod;
  /** Vertices of the stage's graph (for "between": of the decomposed graph). */
  n: number;
  /** Edges the stage accounts for. */
  m: number;
  guarantee: number;
  surplus: number;
  details: Record<string, number | string | boolean | null>;
}

export interface DecompositionCutRecord extends CutRecord {
  method: "decomposition";
  /** Surplus of the cut: cutValue − m/2. */
  surplus: number;
  /** Σ of the stage guarantees. */
  guarantee: number;
  /** H, or null when the clique search ran out of budget and none was given. */
  pattern: string | null;
  patternFrom: "given" | "clique-number" | "unknown";
  /** The parameters used, defaults filled in. */
  thresholds: { triangleFactor: number; maxDepth: number; exactVertices: number; trials: number; maxTrials: number; optimiseSets: boolean };
  pieces: DecompositionPiece[];
  stages: DecompositionStage[];
  /** Vertices of the whole graph's remainder, ascending. */
  remainder: number[];
  /** True when every rounded stage reached its guarantee (so `guarantee` ≤ `surplus`). */
  reached: boolean;
  notes: string[];
}

interface Settings {
  triangleFactor: number;
  maxDepth: number;
  exactVertices: number;
  trials: number;
  maxTrials: number;
  optimiseSets: boolean;
  solverSeed: number;
}

interface Run {
  settings: Settings;
  pieces: DecompositionPiece[];
  stages: DecompositionStage[];
  roundings: number;
  reached: boolean;
}

/** H minus a vertex of largest degree, by name: K_r → K_{r−1}, C_k → P_{k−1}, K_{s,t} (s ≤ t) → K_{s−1,t}, P_k → P_{k−1}. */
export function patternMinusVertex(name: string): string | null {
  const p = parsePatternName(name);
  const [a, b] = p.sizes;
  switch (p.kind) {
    case "complete":
      return a >= 2 ? `K${a - 1}` : null;
    case "cycle":
      return `P${a - 1}`;
    case "path":
      // An end vertex: P_k − end = P_{k−1} (a copy of any H − u gives H back with the centre as u).
      return a >= 2 ? `P${a - 1}` : null;
    case "complete-bipartite": {
      const s = Math.min(a, b), t = Math.max(a, b);
      return s >= 2 ? `K${s - 1},${t}` : null;
    }
  }
}

/** Largest r ≤ MAX_CLIQUE_ORDER with a K_r, or null when the search ran out of its node budget. */
function cliqueNumber(graph: Graph): number | null {
  if (graph.n === 0) return 0;
  let r = 1;
  while (r < MAX_CLIQUE_ORDER) {
    const s = findClique(graph, r + 1, { maxNodes: 2_000_000 });
    if (!s.exhaustive) return null;
    if (!s.found) return r;
    r++;
  }
  return null;
}

function checkOptions(graph: Graph, options: DecompositionOptions): { settings: Settings; pattern: string | null; patternFrom: DecompositionCutRecord["patternFrom"] } {
  let pattern: string | null = null;
  let patternFrom: DecompositionCutRecord["patternFrom"] = "unknown";
  if (options.pattern !== undefined) {
    if (typeof options.pattern !== "string") throw invalidParameter(OWNER, "pattern", "should be a pattern name such as K4, C5 or K2,3", options.pattern);
    pattern = parsePatternName(options.pattern).name;
    patternFrom = "given";
  } else {
    const w = cliqueNumber(graph);
    if (w !== null) {
      pattern = `K${w + 1}`;
      patternFrom = "clique-number";
    }
  }
  const triangleFactor = options.triangleFactor ?? DEFAULT_TRIANGLE_FACTOR;
  if (!(typeof triangleFactor === "number" && triangleFactor >= 0 && triangleFactor < 1e9)) {
    throw invalidParameter(OWNER, "triangleFactor", "should be a number ≥ 0", options.triangleFactor);
  }
  const clique = pattern === null ? null : parsePatternName(pattern);
  const depthDefault = clique !== null && clique.kind === "complete" ? Math.max(0, clique.sizes[0] - 4) : 1;
  const maxDepth = options.maxDepth ?? depthDefault;
  if (!Number.isInteger(maxDepth) || maxDepth < 0 || maxDepth > 64) throw invalidParameter(OWNER, "maxDepth", "should be an integer between 0 and 64", options.maxDepth);
  const exactVertices = options.exactVertices ?? DEFAULT_EXACT_VERTICES;
  if (!Number.isInteger(exactVertices) || exactVertices < 0 || exactVertices > GRAY_MAX_VERTICES) {
    throw invalidParameter(OWNER, "exactVertices", `should be an integer between 0 and ${GRAY_MAX_VERTICES}`, options.exactVertices);
  }
  const trials = options.trials ?? 32;
  if (!Number.isInteger(trials) || trials < 1 || trials > 1e7) throw invalidParameter(OWNER, "trials", "should be an integer between 1 and 1e7", options.trials);
  const maxTrials = options.maxTrials ?? Math.max(1024, trials);
  if (!Number.isInteger(maxTrials) || maxTrials < trials || maxTrials > 1e8) {
    throw invalidParameter(OWNER, "maxTrials", `should be an integer between trials (${trials}) and 1e8`, options.maxTrials);
  }
  const optimiseSets = options.optimiseSets ?? true;
  if (typeof optimiseSets !== "boolean") throw invalidParameter(OWNER, "optimiseSets", "should be true or false", options.optimiseSets);
  const solverSeed = checkSeed(OWNER, "solverSeed", options.solverSeed);
  return { settings: { triangleFactor, maxDepth, exactVertices, trials, maxTrials, optimiseSets, solverSeed }, pattern, patternFrom };
}

/** Does the graph stop the peeling at once: T ≤ c·m·√Δ? */
function fewTriangles(triangles: number, m: number, maxDegree: number, c: number): boolean {
  return triangles <= c * m * Math.sqrt(maxDegree);
}

interface Peeled {
  remainder: Int32Array;
  pieces: { centre: number; vertices: Int32Array }[];
  /** The remainder's triangles, edges and maximum degree when the peeling stopped. */
  triangles: number;
  m: number;
  maxDegree: number;
}

/** Step 1: move neighbourhoods out while the rest has too many triangles. Vertices are local ids. */
function peel(graph: Graph, c: number): Peeled {
  const { n, offsets: off, neighbors: nb } = graph;
  const alive = new Uint8Array(n).fill(1);
  const tri = sharedTriangleCount(graph).perVertex.slice(); // counted down below: a copy
  let triangles = 0;
  for (let v = 0; v < n; v++) triangles += tri[v];
  triangles /= 3;
  const deg = new Int32Array(n);
  for (let v = 0; v < n; v++) deg[v] = off[v + 1] - off[v];
  let m = graph.m;
  const mark = new Int32Array(n).fill(-1);
  const pieces: Peeled["pieces"] = [];
  // Removing x destroys exactly the live triangles through x: each {x, a, b} is met once, a < b.
  const remove = (x: number): void => {
    for (let p = off[x]; p < off[x + 1]; p++) if (alive[nb[p]]) mark[nb[p]] = x;
    for (let p = off[x]; p < off[x + 1]; p++) {
      const a = nb[p];
      if (!alive[a]) continue;
      for (let q = off[a]; q < off[a + 1]; q++) {
        const b = nb[q];
        if (b > a && alive[b] && mark[b] === x) {
          tri[a]--;
          tri[b]--;
          triangles--;
        }
      }
      deg[a]--;
      m--;
    }
    tri[x] = 0;
    deg[x] = 0;
    alive[x] = 0;
  };
  for (;;) {
    let maxDegree = 0;
    let centre = -1;
    for (let v = 0; v < n; v++) {
      if (!alive[v]) continue;
      if (deg[v] > maxDegree) maxDegree = deg[v];
      if (centre < 0 || tri[v] > tri[centre]) centre = v;
    }
    if (fewTriangles(triangles, m, maxDegree, c)) {
      const rest: number[] = [];
      for (let v = 0; v < n; v++) if (alive[v]) rest.push(v);
      return { remainder: Int32Array.from(rest), pieces, triangles, m, maxDegree };
    }
    const members: number[] = [];
    for (let p = off[centre]; p < off[centre + 1]; p++) if (alive[nb[p]]) members.push(nb[p]);
    for (const x of members) remove(x);
    pieces.push({ centre, vertices: Int32Array.from(members) });
  }
}

/** The ids as a plain array in ascending order (they usually arrive sorted: then no sort). */
function ascending(ids: Int32Array): number[] {
  const out = Array.from(ids);
  for (let i = 1; i < out.length; i++) if (out[i - 1] > out[i]) return out.sort((a, b) => a - b);
  return out;
}

/** A derived seed per rounded stage, so every stage is reproducible from the one solverSeed. */
function stageSeed(run: Run): number {
  run.roundings++;
  return (run.settings.solverSeed + Math.imul(run.roundings, 0x9e3779b9)) >>> 0;
}

// ---- Tiny stage graphs: the same results, remembered ----
//
// A sweep over many small graphs meets the same labelled remainders and pieces (relabelled
// 0..k−1 in ascending order) again and again. Both sub-steps below are deterministic functions of
// the stage graph and of the run's settings, seed and rounding count, so on graphs of at most
// SMALL_VERTICES vertices their results are kept, keyed by the exact edge set and those inputs, and
// handed back as a fresh run would compute them (test/sweep-fast-paths.test.ts compares the two
// paths). The memo is bounded: it is emptied when it reaches MEMO_LIMIT entries.

/** Stage graphs up to this many vertices are remembered (their edge set fits one 28-bit key). */
const SMALL_VERTICES = 8;
const MEMO_LIMIT = 1 << 16;
const memo = new Map<string, unknown>();
let memoEnabled = true;

/** Turn the memo off (and empty it) or on again: tests compare both paths. */
export function setDecompositionMemo(enabled: boolean): void {
  memoEnabled = enabled;
  memo.clear();
}

/** "n:bits" with bit v(v−1)/2 + u set for each edge u < v, or null when the graph is not tiny. */
function tinyGraphKey(graph: Graph): string | null {
  if (!memoEnabled || graph.n > SMALL_VERTICES || graph.weighted) return null;
  const { n, offsets, neighbors } = graph;
  let bits = 0;
  for (let v = 1; v < n; v++) {
    for (let a = offsets[v]; a < offsets[v + 1]; a++) {
      const u = neighbors[a];
      if (u < v) bits |= 1 << ((v * (v - 1)) / 2 + u);
    }
  }
  return `${n}:${bits}`;
}

function remember<T>(key: string, value: T): T {
  if (memo.size >= MEMO_LIMIT) memo.clear();
  memo.set(key, value);
  return value;
}

interface ExactPiece {
  status: string;
  partition: Uint8Array;
  value: number;
  graySteps: number;
  branchNodes: number;
}

/** exactMaxCut of a piece (only the fields the decomposition reads). */
function exactPiece(sub: Graph, solverSeed: number): ExactPiece {
  const key = tinyGraphKey(sub);
  const k = key === null ? null : `x|${key}|${solverSeed}`;
  const known = k === null ? undefined : (memo.get(k) as ExactPiece | undefined);
  if (known !== undefined) return known;
  const ex = exactMaxCut(sub, { solverSeed });
  const piece: ExactPiece = { status: ex.status, partition: ex.partition, value: ex.value, graySteps: ex.graySteps, branchNodes: ex.branchNodes };
  return k === null ? piece : remember(k, piece);
}

interface Rounded {
  side: Uint8Array;
  guarantee: number;
  details: DecompositionStage["details"];
  /** Rounding batches used (each takes one stage seed) and whether the guarantee was reached. */
  batches: number;
  reached: boolean;
}

/** Round the best vector choice of `graph` until a cut reaches its guarantee (or maxTrials run out). */
function roundToGuarantee(run: Run, graph: Graph): { side: Uint8Array; guarantee: number; details: DecompositionStage["details"] } {
  const key = tinyGraphKey(graph);
  const { trials, maxTrials, optimiseSets, solverSeed } = run.settings;
  const k = key === null ? null : `r|${key}|${solverSeed}|${run.roundings}|${trials}|${maxTrials}|${optimiseSets}`;
  let r = k === null ? undefined : (memo.get(k) as Rounded | undefined);
  if (r === undefined) {
    r = roundFresh(run, graph);
    if (k !== null) remember(k, r);
  }
  run.roundings += r.batches;
  if (!r.reached) run.reached = false;
  // The details object ends up in a stage record, which callers own: a copy each time.
  return { side: r.side, guarantee: r.guarantee, details: Object.assign({}, r.details) };
}

function roundFresh(run: Run, graph: Graph): Rounded {
  // Seeds are taken from a private copy of the counter: the caller advances the run's own.
  const local: Run = { settings: run.settings, pieces: [], stages: [], roundings: run.roundings, reached: true };
  const r = roundFrom(local, graph);
  return { side: r.side, guarantee: r.guarantee, details: r.details, batches: local.roundings - run.roundings, reached: local.reached };
}

function roundFrom(run: Run, graph: Graph): { side: Uint8Array; guarantee: number; details: DecompositionStage["details"] } {
  const { trials, maxTrials, optimiseSets } = run.settings;
  // The default choice is shared with the vector-optimised bound of the same graph object.
  const best = optimiseSets ? sharedVectorChoice(graph) : optimiseVectorChoice(graph, { optimiseSets });
  const guarantee = best.guarantee.surplus as number;
  const choice = vectorChoiceOptions(best.choice);
  let used = 0;
  let batch = trials;
  let top: VectorRoundingCut | null = null;
  let mean = 0;
  for (;;) {
    // vectorMethodRound's cut and mean without its record: the guarantee is best.guarantee, and the
    // expected cut depends on the choice only (computed once below).
    const rec = vectorMethodRoundCut(graph, { ...choice, trials: batch, solverSeed: stageSeed(run), polish: true });
    mean += rec.meanSurplus * batch;
    used += batch;
    if (top === null || rec.value > top.value) top = rec;
    if (surplusOf(graph, top.value) >= guarantee - 1e-9 || used >= maxTrials) break;
    batch = Math.min(used, maxTrials - used);
  }
  const reached = surplusOf(graph, top.value) >= guarantee - 1e-9;
  if (!reached) run.reached = false;
  const few = fewTrianglesBound(graph);
  return {
    side: top.partition,
    guarantee,
    details: {
      trials: used,
      reached,
      meanRoundedSurplus: mean / used,
      expectedSurplus: surplusOf(graph, vectorMethodExpectedCut(graph, choice)),
      defaultGuarantee: best.defaultSurplus,
      fewTrianglesGuarantee: few.surplus,
      triangles: few.triangles,
      maxDegree: few.maxDegree,
      switchedOff: best.switchedOff,
      droppedMembers: best.droppedMembers,
    },
  };
}

/**
 * Decompose `graph` (vertex i is `ids[i]` of the input graph) and cut it; stages and pieces are
 * appended to `run`. `within` is the piece being decomposed (null for the whole graph).
 */
function decompose(run: Run, graph: Graph, ids: Int32Array, level: number, within: number | null, pattern: string | null): { side: Uint8Array; remainder: Int32Array } {
  const s = run.settings;
  const peeled = peel(graph, s.triangleFactor);
  const side = new Uint8Array(graph.n);
  const placed = new Uint8Array(graph.n);

  // Step 2: the remainder.
  // Nothing set aside: the remainder is the graph itself (the same CSR), kept as the same object so
  // what was computed for it (triangles, the vector choice) is shared.
  const rest = peeled.pieces.length === 0 ? graph : inducedSubgraph(graph, peeled.remainder);
  const threshold = s.triangleFactor * peeled.m * Math.sqrt(peeled.maxDegree);
  let restSide: Uint8Array;
  let restGuarantee = 0;
  let restDetails: DecompositionStage["details"] = {};
  if (rest.m === 0) {
    restSide = new Uint8Array(rest.n);
  } else {
    const r = roundToGuarantee(run, rest);
    restSide = r.side;
    restGuarantee = r.guarantee;
    restDetails = r.details;
  }
  run.stages.push({
    kind: "remainder",
    within,
    piece: null,
    method: rest.m === 0 ? "no-edges" : "vector-rounding",
    n: rest.n,
    m: rest.m,
    guarantee: restGuarantee,
    surplus: surplusOf(rest, cutValue(rest, restSide)),
    details: Object.assign(restDetails, { triangleThreshold: threshold, piecesSetAside: peeled.pieces.length }),
  });
  for (let i = 0; i < rest.n; i++) {
    side[peeled.remainder[i]] = restSide[i];
    placed[peeled.remainder[i]] = 1;
  }

  // Steps 3 and 4: cut each piece, then orient it against everything already placed.
  const subPattern = pattern === null ? null : patternMinusVertex(pattern);
  let betweenEdges = 0;
  let betweenCut = 0;
  const { offsets: off, neighbors: nb } = graph;
  for (const p of peeled.pieces) {
    const sub = inducedSubgraph(graph, p.vertices);
    const pieceIds = new Int32Array(p.vertices.length);
    for (let i = 0; i < pieceIds.length; i++) pieceIds[i] = ids[p.vertices[i]];
    const id = run.pieces.length;
    const triangles = sub.m === 0 ? 0 : sharedTriangleCount(sub).total;
    const piece: DecompositionPiece = {
      id,
      parent: within,
      level: level + 1,
      centre: ids[p.centre],
      vertices: ascending(pieceIds),
      n: sub.n,
      m: sub.m,
      triangles,
      freeOf: subPattern,
      method: "no-edges",
      guarantee: 0,
      surplus: 0,
      flipped: false,
    };
    run.pieces.push(piece);
    let pieceSide: Uint8Array | null = null;
    let guarantee = 0;
    let details: DecompositionStage["details"] = {};
    if (sub.m === 0) {
      pieceSide = new Uint8Array(sub.n);
    } else if (sub.n <= s.exactVertices) {
      const ex = exactPiece(sub, s.solverSeed);
      if (ex.status === "optimal") {
        piece.method = "exact";
        pieceSide = ex.partition;
        guarantee = surplusOf(sub, ex.value);
        details = { graySteps: ex.graySteps, branchNodes: ex.branchNodes };
      }
    }
    if (pieceSide === null && level + 1 <= s.maxDepth) {
      let maxDegree = 0;
      for (let v = 0; v < sub.n; v++) maxDegree = Math.max(maxDegree, sub.degree(v));
      if (!fewTriangles(triangles, sub.m, maxDegree, s.triangleFactor)) {
        piece.method = "decomposition";
        const before = run.stages.length;
        pieceSide = decompose(run, sub, pieceIds, level + 1, id, subPattern).side;
        // Every stage added meanwhile belongs to this piece or to pieces nested in it.
        for (let k = before; k < run.stages.length; k++) guarantee += run.stages[k].guarantee;
      }
    }
    if (pieceSide === null) {
      piece.method = "vector-rounding";
      const r = roundToGuarantee(run, sub);
      pieceSide = r.side;
      guarantee = r.guarantee;
      details = r.details;
    }
    piece.guarantee = guarantee;
    piece.surplus = surplusOf(sub, cutValue(sub, pieceSide));
    if (piece.method !== "decomposition") {
      run.stages.push({ kind: "piece", within, piece: id, method: piece.method, n: sub.n, m: sub.m, guarantee, surplus: piece.surplus, details });
    }
    // Derandomised orientation: among the edges to placed vertices, keep the side that cuts more.
    let edges = 0;
    let cutAsIs = 0;
    for (let i = 0; i < sub.n; i++) {
      const v = p.vertices[i];
      for (let a = off[v]; a < off[v + 1]; a++) {
        const u = nb[a];
        if (!placed[u]) continue;
        edges++;
        if (side[u] !== pieceSide[i]) cutAsIs++;
      }
    }
    piece.flipped = edges - cutAsIs > cutAsIs;
    for (let i = 0; i < sub.n; i++) {
      side[p.vertices[i]] = piece.flipped ? 1 - pieceSide[i] : pieceSide[i];
      placed[p.vertices[i]] = 1;
    }
    betweenEdges += edges;
    betweenCut += piece.flipped ? edges - cutAsIs : cutAsIs;
  }
  run.stages.push({
    kind: "between",
    within,
    piece: null,
    method: "greedy-orientation",
    n: graph.n,
    m: betweenEdges,
    guarantee: 0,
    surplus: betweenCut - betweenEdges / 2,
    details: { cutEdges: betweenCut, pieces: peeled.pieces.length },
  });
  return { side, remainder: peeled.remainder };
}

/**
 * The decomposition cut of an unweighted graph (see the module header): the surplus argument for
 * H-free graphs with many triangles, run as an algorithm, after Alon, Krivelevich & Sudakov
 * (2005, "MaxCut in H-free graphs") and Carlson, Kolla, Li, Mani, Sudakov & Trevisan (2021,
 * "Lower bounds for max-cut in H-free graphs via semidefinite programming"). The record's value is
 * re-evaluated by `cutValue`; `guarantee` is the sum of the stage guarantees.
 */
export function decompositionCut(graph: Graph, options: DecompositionOptions = {}): DecompositionCutRecord {
  const t0 = performance.now();
  if (graph.weighted) throw new InputError(`${OWNER}: the graph is weighted; the construction is for unweighted graphs`);
  const { settings, pattern, patternFrom } = checkOptions(graph, options);
  const run: Run = { settings, pieces: [], stages: [], roundings: 0, reached: true };
  const ids = new Int32Array(graph.n);
  for (let i = 0; i < graph.n; i++) ids[i] = i;
  const { side, remainder } = decompose(run, graph, ids, 0, null, pattern);
  let guarantee = 0;
  let stageSurplus = 0;
  for (const st of run.stages) {
    guarantee += st.guarantee;
    stageSurplus += st.surplus;
  }
  const rec = cutRecordOf("decomposition", graph, side, "completed", (performance.now() - t0) / 1000, settings.solverSeed, {
    guarantee,
    pieces: run.pieces.length,
    stages: run.stages.length,
    reached: run.reached,
  });
  const surplus = surplusOf(graph, rec.value);
  // Every edge belongs to exactly one stage; a mismatch would be a bug in the bookkeeping above.
  if (Math.abs(surplus - stageSurplus) > 1e-6) throw new Error(`${OWNER}: stage surpluses sum to ${stageSurplus}, the cut has ${surplus}`);
  const notes: string[] = [];
  if (patternFrom === "clique-number") notes.push(`H = ${pattern}: the graph's clique number is ${Number(pattern!.slice(1)) - 1}`);
  if (patternFrom === "unknown") notes.push("H unknown: the clique search ran out of budget, so pieces carry no H′ claim");
  if (!run.reached) notes.push("a rounded stage did not reach its guarantee within maxTrials; the stage guarantees may exceed the cut's surplus");
  // Field by field rather than spread from the cut record (cheaper; the same fields in the same order).
  return {
    method: "decomposition",
    value: rec.value,
    partition: rec.partition,
    status: rec.status,
    seconds: rec.seconds,
    solverSeed: rec.solverSeed,
    details: rec.details,
    surplus,
    guarantee,
    pattern,
    patternFrom,
    thresholds: {
      triangleFactor: settings.triangleFactor,
      maxDepth: settings.maxDepth,
      exactVertices: settings.exactVertices,
      trials: settings.trials,
      maxTrials: settings.maxTrials,
      optimiseSets: settings.optimiseSets,
    },
    pieces: run.pieces,
    stages: run.stages,
    remainder: Array.from(remainder),
    reached: run.reached,
    notes,
  };
}

/** A decomposition's two numbers as lower-bound records: its cut's surplus and the sum of its stage guarantees. */
export function decompositionBoundsOf(graph: Graph, d: DecompositionCutRecord): { cut: LowerBoundRecord; guarantee: LowerBoundRecord } {
  const h = d.pattern === null ? "" : ` (H = ${d.pattern})`;
  return {
    cut: boundApplies("decomposition-cut", graph.m, d.surplus, `a cut: ${d.pieces.length} pieces set aside, the remainder rounded, pieces joined by orientation${h}`),
    guarantee: boundApplies("decomposition-guarantee", graph.m, d.guarantee, `sum of the decomposition's stage guarantees${h}`),
  };
}

/**
 * The decomposition cut's two numbers for tables and stores (`decomposition-cut`,
 * `decomposition-guarantee`); both say "does not apply" for weighted graphs instead of throwing.
 */
export function decompositionBounds(graph: Graph, options: DecompositionOptions = {}): { cut: LowerBoundRecord; guarantee: LowerBoundRecord } {
  if (graph.weighted) {
    const reason = "the construction is for unweighted graphs";
    return { cut: boundDoesNotApply("decomposition-cut", reason), guarantee: boundDoesNotApply("decomposition-guarantee", reason) };
  }
  return decompositionBoundsOf(graph, decompositionCut(graph, options));
}
