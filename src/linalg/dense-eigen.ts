// Full eigen-decomposition of a small dense symmetric matrix through ml-matrix
// (Householder tridiagonalisation + QL). Cubic time and array-of-rows storage: keep n small.

import { createRequire } from "node:module";
import { InputError } from "../errors.js";

type MlMatrix = typeof import("ml-matrix");
let ml: MlMatrix | null = null;

/**
 * ml-matrix, loaded on first use through require. Its ES-module entry is a facade over the
 * CommonJS build, and importing it that way cost 50–110 ms of CPU per thread (Node 20 scans the
 * 150 kB CommonJS file for its exports) against about 10 ms by require, paid by every sweep
 * worker and CLI start even when no dense decomposition runs (bench/sweep.bench.mjs, startup_s).
 */
function mlMatrix(): MlMatrix {
  ml ??= createRequire(import.meta.url)("ml-matrix") as MlMatrix;
  return ml;
}

export interface DenseEigen {
  n: number;
  /** Eigenvalues in ascending order. */
  values: Float64Array;
  /** Orthonormal eigenvectors: vector k occupies vectors[k·n .. (k+1)·n), matching values[k]. */
  vectors: Float64Array;
}

/** Eigenvalues and eigenvectors of the symmetric matrix `a` (row-major n×n; the lower triangle is mirrored). */
export function symmetricEigen(a: Float64Array, n: number): DenseEigen {
  if (!Number.isInteger(n) || n < 0 || a.length !== n * n) {
    throw new InputError(`symmetricEigen: expected a row-major ${n}×${n} matrix, got ${a.length} entries`);
  }
  if (n === 0) return { n, values: new Float64Array(0), vectors: new Float64Array(0) };
  const { EigenvalueDecomposition, Matrix } = mlMatrix();
  const m = new Matrix(n, n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      const x = a[i * n + j];
      if (!Number.isFinite(x)) throw new InputError(`symmetricEigen: entry (${i}, ${j}) is ${x}`);
      m.set(i, j, x);
      m.set(j, i, x);
    }
  }
  const evd = new EigenvalueDecomposition(m, { assumeSymmetric: true });
  const raw = evd.realEigenvalues;
  const q = evd.eigenvectorMatrix;
  // Sort explicitly rather than rely on the library's output order.
  const order = Array.from({ length: n }, (_, k) => k).sort((x, y) => raw[x] - raw[y]);
  const values = new Float64Array(n);
  const vectors = new Float64Array(n * n);
  for (let k = 0; k < n; k++) {
    const c = order[k];
    values[k] = raw[c];
    for (let i = 0; i < n; i++) vectors[k * n + i] = q.get(i, c);
  }
  return { n, values, vectors };
}
