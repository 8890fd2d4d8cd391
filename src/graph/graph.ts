// The compact immutable graph every algorithm in halfplus runs on: compressed sparse
// rows (CSR) over typed arrays, undirected, simple, neighbour lists sorted ascending.
// Each edge {u, v} is stored twice (u→v and v→u); weights, when present, run parallel
// to `neighbors`. Build one with `buildGraph` / `EdgeBuffer` (src/graph/builder.ts).

export class Graph {
  /** Number of vertices; ids are 0..n-1. */
  readonly n: number;
  /** Number of undirected edges. */
  readonly m: number;
  /** offsets[v]..offsets[v+1] indexes v's neighbours; length n+1. */
  readonly offsets: Int32Array;
  /** Concatenated sorted neighbour lists; length 2m. */
  readonly neighbors: Int32Array;
  /** Edge weights parallel to `neighbors`, or null when every edge has weight 1. */
  readonly weights: Float64Array | null;
  /** Sum of edge weights (m when unweighted). */
  readonly totalWeight: number;
  /**
   * Results derived from this graph, one slot per kind (src/graph/per-graph.ts). Not part of the
   * graph's value: a private field, so copies, comparisons and serialisation leave it out (and,
   * unlike a non-enumerable property, it costs the constructor nothing extra, where defineProperty cost ~400 ns a graph). Kept on the graph
   * rather than in WeakMaps: a sweep makes a few graphs per tiny job, and each WeakMap entry of a
   * short-lived key cost the garbage collector more than the job's own search.
   */
  readonly #derived: unknown[] = [];

  /** Use `buildGraph`; this constructor trusts its arguments. */
  constructor(n: number, offsets: Int32Array, neighbors: Int32Array, weights: Float64Array | null) {
    this.n = n;
    this.offsets = offsets;
    this.neighbors = neighbors;
    this.weights = weights;
    this.m = neighbors.length / 2;
    let w = 0;
    if (weights === null) w = this.m;
    else for (let i = 0; i < weights.length; i++) w += weights[i];
    // Each weight is stored twice; halve once, after summing, so integer weights stay exact.
    this.totalWeight = weights === null ? w : w / 2;
    Object.freeze(this);
  }

  /** The slots of results derived from this graph (src/graph/per-graph.ts only). */
  get derived(): unknown[] {
    return this.#derived;
  }

  get weighted(): boolean {
    return this.weights !== null;
  }

  degree(v: number): number {
    return this.offsets[v + 1] - this.offsets[v];
  }

  /** Sorted neighbours of v as a view (no copy). */
  neighborsOf(v: number): Int32Array {
    return this.neighbors.subarray(this.offsets[v], this.offsets[v + 1]);
  }

  /** Weighted degree of v (the degree when unweighted). */
  weightedDegree(v: number): number {
    if (this.weights === null) return this.degree(v);
    let s = 0;
    for (let i = this.offsets[v]; i < this.offsets[v + 1]; i++) s += this.weights[i];
    return s;
  }

  /** Position of v in u's neighbour list, or -1 (binary search, O(log deg u)). */
  arcIndex(u: number, v: number): number {
    let lo = this.offsets[u];
    let hi = this.offsets[u + 1] - 1;
    const nb = this.neighbors;
    while (lo <= hi) {
      const mid = (lo + hi) >>> 1;
      const x = nb[mid];
      if (x === v) return mid;
      if (x < v) lo = mid + 1;
      else hi = mid - 1;
    }
    return -1;
  }

  hasEdge(u: number, v: number): boolean {
    return this.arcIndex(u, v) >= 0;
  }

  /** Weight of edge {u, v}, or 0 when absent. */
  edgeWeight(u: number, v: number): number {
    const a = this.arcIndex(u, v);
    if (a < 0) return 0;
    return this.weights === null ? 1 : this.weights[a];
  }

  /** Calls f(u, v, w) once per edge with u < v, in order of u then v. */
  forEachEdge(f: (u: number, v: number, w: number) => void): void {
    const { offsets, neighbors, weights } = this;
    for (let u = 0; u < this.n; u++) {
      for (let i = offsets[u]; i < offsets[u + 1]; i++) {
        const v = neighbors[i];
        if (v > u) f(u, v, weights === null ? 1 : weights[i]);
      }
    }
  }

  /** Edge list with u < v, sorted by (u, v): plain typed arrays for serialisation and interop. */
  edgeArrays(): { us: Int32Array; vs: Int32Array; ws: Float64Array | null } {
    const us = new Int32Array(this.m);
    const vs = new Int32Array(this.m);
    const ws = this.weights === null ? null : new Float64Array(this.m);
    let k = 0;
    const { offsets, neighbors, weights } = this;
    for (let u = 0; u < this.n; u++) {
      for (let i = offsets[u]; i < offsets[u + 1]; i++) {
        const v = neighbors[i];
        if (v > u) {
          us[k] = u;
          vs[k] = v;
          if (ws !== null) ws[k] = weights![i];
          k++;
        }
      }
    }
    return { us, vs, ws };
  }
}

/** The plain parts of a graph: what crosses a worker-thread boundary (structured clone). */
export interface GraphParts {
  n: number;
  offsets: Int32Array;
  neighbors: Int32Array;
  weights: Float64Array | null;
}

export function graphToParts(g: Graph): GraphParts {
  return { n: g.n, offsets: g.offsets, neighbors: g.neighbors, weights: g.weights };
}

/** Rebuild a Graph from parts produced by `graphToParts` (trusted: no validation). */
export function graphFromParts(p: GraphParts): Graph {
  return new Graph(p.n, p.offsets, p.neighbors, p.weights);
}
