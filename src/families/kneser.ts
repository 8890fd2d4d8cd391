// Kneser graph KG(n, k): the k-subsets of {0..n−1}, adjacent iff disjoint. Subsets are bitmasks in
// colex order (vertex i = the i-th k-subset); neighbours are enumerated inside the complement only.

import { invalidParameter } from "../errors.js";
import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { resolveTyped } from "./typed-build.js";
import { defineFamily } from "./types.js";

/** Binomial coefficient C(a, b) as a double (exact below 2^53). */
export function binomial(a: number, b: number): number {
  if (b < 0 || b > a) return 0;
  b = Math.min(b, a - b);
  let r = 1;
  for (let i = 1; i <= b; i++) r = (r * (a - b + i)) / i;
  return Math.round(r);
}

/** The k-subset of {0..n−1} that vertex `index` of KG(n, k) stands for (colex order). */
export function kneserVertexSet(n: number, k: number, index: number): number[] {
  // Combinadic unranking: the largest c with C(c, j) ≤ remaining gives the j-th largest element.
  const out: number[] = [];
  let r = index;
  let top = n - 1;
  for (let j = k; j >= 1; j--) {
    while (binomial(top, j) > r) top--;
    out.push(top);
    r -= binomial(top, j);
    top--;
  }
  return out.reverse();
}

function buildKneser(n: number, k: number): Graph {
  const N = binomial(n, k);
  const deg = binomial(n - k, k);
  const buf = new EdgeBuffer({ capacity: Math.max(16, (N * deg) / 2) });
  // binom[c * (k+1) + j] = C(c, j): the colex rank of a set {c_1 < … < c_k} is Σ_j C(c_j, j).
  const binom = new Float64Array(n * (k + 1));
  for (let c = 0; c < n; c++) for (let j = 0; j <= k; j++) binom[c * (k + 1) + j] = binomial(c, j);
  const free = new Int32Array(n); // positions outside the current set
  const idx = new Int32Array(k); // a k-combination of `free`
  const full = (1 << n) - 1; // n ≤ 30 keeps masks in 31 bits
  let S = (1 << k) - 1; // Gosper's hack walks k-subsets in increasing integer = colex order
  for (let i = 0; i < N; i++) {
    let f = 0;
    for (let c = 0; c < n; c++) if (((S >>> c) & 1) === 0) free[f++] = c;
    for (let j = 0; j < k; j++) idx[j] = j;
    for (;;) {
      let rank = 0;
      for (let j = 0; j < k; j++) rank += binom[free[idx[j]] * (k + 1) + j + 1];
      if (rank > i) buf.add(i, rank);
      // Next combination of f elements taken k at a time, lexicographic on indices.
      let j = k - 1;
      while (j >= 0 && idx[j] === f - k + j) j--;
      if (j < 0) break;
      idx[j]++;
      for (let t = j + 1; t < k; t++) idx[t] = idx[t - 1] + 1;
    }
    const low = S & -S;
    const ripple = S + low;
    S = (((ripple ^ S) >>> 2) / low) | ripple;
    S &= full;
  }
  return buf.build(N).graph;
}

/** KG(n, k), validated like the spec `kneser:n=…,k=…`. KG(5, 2) is the Petersen graph. */
export function kneser(n: number, k: number): Graph {
  const p = resolveTyped(kneserFamily, { n, k });
  return buildKneser(p.n, p.k);
}

export const kneserFamily = defineFamily({
  name: "kneser",
  summary: "Kneser graph KG(n,k): k-subsets of an n-set, adjacent when disjoint",
  params: [
    { name: "n", type: "integer", description: "ground set size", default: 5, min: 2, max: 30 },
    { name: "k", type: "integer", description: "subset size, at most n/2", default: 2, min: 1, max: 15 },
  ],
  random: false,
  validate: (p) => {
    const n = p.n, k = p.k;
    if (2 * k > n) throw invalidParameter("kneser", "k", `should be at most n/2 = ${n / 2}`, k);
  },
  freeOf: (p) => {
    const n = p.n, k = p.k;
    // r pairwise disjoint k-sets need rk elements, so KG(n,k) has no K_r once n < rk.
    const r = Math.floor(n / k) + 1;
    return r <= 6 ? [{ pattern: `K${r}`, citation: `${r} pairwise disjoint ${k}-sets need ${r * k} > n elements (clique number ⌊n/k⌋)` }] : [];
  },
  predictedSize: (p) => {
    const n = p.n, k = p.k;
    const N = binomial(n, k), d = binomial(n - k, k);
    return { n: N, m: (N * d) / 2, mExact: true, minDegree: d, maxDegree: d };
  },
  build: (p) => buildKneser(p.n, p.k),
  notes: ["Eigenvalues (−1)^j·C(n−k−j, k−j), j = 0..k (Lovász 1979); chromatic number n − 2k + 2 (Lovász 1978)."],
});
