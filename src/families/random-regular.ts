// Random simple d-regular graph on n vertices. Small degree: the pairing (configuration) model
// with rejection of loops and multi-edges, exactly uniform. Larger degree: the Steger–Wormald
// algorithm, asymptotically uniform. Degree above (n−1)/2: the complement of a random
// (n−1−d)-regular graph. The result is checked to be simple and d-regular before it is returned.

import { invalidParameter } from "../errors.js";
import { buildGraph } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import type { Rng } from "../random/prng.js";
import { MAX_RANDOM_VERTICES } from "./gnp.js";
import { complement } from "./operations/complement.js";
import { buildRandomTyped } from "./typed-build.js";
import { defineFamily } from "./types.js";

/** How the random regular graph is sampled (see the family's `sampler` parameter). */
export type RegularSampler = "auto" | "pairing" | "steger-wormald";

/**
 * A pairing is simple with probability about exp(−(d² − 1)/4) (Bender & Canfield 1978;
 * Bollobás 1980): ~42 tries at d = 4 (cheap with early abort), ~6300 at d = 6.
 */
export const AUTO_PAIRING_MAX_DEGREE = 4;
export const PAIRING_MAX_DEGREE = 6;

/** Consecutive rejections before Steger–Wormald lists the remaining suitable pairs outright. */
const FAILS_BEFORE_LISTING = 64;
/** Listing the suitable pairs among R remaining vertices costs R²; allowed outright up to this R. */
const LISTING_MAX_VERTICES = 4096;
const TWO_POW_53 = 9007199254740992;

/** Per-attempt state, allocated once per call: points, partial adjacency and scratch arrays. */
interface Workspace {
  n: number;
  d: number;
  /** Unpaired points, each stored as its vertex id. */
  points: Int32Array;
  /** adj[v·d .. v·d + deg[v]) are v's partners so far. */
  adj: Int32Array;
  deg: Int32Array;
  /** Adjacency bitset (n·words 32-bit words) when d is large and n small enough; else null. */
  bits: Uint32Array | null;
  words: number;
  count: Int32Array;
  verts: Int32Array;
  mark: Int32Array;
  stamp: number;
}

function workspace(n: number, d: number): Workspace {
  const words = Math.ceil(n / 32);
  // The bitset makes adjacency O(1) where scanning d partners would dominate.
  const bits = d > 32 && n <= 16384 ? new Uint32Array(n * words) : null;
  return {
    n, d, points: new Int32Array(n * d), adj: new Int32Array(n * d), deg: new Int32Array(n), bits, words,
    count: new Int32Array(n), verts: new Int32Array(n), mark: new Int32Array(n), stamp: 0,
  };
}

function reset(ws: Workspace): void {
  const { n, d, points } = ws;
  for (let v = 0, k = 0; v < n; v++) for (let i = 0; i < d; i++) points[k++] = v;
  ws.deg.fill(0);
  ws.bits?.fill(0);
}

function adjacent(ws: Workspace, u: number, v: number): boolean {
  if (ws.bits !== null) return ((ws.bits[u * ws.words + (v >>> 5)] >>> (v & 31)) & 1) === 1;
  const { adj, d } = ws;
  const end = u * d + ws.deg[u];
  for (let i = u * d; i < end; i++) if (adj[i] === v) return true;
  return false;
}

function join(ws: Workspace, u: number, v: number): void {
  const { adj, d, deg } = ws;
  adj[u * d + deg[u]++] = v;
  adj[v * d + deg[v]++] = u;
  if (ws.bits !== null) {
    ws.bits[u * ws.words + (v >>> 5)] |= 1 << (v & 31);
    ws.bits[v * ws.words + (u >>> 5)] |= 1 << (u & 31);
  }
}

/**
 * One uniform random pairing, built point by point (the last unpaired point takes a uniform
 * partner); abandoned at the first loop or repeated pair, since the whole pairing is rejected then.
 */
function pairingAttempt(ws: Workspace, rng: Rng): boolean {
  reset(ws);
  const pts = ws.points;
  for (let len = pts.length; len > 0; len -= 2) {
    const u = pts[len - 1];
    const j = rng.nextInt(len - 1);
    const v = pts[j];
    pts[j] = pts[len - 2];
    if (u === v || adjacent(ws, u, v)) return false;
    join(ws, u, v);
  }
  return true;
}

/** Remove positions i ≠ j from the first `len` unpaired points (larger position first). */
function removeTwo(pts: Int32Array, len: number, i: number, j: number): void {
  const hi = i > j ? i : j;
  const lo = i > j ? j : i;
  pts[hi] = pts[len - 1];
  pts[lo] = pts[len - 2];
}

/** Position of the k-th (0-based) unpaired point of vertex v. */
function nthPointOf(pts: Int32Array, len: number, v: number, k: number): number {
  for (let i = 0; i < len; i++) if (pts[i] === v && k-- === 0) return i;
  throw new Error("random-regular: point bookkeeping is inconsistent");
}

/**
 * Pair one suitable pair of points chosen uniformly by listing all of them (the same law as
 * rejection sampling). Returns 1 when paired, 0 when no suitable pair is left (restart), −1
 * when listing would cost more than `budget` (the caller keeps sampling).
 */
function listingStep(ws: Workspace, len: number, budget: number, rng: Rng): number {
  const { points: pts, count, verts, mark, adj, d, deg } = ws;
  let r = 0;
  for (let i = 0; i < len; i++) if (count[pts[i]]++ === 0) verts[r++] = pts[i];
  const clear = (): void => {
    for (let a = 0; a < r; a++) count[verts[a]] = 0;
  };
  if (r > LISTING_MAX_VERTICES && r * r > budget) {
    clear();
    return -1;
  }
  // Two passes over the vertex pairs (weight count·count each): total, then the chosen one.
  let total = 0;
  for (let pass = 0; pass < 2; pass++) {
    let target = 0;
    if (pass === 1) {
      if (total === 0 || total >= TWO_POW_53) {
        clear();
        return total === 0 ? 0 : -1;
      }
      target = rng.nextBigInt53(total);
    }
    let acc = 0;
    for (let a = 0; a < r; a++) {
      const x = verts[a];
      if (ws.stamp === 0x7fffffff) {
        mark.fill(0); // stamps must stay distinct Int32 values
        ws.stamp = 0;
      }
      const stamp = ++ws.stamp;
      for (let i = x * d; i < x * d + deg[x]; i++) mark[adj[i]] = stamp;
      for (let b = a + 1; b < r; b++) {
        const y = verts[b];
        if (mark[y] === stamp) continue;
        acc += count[x] * count[y];
        if (pass === 1 && acc > target) {
          const i = nthPointOf(pts, len, x, rng.nextInt(count[x]));
          const j = nthPointOf(pts, len, y, rng.nextInt(count[y]));
          clear();
          join(ws, x, y);
          removeTwo(pts, len, i, j);
          return 1;
        }
      }
    }
    total = acc;
  }
  throw new Error("random-regular: weighted choice ran past its total");
}

/**
 * Steger & Wormald (1999): repeatedly join a uniformly random suitable pair of unpaired points
 * (distinct vertices, not yet adjacent); restart when none is left.
 */
function stegerWormaldAttempt(ws: Workspace, rng: Rng): boolean {
  reset(ws);
  const pts = ws.points;
  let len = pts.length;
  let fails = 0;
  let budget = FAILS_BEFORE_LISTING;
  while (len > 0) {
    if (fails < budget) {
      const i = rng.nextInt(len);
      let j = rng.nextInt(len - 1);
      if (j >= i) j++;
      const u = pts[i];
      const v = pts[j];
      if (u !== v && !adjacent(ws, u, v)) {
        join(ws, u, v);
        removeTwo(pts, len, i, j);
        len -= 2;
        fails = 0;
        budget = FAILS_BEFORE_LISTING;
      } else fails++;
      continue;
    }
    const step = listingStep(ws, len, budget, rng);
    if (step === 0) return false;
    if (step === 1) len -= 2;
    else budget *= 2; // listing too costly for now: sample longer, list once it pays
    fails = 0;
  }
  return true;
}

function usesPairing(d: number, sampler: RegularSampler): boolean {
  return sampler === "pairing" || (sampler === "auto" && d <= AUTO_PAIRING_MAX_DEGREE);
}

/** d-regular graph for d ≤ (n − 1)/2, by the sampler chosen. */
function sampleDirect(n: number, d: number, sampler: RegularSampler, rng: Rng): Graph {
  const m = (n * d) / 2;
  const us = new Int32Array(m);
  const vs = new Int32Array(m);
  if (d > 0) {
    const ws = workspace(n, d);
    const attempt = usesPairing(d, sampler) ? pairingAttempt : stegerWormaldAttempt;
    while (!attempt(ws, rng));
    for (let u = 0, k = 0; u < n; u++) {
      for (let i = u * d; i < u * d + d; i++) {
        const v = ws.adj[i];
        if (v > u) {
          us[k] = u;
          vs[k] = v;
          k++;
        }
      }
    }
  }
  // The strict builder rejects loops and repeated edges: simplicity is checked there.
  return buildGraph(n, us, vs).graph;
}

function assertRegular(g: Graph, d: number): void {
  for (let v = 0; v < g.n; v++) {
    if (g.degree(v) !== d) throw new Error(`random-regular: vertex ${v} has degree ${g.degree(v)}, expected ${d}`);
  }
}

function sampleRegular(n: number, d: number, sampler: RegularSampler, rng: Rng): Graph {
  const dual = n - 1 - d;
  // The complement is a bijection between d- and (n−1−d)-regular graphs: it preserves uniformity.
  const g = dual < d ? complement(sampleDirect(n, dual, sampler, rng)) : sampleDirect(n, d, sampler, rng);
  assertRegular(g, d);
  return g;
}

export const randomRegularFamily = defineFamily({
  name: "random-regular",
  summary: "random simple d-regular graph on n vertices",
  params: [
    { name: "n", type: "integer", description: "number of vertices", min: 1, max: MAX_RANDOM_VERTICES },
    { name: "d", type: "integer", description: "degree, below n, with n·d even", min: 0 },
    {
      name: "sampler",
      type: "string",
      description: `pairing: exactly uniform, for min(d, n−1−d) ≤ ${PAIRING_MAX_DEGREE}; steger-wormald: asymptotically uniform; auto: pairing up to degree ${AUTO_PAIRING_MAX_DEGREE}`,
      default: "auto",
      choices: ["auto", "pairing", "steger-wormald"],
    },
  ],
  random: true,
  validate: (params) => {
    const n = params.n;
    const d = params.d;
    if (d >= n) throw invalidParameter("random-regular", "d", `should be an integer between 0 and n − 1 = ${n - 1}`, d);
    if ((n * d) % 2 !== 0) throw invalidParameter("random-regular", "d", `n·d should be even (n = ${n} is odd, so d must be even)`, d);
    const effective = Math.min(d, n - 1 - d);
    if (params.sampler === "pairing" && effective > PAIRING_MAX_DEGREE) {
      throw invalidParameter(
        "random-regular",
        "sampler",
        `pairing needs min(d, n−1−d) ≤ ${PAIRING_MAX_DEGREE} (a pairing is simple with probability about exp(−(d²−1)/4)); use steger-wormald`,
        params.sampler,
      );
    }
  },
  freeOf: () => [],
  predictedSize: (params) => {
    const n = params.n;
    const d = params.d;
    return { n, m: (n * d) / 2, mExact: true, minDegree: d, maxDegree: d };
  },
  build: (params, ctx) => sampleRegular(params.n, params.d, params.sampler, ctx.rng),
  notes: [
    "The pairing model conditioned on simplicity is exactly uniform over simple d-regular graphs (Bender & Canfield 1978; Bollobás 1980).",
    "Steger & Wormald, Generating random regular graphs quickly, Combin. Probab. Comput. 8 (1999): asymptotically uniform for d = o(n^{1/28}), extended by Kim & Vu (2006) to d ≪ n^{1/3}; not exactly uniform.",
    "Degrees above (n−1)/2 use the complement of the (n−1−d)-regular case.",
  ],
});

/** Random d-regular graph from a graph seed (spec `random-regular:n=…,d=…,seed=…`) or a caller's Rng. */
export function randomRegular(n: number, d: number, graphSeed: number | Rng = 0, sampler: RegularSampler = "auto"): Graph {
  return buildRandomTyped(randomRegularFamily, { n, d, sampler }, graphSeed);
}
