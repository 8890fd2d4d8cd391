// Symmetric linear operators for the eigen-solvers: adjacency A, Laplacian L = D − W and
// L − Diag(y) of a (weighted) graph as CSR matrix–vector products, plus dense matrices.

import { InputError } from "../errors.js";
import type { Graph } from "../graph/graph.js";

/** A real symmetric n×n matrix known only through products: out ← M·x (x and out distinct). */
export interface SymmetricOperator {
  readonly n: number;
  apply(x: Float64Array, out: Float64Array): void;
}

/** Weighted degrees d_i = Σ_j w_ij (negative weights included): the diagonal of L. */
export function weightedDegrees(graph: Graph): Float64Array {
  const d = new Float64Array(graph.n);
  const { offsets, weights } = graph;
  for (let v = 0; v < graph.n; v++) {
    if (weights === null) d[v] = offsets[v + 1] - offsets[v];
    else {
      let s = 0;
      for (let i = offsets[v]; i < offsets[v + 1]; i++) s += weights[i];
      d[v] = s;
    }
  }
  return d;
}

/** out ← Diag(diag)·x + sign·W·x over the CSR arcs; the one sparse kernel every builder uses. */
function csrOperator(graph: Graph, diag: Float64Array | null, sign: 1 | -1): SymmetricOperator {
  const { n, offsets, neighbors, weights } = graph;
  return {
    n,
    apply(x: Float64Array, out: Float64Array): void {
      for (let v = 0; v < n; v++) {
        let s = 0;
        const end = offsets[v + 1];
        if (weights === null) for (let i = offsets[v]; i < end; i++) s += x[neighbors[i]];
        else for (let i = offsets[v]; i < end; i++) s += weights[i] * x[neighbors[i]];
        out[v] = (diag === null ? 0 : diag[v] * x[v]) + sign * s;
      }
    },
  };
}

/** The (weighted) adjacency matrix W. */
export function adjacencyOperator(graph: Graph): SymmetricOperator {
  return csrOperator(graph, null, 1);
}

/** The weighted Laplacian L = D − W. */
export function laplacianOperator(graph: Graph): SymmetricOperator {
  return csrOperator(graph, weightedDegrees(graph), -1);
}

/** The signless Laplacian Q = D + W. */
export function signlessLaplacianOperator(graph: Graph): SymmetricOperator {
  return csrOperator(graph, weightedDegrees(graph), 1);
}

/** L − Diag(y): its largest eigenvalue is the shift that makes y a feasible max-cut SDP dual. */
export function shiftedLaplacianOperator(graph: Graph, y: ArrayLike<number>): SymmetricOperator {
  if (y.length !== graph.n) {
    throw new InputError(`shiftedLaplacianOperator: \`y\` has ${y.length} entries but the graph has ${graph.n} vertices`);
  }
  const d = weightedDegrees(graph);
  for (let v = 0; v < graph.n; v++) d[v] -= y[v];
  return csrOperator(graph, d, -1);
}

/** A dense symmetric matrix stored row-major (only symmetry is assumed, not checked). */
export function denseOperator(a: Float64Array, n: number): SymmetricOperator {
  if (a.length !== n * n) throw new InputError(`denseOperator: expected ${n * n} entries, got ${a.length}`);
  return {
    n,
    apply(x: Float64Array, out: Float64Array): void {
      for (let i = 0; i < n; i++) {
        let s = 0;
        const row = i * n;
        for (let j = 0; j < n; j++) s += a[row + j] * x[j];
        out[i] = s;
      }
    },
  };
}

/** The operator's matrix, row-major n×n, read off by applying it to unit vectors (for small n). */
export function operatorToDense(op: SymmetricOperator): Float64Array {
  const n = op.n;
  const a = new Float64Array(n * n);
  const e = new Float64Array(n);
  const col = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    e[j] = 1;
    op.apply(e, col);
    e[j] = 0;
    for (let i = 0; i < n; i++) a[i * n + j] = col[i];
  }
  return a;
}
