// Exact max cut by depth-first branch and bound with "tail" bounds (a Russian-doll scheme):
// vertices get a fixed order, the max cut MC[k] of every tail v_k..v_{n-1} is solved from the
// shortest tail up, and a node with v_k..v_{d-1} fixed is bounded by
//   cut among fixed + Σ_{free v} max(w(v, fixed side 0), w(v, fixed side 1)) + MC[d],
// which is exact when the free part has no edges. The last b vertices form a tabulated CutBlock,
// so the bottom b levels cost one table scan instead of 2^b nodes. Incumbents: each tail's optimum
// extended by one vertex, 1-flip ascent, seeded random restarts, and the caller's partition.
// Chosen over eigenvalue/SDP node bounds because those cost O(n^2)+ per node while this one is
// O(deg) incremental; measured (bench/cut-exact): sparse n = 60 and dense n = 35 in 0.1–2.5 s.

import { InputError } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { Rng } from "../../random/prng.js";
import { checkPartition, floorCutBound } from "../../graph/cut-value.js";
import { hasIntegerWeights, positiveWeightSum } from "../../graph/weights.js";
import { checkSeed } from "../../random/seed.js";
import { checkSeconds } from "../../validate.js";
import { DEFAULT_EXACT_SECONDS, PROGRESS_INTERVAL, checkWork, exactRecord, improvementMargin, nowSeconds, type ExactCutRecord, type ExactOptions, type ExactStatus } from "./common.js";
import { CutBlock } from "./cut-block.js";
import { graphSlack } from "./exact-slack.js";

export type BranchOrder = "tail-greedy" | "degree";

export interface BranchAndBoundOptions extends ExactOptions {
  /** Vertices in the tabulated bottom block (default min(n − 1, 12)). */
  blockSize?: number;
  /** A known good partition (0/1 per vertex) to start from, e.g. from local search. */
  initial?: ArrayLike<number>;
  /**
   * Vertex order: "degree" (default: largest degree first, so the short tails are the sparse
   * low-degree ends) or "tail-greedy" (each new tail vertex has the most weight into the tail).
   * Measured on G(n, p): "degree" visits 2–10× fewer nodes for sparse n = 60–100 (bench/cut-exact).
   */
  order?: BranchOrder;
  /** Random restarts of the 1-flip heuristic for the first incumbent (default 16). */
  restarts?: number;
}

/** Graph in "position space": vertex order[p] becomes p; forward lists keep neighbours q > p. */
interface Positioned {
  n: number;
  order: Int32Array;
  off: Int32Array;
  nbr: Int32Array;
  w: Float64Array;
  fwdOff: Int32Array;
  fwdNbr: Int32Array;
  fwdW: Float64Array;
}

/**
 * Alternative order for the tail bounds, built from the end: the last vertex has the largest degree, and each
 * earlier one is the vertex with the most absolute weight into the tail built so far. Tails are
 * then dense, so MC[k] is informative, and every v_k has many forward neighbours to inform a/b.
 */
function tailGreedyOrder(graph: Graph): Int32Array {
  const n = graph.n;
  const { offsets, neighbors, weights } = graph;
  const into = new Float64Array(n);
  const placed = new Uint8Array(n);
  const order = new Int32Array(n);
  for (let p = n - 1; p >= 0; p--) {
    let pick = -1;
    for (let v = 0; v < n; v++) {
      if (placed[v]) continue;
      if (
        pick < 0 ||
        into[v] > into[pick] ||
        (into[v] === into[pick] && graph.degree(v) > graph.degree(pick))
      ) pick = v;
    }
    placed[pick] = 1;
    order[p] = pick;
    for (let k = offsets[pick]; k < offsets[pick + 1]; k++) {
      into[neighbors[k]] += Math.abs(weights === null ? 1 : weights[k]);
    }
  }
  return order;
}

/** Vertices by degree, largest first, ties by id: a stable counting sort (O(n), no boxed arrays for large n). */
function degreeOrder(graph: Graph): Int32Array {
  const n = graph.n;
  let maxDeg = 0;
  for (let v = 0; v < n; v++) maxDeg = Math.max(maxDeg, graph.degree(v));
  const start = new Int32Array(maxDeg + 2);
  for (let v = 0; v < n; v++) start[maxDeg - graph.degree(v) + 1]++;
  for (let d = 1; d <= maxDeg + 1; d++) start[d] += start[d - 1];
  const order = new Int32Array(n);
  for (let v = 0; v < n; v++) order[start[maxDeg - graph.degree(v)]++] = v;
  return order;
}

function positioned(graph: Graph, order: Int32Array): Positioned {
  const n = graph.n;
  const pos = new Int32Array(n);
  for (let p = 0; p < n; p++) pos[order[p]] = p;
  const off = new Int32Array(n + 1);
  const fwdOff = new Int32Array(n + 1);
  for (let p = 0; p < n; p++) {
    const v = order[p];
    off[p + 1] = off[p] + graph.degree(v);
    let f = 0;
    for (let k = graph.offsets[v]; k < graph.offsets[v + 1]; k++) if (pos[graph.neighbors[k]] > p) f++;
    fwdOff[p + 1] = fwdOff[p] + f;
  }
  const nbr = new Int32Array(off[n]);
  const w = new Float64Array(off[n]);
  const fwdNbr = new Int32Array(fwdOff[n]);
  const fwdW = new Float64Array(fwdOff[n]);
  for (let p = 0; p < n; p++) {
    const v = order[p];
    let i = off[p], j = fwdOff[p];
    for (let k = graph.offsets[v]; k < graph.offsets[v + 1]; k++) {
      const q = pos[graph.neighbors[k]];
      const wk = graph.weights === null ? 1 : graph.weights[k];
      nbr[i] = q;
      w[i++] = wk;
      if (q > p) {
        fwdNbr[j] = q;
        fwdW[j++] = wk;
      }
    }
  }
  return { n, order, off, nbr, w, fwdOff, fwdNbr, fwdW };
}

/**
 * Greedy 1-flip ascent on the subgraph induced by positions ≥ from: flip the best improving
 * vertex until none improves by more than `eps`. Returns the cut of that subgraph.
 */
function flipAscent(P: Positioned, side: Uint8Array, from: number, gain: Float64Array, eps: number, stopAt: number): number {
  const { n, off, nbr, w } = P;
  let cut = 0;
  for (let p = from; p < n; p++) {
    let g = 0;
    for (let i = off[p]; i < off[p + 1]; i++) {
      const q = nbr[i];
      if (q < from) continue;
      if (side[q] === side[p]) g += w[i];
      else {
        g -= w[i];
        if (q > p) cut += w[i];
      }
    }
    gain[p] = g;
  }
  // Each flip scans every free vertex: on a large graph an ascent can outlast the budget, so
  // it checks the clock (the cut stays that of `side` whenever it stops).
  for (let flips = 1; ; flips++) {
    if ((flips & 255) === 0 && nowSeconds() > stopAt) return cut;
    let pick = -1;
    let bestGain = eps;
    for (let p = from; p < n; p++) {
      if (gain[p] > bestGain) {
        bestGain = gain[p];
        pick = p;
      }
    }
    if (pick < 0) return cut;
    cut += gain[pick];
    gain[pick] = -gain[pick];
    const s = (side[pick] ^= 1);
    for (let i = off[pick]; i < off[pick + 1]; i++) {
      const q = nbr[i];
      if (q < from) continue;
      gain[q] += side[q] === s ? 2 * w[i] : -2 * w[i];
    }
  }
}

export function branchAndBoundMaxCut(graph: Graph, options: BranchAndBoundOptions = {}): ExactCutRecord {
  const t0 = nowSeconds();
  const owner = "branchAndBoundMaxCut";
  const seconds = checkSeconds(owner, options.seconds, DEFAULT_EXACT_SECONDS);
  const seed = checkSeed(owner, "solverSeed", options.solverSeed);
  const workLimit = checkWork(owner, options.work);
  const n = graph.n;
  const restarts = options.restarts ?? 16;
  if (!Number.isInteger(restarts) || restarts < 0 || restarts > 100000) {
    throw new InputError(`${owner}: invalid \`restarts\`: should be an integer between 0 and 100000 (got ${JSON.stringify(options.restarts)})`);
  }
  const orderKind = options.order ?? "degree";
  if (orderKind !== "tail-greedy" && orderKind !== "degree") {
    throw new InputError(`${owner}: invalid \`order\`: should be one of tail-greedy, degree (got ${JSON.stringify(orderKind)})`);
  }
  if (options.initial !== undefined) checkPartition(graph, options.initial, `${owner}: initial`);
  const margin = improvementMargin(graph);
  const exactSums = hasIntegerWeights(graph);
  if (n <= 1) return finish(graph, new Uint8Array(n), "optimal", null, 0, t0, seed, 0, orderKind, exactSums, 0);
  const bMax = Math.min(n - 1, 20);
  const b = options.blockSize ?? Math.min(n - 1, 12);
  if (!Number.isInteger(b) || b < 0 || b > bMax) {
    throw new InputError(`${owner}: invalid \`blockSize\`: should be an integer between 0 and ${bMax} (got ${JSON.stringify(b)})`);
  }

  const order = orderKind === "degree" ? degreeOrder(graph) : tailGreedyOrder(graph);
  const P = positioned(graph, order);
  const { fwdOff, fwdNbr, fwdW } = P;
  const first = n - b; // positions first..n-1 form the block
  const blockWeight = new Float64Array(b * b);
  for (let i = 0; i < b; i++) {
    const p = first + i;
    for (let k = fwdOff[p]; k < fwdOff[p + 1]; k++) {
      const j = fwdNbr[k] - first;
      blockWeight[i * b + j] = blockWeight[j * b + i] = fwdW[k];
    }
  }
  const block = new CutBlock(b, (i, j) => blockWeight[i * b + j]);

  // Per-position search state (position space throughout).
  const side = new Uint8Array(n);
  const toOne = new Float64Array(n); // weight from a free vertex to fixed vertices on side 1
  const toZero = new Float64Array(n); // ... and to fixed vertices on side 0
  const scratch = new Float64Array(n);
  const t = new Float64Array(b);
  const out = new Float64Array(1);
  const savedCut = new Float64Array(n + 1);
  const savedMax = new Float64Array(n + 1);
  const MC = new Float64Array(n + 1); // MC[k] = max cut of the tail induced by positions k..n-1
  const bestSide = new Uint8Array(n); // best partition found for the current tail problem
  const tailSide = new Uint8Array(n); // optimal partition of the previous (shorter) tail

  const deadline = t0 + seconds;
  // First incumbent for the whole graph: the caller's partition and seeded 1-flip restarts.
  const rng = new Rng(seed);
  const globalSide = new Uint8Array(n);
  let globalBest = -Infinity;
  const trySide = (cand: Uint8Array): void => {
    const c = flipAscent(P, cand, 0, scratch, margin / 2, deadline);
    if (c > globalBest) {
      globalBest = c;
      globalSide.set(cand);
    }
  };
  const cand = new Uint8Array(n);
  if (options.initial !== undefined) {
    for (let p = 0; p < n; p++) cand[p] = options.initial[order[p]];
    trySide(cand);
  }
  for (let r = 0; r < restarts && nowSeconds() <= deadline; r++) {
    for (let p = 0; p < n; p++) cand[p] = rng.nextU32() & 1;
    trySide(cand);
  }

  // Tail problems inside the block are never needed except the whole block itself.
  MC[first] = block.tableMax;
  {
    const c = block.maximise(new Float64Array(b), -Infinity, out);
    for (let i = 0; i < b; i++) tailSide[first + i] = (c >>> i) & 1;
  }

  let nodes = 0;
  let work = 0;
  let nextCheck = 4096;
  const onProgress = options.onProgress;
  let nextReport = t0 + PROGRESS_INTERVAL;
  let stopped = false;
  let outOfWork = false;
  let openUpper = -Infinity; // max bound over subtrees left unexplored by a timeout
  let k = first - 1; // the tail problem being solved
  let best = -Infinity;
  let target = Infinity; // a proven upper bound for the current tail; reaching it ends the search
  let cutF = 0;
  let sumMax = 0;
  const leafCost = Math.max(1, (1 << b) >>> 6);

  // Each forward arc saves the sum it changes, so backtracking restores every sum bit for bit:
  // with non-integer weights, rounding then depends on the current path only, never on the
  // number of nodes visited (the slack of src/cut/exact-slack.ts relies on this).
  const savedSum = new Float64Array(fwdOff[n]);
  const assign = (x: number, s: number): void => {
    const ax = toOne[x], bx = toZero[x];
    cutF += s === 0 ? ax : bx;
    sumMax -= ax > bx ? ax : bx;
    side[x] = s;
    for (let i = fwdOff[x]; i < fwdOff[x + 1]; i++) {
      const v = fwdNbr[i];
      const a = toOne[v], c = toZero[v];
      const old = a > c ? a : c;
      let now: number;
      if (s === 1) {
        savedSum[i] = a;
        const a2 = a + fwdW[i];
        toOne[v] = a2;
        now = a2 > c ? a2 : c;
      } else {
        savedSum[i] = c;
        const c2 = c + fwdW[i];
        toZero[v] = c2;
        now = a > c2 ? a : c2;
      }
      sumMax += now - old;
    }
  };
  // Undo `assign`; cutF and sumMax come back from the saved copies so rounding cannot drift.
  const unassign = (x: number, s: number, d: number): void => {
    for (let i = fwdOff[x]; i < fwdOff[x + 1]; i++) {
      const v = fwdNbr[i];
      if (s === 1) toOne[v] = savedSum[i];
      else toZero[v] = savedSum[i];
    }
    cutF = savedCut[d];
    sumMax = savedMax[d];
  };

  const leaf = (): void => {
    let base = cutF;
    for (let i = 0; i < b; i++) {
      const p = first + i;
      base += toOne[p];
      t[i] = toZero[p] - toOne[p];
    }
    work += leafCost;
    const c = block.maximise(t, best - base, out);
    if (c >= 0) {
      best = base + out[0];
      for (let p = k; p < first; p++) bestSide[p] = side[p];
      for (let i = 0; i < b; i++) bestSide[first + i] = (c >>> i) & 1;
    }
  };

  // Positions k..d-1 are fixed and the bound of this node allows an improvement.
  const search = (d: number, bound: number): void => {
    nodes++;
    if (work >= workLimit && !stopped) {
      stopped = true;
      outOfWork = true;
    }
    if (++work >= nextCheck) {
      nextCheck = work + 4096;
      const now = nowSeconds();
      if (now > deadline) stopped = true;
      else if (onProgress !== undefined && now >= nextReport) {
        nextReport = now + PROGRESS_INTERVAL;
        onProgress({ lower: k === 0 ? Math.max(best, globalBest) : globalBest, graySteps: 0, branchNodes: nodes, seconds: now - t0 });
      }
    }
    if (stopped) {
      if (bound > openUpper) openUpper = bound;
      return;
    }
    if (d === first) {
      leaf();
      return;
    }
    const x = d;
    const preferred = toOne[x] >= toZero[x] ? 0 : 1; // side 0 cuts the edges to fixed side-1 vertices
    savedCut[d] = cutF;
    savedMax[d] = sumMax;
    for (let c = 0; c < 2; c++) {
      const s = c === 0 ? preferred : 1 - preferred;
      assign(x, s);
      const childBound = cutF + sumMax + MC[d + 1];
      if (stopped) {
        if (childBound > openUpper) openUpper = childBound;
      } else if (childBound >= best + margin) {
        search(d + 1, childBound);
      }
      unassign(x, s, d);
      if (best >= target) return;
    }
  };

  // Solve the tail problems from the shortest up; the last one (k = 0) is the whole graph.
  let solvedK = first; // MC[solvedK] is proven
  let tailUpper = Infinity;
  for (; k >= 0; k--) {
    // Incumbent: the previous tail's optimum with v_k on its better side, then 1-flip ascent.
    for (let p = k + 1; p < n; p++) side[p] = tailSide[p];
    let w1 = 0, w0 = 0;
    for (let i = fwdOff[k]; i < fwdOff[k + 1]; i++) {
      if (side[fwdNbr[i]] === 1) w1 += fwdW[i];
      else w0 += fwdW[i];
    }
    side[k] = w1 >= w0 ? 0 : 1;
    best = flipAscent(P, side, k, scratch, margin / 2, deadline);
    bestSide.set(side);
    if (k === 0 && globalBest > best) {
      best = globalBest;
      bestSide.set(globalSide);
    }
    // MC[k] ≤ MC[k+1] + the positive weight from v_k into the tail.
    let up = MC[k + 1];
    for (let i = fwdOff[k]; i < fwdOff[k + 1]; i++) if (fwdW[i] > 0) up += fwdW[i];
    target = up - margin / 2;
    if (best < target) {
      for (let p = k; p < n; p++) {
        toOne[p] = 0;
        toZero[p] = 0;
      }
      cutF = 0;
      sumMax = 0;
      // By symmetry v_k stays on side 0.
      savedCut[k] = 0;
      savedMax[k] = 0;
      assign(k, 0);
      search(k + 1, cutF + sumMax + MC[k + 1]);
      unassign(k, 0, k);
    }
    if (stopped) {
      // MC[k] lies in [best, max(best, open bounds)]; pruned subtrees could not beat best by `margin`.
      tailUpper = Math.min(up, Math.max(openUpper, best + (exactSums ? 0 : margin)));
      if (exactSums) tailUpper = floorCutBound(tailUpper);
      break;
    }
    MC[k] = best;
    solvedK = k;
    // Normalise so v_k is on side 0 (either labelling is optimal) and keep it for the next tail.
    const flip = bestSide[k];
    for (let p = k; p < n; p++) tailSide[p] = bestSide[p] ^ flip;
  }

  const partitionByPos = new Uint8Array(n);
  let upper: number | null = null;
  let status: ExactStatus = "optimal";
  if (stopped) {
    status = outOfWork ? "work-limit" : "time-limit";
    // Extend the stopped tail's best partition to the prefix greedily, polish, and keep the
    // better of that and the global incumbent. The bound chains MC[j] ≤ MC[j+1] + positive weight of v_j's forward edges.
    const stoppedK = k;
    for (let p = stoppedK; p < n; p++) side[p] = best > -Infinity ? bestSide[p] : tailSide[p];
    let chain = tailUpper;
    for (let p = stoppedK - 1; p >= 0; p--) {
      let w1 = 0, w0 = 0;
      for (let i = fwdOff[p]; i < fwdOff[p + 1]; i++) {
        if (side[fwdNbr[i]] === 1) w1 += fwdW[i];
        else w0 += fwdW[i];
        if (fwdW[i] > 0) chain += fwdW[i];
      }
      side[p] = w1 >= w0 ? 0 : 1;
    }
    const extended = flipAscent(P, side, 0, scratch, margin / 2, deadline);
    if (extended >= globalBest) partitionByPos.set(side);
    else partitionByPos.set(globalSide);
    upper = Math.min(chain, positiveWeightSum(graph));
  } else {
    partitionByPos.set(tailSide);
  }
  const partition = new Uint8Array(n);
  for (let p = 0; p < n; p++) partition[order[p]] = partitionByPos[p];
  return finish(graph, partition, status, upper, nodes, t0, seed, b, orderKind, exactSums, solvedK, work);
}

function finish(
  graph: Graph,
  partition: Uint8Array,
  status: ExactStatus,
  upper: number | null,
  nodes: number,
  t0: number,
  seed: number,
  blockSize: number,
  order: BranchOrder,
  exactSums: boolean,
  solvedTail: number,
  workUsed = 0,
): ExactCutRecord {
  // Non-integer weights: pruning used a tolerance and sums round, so the proven bound carries the
  // search's slack (src/cut/exact/exact-slack.ts), rounded up.
  const slack = exactSums ? 0 : graphSlack(graph);
  const search = { status, upper, slack, graySteps: 0, branchNodes: nodes, t0, solverSeed: seed };
  return exactRecord("exact-bnb", graph, partition, search, { blockSize, order, integerWeights: exactSums, tolerance: slack, solvedTail, workUsed });
}
