// The max-cut problem left at a node of a branch-and-bound tree: some vertices fixed to a side, the
// rest free. Fixed vertices collapse into one vertex z standing for side 0, so a node is an ordinary
// weighted graph (signed weights) plus a constant, and every bound for graphs applies to it.
//
// Why it is exact: an edge uv with v fixed on side 0 is cut iff u is not with z (weight +w on uz);
// with v on side 1 it is cut iff u is with z, i.e. w − [u not with z]·w (constant w, weight −w on
// uz). Edges among fixed vertices give a constant. So for every assignment of the free vertices,
// cut(G) = offset + cut(reduced) with z on side 0 (common practice, no source).

import { InputError } from "../../errors.js";
import { buildGraph } from "../../graph/builder.js";
import type { Graph } from "../../graph/graph.js";
import { TRIANGLE_SIGNS } from "../relaxation/triangle-dual.js";

export interface ReducedProblem {
  /** z = vertex 0, then the free vertices in increasing order. */
  graph: Graph;
  /** Cut weight fixed by the node: edges among fixed vertices and the constant parts above. */
  offset: number;
  /** free[i] is the original vertex of reduced vertex i + 1. */
  free: Int32Array;
}

/**
 * The reduced problem of a node: `side[v]` is 0 or 1 for fixed vertices, 255 for free ones.
 * Integer weights stay integers, so every reduced sum is exact (the tree search requires that).
 */
export function reducedProblem(graph: Graph, side: Uint8Array): ReducedProblem {
  const n = graph.n;
  if (side.length !== n) throw new InputError(`reducedProblem: \`side\` has ${side.length} entries, the graph ${n} vertices`);
  const pos = new Int32Array(n).fill(-1);
  let count = 0;
  for (let v = 0; v < n; v++) if (side[v] === 255) pos[v] = ++count;
  const free = new Int32Array(count);
  for (let v = 0; v < n; v++) if (pos[v] > 0) free[pos[v] - 1] = v;
  const toZ = new Float64Array(count + 1);
  const us: number[] = [], vs: number[] = [], ws: number[] = [];
  let offset = 0;
  graph.forEachEdge((u, v, w) => {
    const fu = side[u] === 255, fv = side[v] === 255;
    if (fu && fv) {
      us.push(pos[u]);
      vs.push(pos[v]);
      ws.push(w);
    } else if (!fu && !fv) {
      if (side[u] !== side[v]) offset += w;
    } else {
      const f = fu ? u : v, fixed = fu ? v : u;
      if (side[fixed] === 0) toZ[pos[f]] += w;
      else {
        toZ[pos[f]] -= w;
        offset += w;
      }
    }
  });
  for (let i = 1; i <= count; i++) {
    if (toZ[i] !== 0) {
      us.push(0);
      vs.push(i);
      ws.push(toZ[i]);
    }
  }
  return { graph: buildGraph(count + 1, us, vs, ws).graph, offset, free };
}

/**
 * A parent node's triangle inequalities (four integers each, as in a TriangleCertificate) written
 * for a child that fixes reduced vertex `pick` (≥ 1) on `side`: in the child X_{a,pick} = σ·X_{a,z}
 * (σ = +1 on side 0, z's side, else −1), so an inequality through `pick` becomes one on the triple
 * (z, a, b) with the same sign product (still one of TRIANGLE_SIGNS); one through z and `pick` loses
 * a pair and is dropped. Indices above `pick` move down by one (the child's reduced graph drops it).
 * Every mapped inequality holds for all cuts of the child, so the multipliers are a valid warm start
 * (common practice, no source).
 */
export function mapTrianglesAfterFix(triangles: ArrayLike<number>, mu: ArrayLike<number>, pick: number, side: number): { triangles: Int32Array; mu: Float64Array } {
  const sigma = side === 0 ? 1 : -1;
  const outT: number[] = [], outM: number[] = [];
  const seen = new Map<string, number>();
  const at = (x: number): number => (x > pick ? x - 1 : x);
  for (let t = 0; t < mu.length; t++) {
    const i = triangles[4 * t], j = triangles[4 * t + 1], k = triangles[4 * t + 2];
    const s = TRIANGLE_SIGNS[triangles[4 * t + 3]];
    let tri: [number, number, number], signs: [number, number, number];
    if (i !== pick && j !== pick && k !== pick) {
      tri = [at(i), at(j), at(k)];
      signs = [s[0], s[1], s[2]];
    } else {
      // Pairs (ij, ik, jk); the two vertices other than pick are a < b, with pair signs s_ab, s_a·pick, s_b·pick.
      let a: number, b: number, sab: number, sap: number, sbp: number;
      if (k === pick) [a, b, sab, sap, sbp] = [i, j, s[0], s[1], s[2]];
      else if (j === pick) [a, b, sab, sap, sbp] = [i, k, s[1], s[0], s[2]];
      else [a, b, sab, sap, sbp] = [j, k, s[2], s[0], s[1]];
      if (a === 0) continue;
      // Triple (z = 0, a, b): pairs (za, zb, ab).
      tri = [0, at(a), at(b)];
      signs = [sap * sigma, sbp * sigma, sab];
    }
    const p = TRIANGLE_SIGNS.findIndex((q) => q[0] === signs[0] && q[1] === signs[1] && q[2] === signs[2]);
    const key = `${tri[0]},${tri[1]},${tri[2]},${p}`;
    const prev = seen.get(key);
    if (prev !== undefined) {
      outM[prev] += mu[t];
      continue;
    }
    seen.set(key, outM.length);
    outT.push(tri[0], tri[1], tri[2], p);
    outM.push(mu[t]);
  }
  return { triangles: Int32Array.from(outT), mu: Float64Array.from(outM) };
}

/**
 * Triangle inequalities of a graph written for its reduced problem at the tree's root (one vertex
 * `rootVertex` fixed on side 0, so z is that vertex and the others keep their order as reduced
 * vertices 1..n−1): a relabelling only, each triple re-sorted with its pair signs carried along, so
 * every inequality and its multiplier mean the same thing (common practice, no source).
 */
export function trianglesAtRoot(n: number, rootVertex: number, triangles: ArrayLike<number>, mu: ArrayLike<number>): { triangles: Int32Array; mu: Float64Array } {
  const label = (v: number): number => (v === rootVertex ? 0 : v < rootVertex ? v + 1 : v);
  const outT: number[] = [], outM: number[] = [];
  for (let t = 0; t < mu.length; t++) {
    const old = [triangles[4 * t], triangles[4 * t + 1], triangles[4 * t + 2]];
    if (!old.every((v) => Number.isInteger(v) && v >= 0 && v < n)) throw new InputError(`trianglesAtRoot: inequality ${t} names a vertex outside 0..${n - 1}`);
    const s = TRIANGLE_SIGNS[triangles[4 * t + 3]];
    // Pair signs by unordered pair: (ij, ik, jk).
    const sign = new Map<string, number>([[`${old[0]},${old[1]}`, s[0]], [`${old[0]},${old[2]}`, s[1]], [`${old[1]},${old[2]}`, s[2]]]);
    const pairSign = (a: number, b: number): number => sign.get(`${a},${b}`) ?? sign.get(`${b},${a}`)!;
    const byNew = [...old].sort((a, b) => label(a) - label(b));
    const signs = [pairSign(byNew[0], byNew[1]), pairSign(byNew[0], byNew[2]), pairSign(byNew[1], byNew[2])];
    const p = TRIANGLE_SIGNS.findIndex((q) => q[0] === signs[0] && q[1] === signs[1] && q[2] === signs[2]);
    outT.push(label(byNew[0]), label(byNew[1]), label(byNew[2]), p);
    outM.push(mu[t]);
  }
  return { triangles: Int32Array.from(outT), mu: Float64Array.from(outM) };
}
