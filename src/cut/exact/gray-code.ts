// Exact max cut by exhaustive enumeration of all 2^(n-1) bipartitions (one vertex fixed to side 0).
// The "outer" vertices walk a binary-reflected Gray code with O(deg) incremental gain updates per
// step; the last b vertices form a tabulated CutBlock, so each outer state costs ~2^b table lookups.

import { InputError } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { hasIntegerWeights, positiveWeightSum } from "../../graph/weights.js";
import { checkSeed } from "../../random/seed.js";
import { checkSeconds } from "../../validate.js";
import { DEFAULT_EXACT_SECONDS, PROGRESS_INTERVAL, checkWork, exactRecord, nowSeconds, type ExactCutRecord, type ExactOptions, type ExactStatus } from "./common.js";
import { CutBlock } from "./cut-block.js";
import { float64Pool, int32Pool, uint8Pool, type ScratchPool } from "../../graph/scratch.js";
import { GRAY_RESYNC_STEPS, graphSlack } from "./exact-slack.js";

import { GRAY_MAX_VERTICES } from "./gray-limit.js";
export { GRAY_MAX_VERTICES };

export interface GrayOptions extends ExactOptions {
  /** Vertices in the tabulated block (default min(n − 1, 14)). */
  blockSize?: number;
}

// Scratch for the search state (tiny graphs come by the hundred thousand in a sweep); each array
// is fully written before it is read. A run with a progress callback takes fresh arrays, since the
// callback could start another search.
const byDegreePool = int32Pool(), outerPool = int32Pool(), blockVertsPool = int32Pool(), blockBitPool = int32Pool();
const sidePool = uint8Pool(), gainPool = float64Pool(), tPool = float64Pool();
const freshInt32 = (pool: ScratchPool<Int32Array>, k: number, pooled: boolean): Int32Array => (pooled ? pool.take(k) : new Int32Array(k));

export function grayCodeMaxCut(graph: Graph, options: GrayOptions = {}): ExactCutRecord {
  const t0 = nowSeconds();
  const owner = "grayCodeMaxCut";
  const seconds = checkSeconds(owner, options.seconds, DEFAULT_EXACT_SECONDS);
  const seed = checkSeed(owner, "solverSeed", options.solverSeed);
  const workLimit = checkWork(owner, options.work);
  const n = graph.n;
  if (n > GRAY_MAX_VERTICES) {
    throw new InputError(`${owner}: graph has ${n} vertices; exhaustive enumeration supports at most ${GRAY_MAX_VERTICES}`);
  }
  if (n <= 1) return record(graph, new Uint8Array(n), "optimal", 0, 0, t0, seed, 0);
  // At most 30 outer bits, so Gray steps stay in 32-bit integer arithmetic.
  const bMin = Math.max(0, n - 31), bMax = Math.min(n - 1, 20);
  const b = options.blockSize ?? Math.min(n - 1, 14);
  if (!Number.isInteger(b) || b < bMin || b > bMax) {
    throw new InputError(`${owner}: invalid \`blockSize\`: should be an integer between ${bMin} and ${bMax} (got ${JSON.stringify(b)})`);
  }
  const { offsets, neighbors, weights } = graph;
  const pooled = options.onProgress === undefined;

  // Roles: the highest-degree vertex is fixed (it never flips, saving its O(deg) updates); the
  // lowest-degree outer vertices take the low Gray bits, which flip most often.
  // By (degree, id) ascending, by insertion (n ≤ GRAY_MAX_VERTICES): the order the comparator
  // (a, c) ↦ deg a − deg c || a − c defines.
  const byDegree = freshInt32(byDegreePool, n, pooled);
  for (let v = 0; v < n; v++) {
    const dv = graph.degree(v);
    let s = v - 1;
    while (s >= 0 && graph.degree(byDegree[s]) > dv) {
      byDegree[s + 1] = byDegree[s];
      s--;
    }
    byDegree[s + 1] = v;
  }
  const fixed = byDegree[n - 1];
  const outer = freshInt32(outerPool, n - 1 - b, pooled);
  const blockVerts = freshInt32(blockVertsPool, b, pooled);
  for (let i = 0; i < n - 1; i++) {
    if (i < outer.length) outer[i] = byDegree[i];
    else blockVerts[i - outer.length] = byDegree[i];
  }
  const blockBit = freshInt32(blockBitPool, n, pooled).fill(-1);
  for (let i = 0; i < b; i++) blockBit[blockVerts[i]] = i;

  const block = new CutBlock(b, (i, j) => graph.edgeWeight(blockVerts[i], blockVerts[j]));

  // State for the current outer pattern (the block's side is chosen per pattern by `maximise`).
  const side = (pooled ? sidePool.take(n) : new Uint8Array(n)).fill(0);
  const gain = pooled ? gainPool.take(n) : new Float64Array(n); // zeroed by resync; change of the outer–outer cut if v flips
  const t = pooled ? tPool.take(b) : new Float64Array(b); // zeroed by resync; extra cut if block vertex i goes to side 1 instead of side 0
  let outerCut = 0; // cut among outer + fixed vertices
  let toSideOne = 0; // Σ over block vertices of their weight to outer vertices on side 1
  // Recompute the incremental state from `side`: at the start, and now and then for
  // non-integer weights so rounding in the running sums cannot build up over 2^k steps.
  const resync = (): void => {
    outerCut = 0;
    toSideOne = 0;
    gain.fill(0);
    t.fill(0);
    for (let v = 0; v < n; v++) {
      if (blockBit[v] >= 0) continue;
      const sv = side[v];
      for (let k = offsets[v]; k < offsets[v + 1]; k++) {
        const u = neighbors[k];
        const w = weights === null ? 1 : weights[k];
        const bu = blockBit[u];
        if (bu >= 0) {
          if (sv === 1) toSideOne += w;
          t[bu] += sv === 1 ? -w : w;
        } else {
          gain[v] += side[u] === sv ? w : -w;
          if (u > v && side[u] !== sv) outerCut += w;
        }
      }
    }
  };
  resync();
  const exactSums = hasIntegerWeights(graph);

  const steps = 2 ** outer.length;
  const out = new Float64Array(1);
  let best = -Infinity;
  let bestStep = 0;
  let bestPattern = 0;
  const deadline = t0 + seconds;
  let status: ExactStatus = "optimal";
  let done = 0;
  const checkEvery = Math.max(1, Math.floor(2 ** 16 / (1 << b)));
  const onProgress = options.onProgress;
  let nextReport = t0 + PROGRESS_INTERVAL;
  for (let s = 0; s < steps; s++) {
    if (s >= workLimit) {
      status = "work-limit";
      break;
    }
    if (s > 0) {
      // Gray step s flips the outer vertex at the position of s's lowest set bit.
      const j = 31 - Math.clz32(s & -s);
      const x = outer[j];
      outerCut += gain[x];
      gain[x] = -gain[x];
      const sx = (side[x] ^= 1);
      for (let k = offsets[x]; k < offsets[x + 1]; k++) {
        const u = neighbors[k];
        const w = weights === null ? 1 : weights[k];
        const bu = blockBit[u];
        if (bu >= 0) {
          if (sx === 1) {
            toSideOne += w;
            t[bu] -= 2 * w;
          } else {
            toSideOne -= w;
            t[bu] += 2 * w;
          }
        } else if (side[u] === sx) gain[u] += 2 * w;
        else gain[u] -= 2 * w;
      }
    }
    const base = outerCut + toSideOne;
    if (base + block.quickBound(t) > best) {
      const c = block.maximise(t, best - base, out);
      if (c >= 0) {
        best = base + out[0];
        bestStep = s;
        bestPattern = c;
      }
    }
    done = s + 1;
    // The slack of src/cut/exact/exact-slack.ts assumes at most GRAY_RESYNC_STEPS steps of drift.
    if (!exactSums && s % GRAY_RESYNC_STEPS === GRAY_RESYNC_STEPS - 1) resync();
    if (s % checkEvery === 0) {
      const now = nowSeconds();
      if (now > deadline && s + 1 < steps) {
        status = "time-limit";
        break;
      }
      if (onProgress !== undefined && now >= nextReport) {
        nextReport = now + PROGRESS_INTERVAL;
        onProgress({ lower: best, graySteps: s + 1, branchNodes: 0, seconds: now - t0 });
      }
    }
  }

  // Rebuild the winning partition: outer sides are the bits of the Gray code of the step.
  const partition = new Uint8Array(n);
  const gray = bestStep ^ Math.floor(bestStep / 2);
  for (let j = 0; j < outer.length; j++) partition[outer[j]] = Math.floor(gray / 2 ** j) % 2;
  for (let i = 0; i < b; i++) partition[blockVerts[i]] = (bestPattern >>> i) & 1;
  partition[fixed] = 0;
  // A partial enumeration proves nothing beyond the trivial bound.
  const upper = status === "optimal" ? null : positiveWeightSum(graph);
  return record(graph, partition, status, upper, done, t0, seed, b, fixed);
}

function record(
  graph: Graph,
  partition: Uint8Array,
  status: ExactStatus,
  upper: number | null,
  nodes: number,
  t0: number,
  seed: number,
  blockSize: number,
  fixed = 0,
): ExactCutRecord {
  const exactSums = hasIntegerWeights(graph);
  // Non-integer weights: the running sums are exact only up to rounding, so the proven upper
  // bound carries the search's slack (src/cut/exact/exact-slack.ts), rounded up.
  const slack = exactSums ? 0 : graphSlack(graph);
  const search = { status, upper, slack, graySteps: nodes, branchNodes: 0, t0, solverSeed: seed };
  return exactRecord("exact-gray", graph, partition, search, { blockSize, fixedVertex: fixed, integerWeights: exactSums, tolerance: slack, workUsed: nodes });
}
