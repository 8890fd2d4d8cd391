// A small simple graph that changes one edge at a time: bitset rows for O(1) adjacency and
// neighbourhood intersections, and an edge list with positions for O(1) uniform edge picks.

import { invalidParameter } from "../errors.js";
import { buildGraph } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";

/** Largest n the search takes: its pair table holds n² entries and each move rebuilds a CSR graph. */
export const HUNT_MAX_VERTICES = 256;

export class MutableGraph {
  readonly n: number;
  /** 32-bit words per bitset row. */
  readonly words: number;
  /** rows[u·words + (v >>> 5)] bit (v & 31): u ~ v. */
  readonly rows: Uint32Array;
  readonly deg: Int32Array;
  /** The edges (u < v) in no particular order; m of them are live. */
  private readonly eu: Int32Array;
  private readonly ev: Int32Array;
  /** slot[u·n + v] = index in the edge list, −1 for a non-edge. */
  private readonly slot: Int32Array;
  m = 0;

  constructor(n: number) {
    if (!(Number.isInteger(n) && n >= 1 && n <= HUNT_MAX_VERTICES)) throw invalidParameter("MutableGraph", "n", `should be an integer between 1 and ${HUNT_MAX_VERTICES}`, n);
    this.n = n;
    this.words = Math.ceil(n / 32);
    this.rows = new Uint32Array(n * this.words);
    this.deg = new Int32Array(n);
    const pairs = (n * (n - 1)) / 2;
    this.eu = new Int32Array(Math.max(1, pairs));
    this.ev = new Int32Array(Math.max(1, pairs));
    this.slot = new Int32Array(n * n).fill(-1);
  }

  /** A copy of an unweighted simple graph (weights, if any, are refused by the caller). */
  static of(g: Graph): MutableGraph {
    const h = new MutableGraph(g.n);
    for (let u = 0; u < g.n; u++) for (let k = g.offsets[u]; k < g.offsets[u + 1]; k++) if (g.neighbors[k] > u) h.add(u, g.neighbors[k]);
    return h;
  }

  clone(): MutableGraph {
    const h = new MutableGraph(this.n);
    for (let i = 0; i < this.m; i++) h.add(this.eu[i], this.ev[i]);
    return h;
  }

  has(u: number, v: number): boolean {
    return ((this.rows[u * this.words + (v >>> 5)] >>> (v & 31)) & 1) === 1;
  }

  /** Add the non-edge uv (u ≠ v). */
  add(u: number, v: number): void {
    const a = Math.min(u, v), b = Math.max(u, v);
    this.rows[a * this.words + (b >>> 5)] |= 1 << (b & 31);
    this.rows[b * this.words + (a >>> 5)] |= 1 << (a & 31);
    this.deg[a]++;
    this.deg[b]++;
    this.eu[this.m] = a;
    this.ev[this.m] = b;
    this.slot[a * this.n + b] = this.m;
    this.m++;
  }

  /** Remove the edge uv. */
  remove(u: number, v: number): void {
    const a = Math.min(u, v), b = Math.max(u, v);
    this.rows[a * this.words + (b >>> 5)] &= ~(1 << (b & 31));
    this.rows[b * this.words + (a >>> 5)] &= ~(1 << (a & 31));
    this.deg[a]--;
    this.deg[b]--;
    const i = this.slot[a * this.n + b];
    this.slot[a * this.n + b] = -1;
    this.m--;
    if (i !== this.m) {
      const x = this.eu[this.m], y = this.ev[this.m];
      this.eu[i] = x;
      this.ev[i] = y;
      this.slot[x * this.n + y] = i;
    }
  }

  /** The i-th live edge (0 ≤ i < m) as [u, v] with u < v. */
  edgeAt(i: number): [number, number] {
    return [this.eu[i], this.ev[i]];
  }

  /** The neighbours of u, ascending. */
  neighbours(u: number): number[] {
    const out: number[] = [];
    const base = u * this.words;
    for (let w = 0; w < this.words; w++) {
      let x = this.rows[base + w];
      while (x !== 0) {
        const low = x & -x;
        out.push((w << 5) + 31 - Math.clz32(low));
        x ^= low;
      }
    }
    return out;
  }

  /** The CSR graph of the current edges. */
  toGraph(): Graph {
    return buildGraph(this.n, this.eu.subarray(0, this.m), this.ev.subarray(0, this.m)).graph;
  }
}
