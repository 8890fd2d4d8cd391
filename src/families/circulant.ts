// Circulant graphs (Cayley graphs of Z_n): x ~ x ± s (mod n) for s in the connection set. `cayley-zn`
// is an alias, the group-theoretic name of the same graphs; cycles and Andrásfai graphs are built here too.

import { invalidParameter } from "../errors.js";
import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { bipartiteFreeOf } from "./free-of.js";
import { resolveTyped } from "./typed-build.js";
import { defineFamily, type FreeOfClaim } from "./types.js";

/** Every s in 1..n−1 and listed once; s and n − s may both appear (they give the same edges). */
export function checkConnectionSet(owner: string, n: number, s: readonly number[]): void {
  const seen = new Set<number>();
  for (const x of s) {
    if (!Number.isInteger(x) || x < 1 || x > n - 1) throw invalidParameter(owner, "s", `should list integers between 1 and n−1 = ${n - 1}`, x);
    if (seen.has(x)) throw invalidParameter(owner, "s", "should list each element once", x);
    seen.add(x);
  }
}

/** The symmetric closure S ∪ −S, ascending (small: its size is the degree). */
function symmetricClosure(n: number, s: readonly number[]): number[] {
  const d = new Set<number>();
  for (const x of s) {
    d.add(x);
    d.add(n - x);
  }
  return [...d].sort((a, b) => a - b);
}

function circulantDegree(n: number, s: readonly number[]): number {
  return symmetricClosure(n, s).length;
}

/** Builds Cay(Z_n, S ∪ −S); trusts its arguments (callers validated them). */
export function buildCirculant(n: number, s: readonly number[]): Graph {
  const closure = symmetricClosure(n, s);
  const buf = new EdgeBuffer({ capacity: Math.max(16, (n * closure.length) / 2) });
  for (const d of closure) {
    if (2 * d > n) continue; // n − d stands for the same edges
    // d = n/2 pairs x with x + n/2: a perfect matching, each edge met once from its lower end.
    const starts = 2 * d === n ? d : n;
    for (let x = 0; x < starts; x++) buf.add(x, (x + d) % n);
  }
  return buf.build(n).graph;
}

/** Triangle x, x+a, x+a+b needs a, b, a+b all in S ∪ −S (mod n). */
function circulantSumFree(n: number, closure: readonly number[]): boolean {
  const inD = new Set(closure);
  for (const a of closure) for (const b of closure) if (inD.has((a + b) % n)) return false;
  return true;
}

function circulantFreeOf(n: number, s: readonly number[]): FreeOfClaim[] {
  if (n % 2 === 0 && s.every((x) => x % 2 === 1)) return bipartiteFreeOf("n even and every s odd, so x mod 2 is a proper 2-colouring");
  if (circulantSumFree(n, symmetricClosure(n, s))) return [{ pattern: "K3", citation: "S ∪ −S is sum-free mod n; a triangle x, x+a, x+a+b needs a, b, a+b in it (elementary)" }];
  return [];
}

/** Circulant graph on Z_n with connection set s (closed under negation automatically). */
export function circulant(n: number, s: readonly number[]): Graph {
  const p = resolveTyped(circulantFamily, { n, s: [...s] });
  return buildCirculant(p.n, p.s);
}

export const circulantFamily = defineFamily({
  name: "circulant",
  aliases: ["cayley-zn"],
  summary: "circulant graph (Cayley graph of the cyclic group Z_n): x ~ x ± s (mod n) for each s in the connection set",
  params: [
    { name: "n", type: "integer", description: "number of vertices", default: 13, min: 2, max: 100_000_000 },
    { name: "s", type: "integer-list", description: "connection set, integers 1..n−1 joined by +", default: [1, 5] },
  ],
  random: false,
  validate: (p) => checkConnectionSet("circulant", p.n, p.s),
  freeOf: (p) => circulantFreeOf(p.n, p.s),
  predictedSize: (p) => {
    const n = p.n, d = circulantDegree(n, p.s);
    return { n, m: (n * d) / 2, mExact: true, minDegree: d, maxDegree: d };
  },
  build: (p) => buildCirculant(p.n, p.s),
});

// ---- cycles ----

/** C_n, validated like the spec `cycle:n=…`. */
export function cycle(n: number): Graph {
  const p = resolveTyped(cycleFamily, { n });
  return buildCirculant(p.n, [1]);
}

export const cycleFamily = defineFamily({
  name: "cycle",
  summary: "cycle C_n",
  params: [{ name: "n", type: "integer", description: "number of vertices", default: 5, min: 3, max: 100_000_000 }],
  random: false,
  freeOf: (p) => {
    const n = p.n;
    const out: FreeOfClaim[] = [];
    for (let len = 3; len <= 8; len++) if (len !== n) out.push({ pattern: len === 3 ? "K3" : `C${len}`, citation: `the only cycle of C_${n} has length ${n}` });
    return out;
  },
  predictedSize: (p) => ({ n: p.n, m: p.n, mExact: true, minDegree: 2, maxDegree: 2 }),
  build: (p) => buildCirculant(p.n, [1]),
});

// ---- Andrásfai graphs ----

function andrasfaiSet(k: number): number[] {
  const s: number[] = [];
  for (let x = 1; x <= 3 * k - 2; x += 3) s.push(x);
  return s;
}

/** And(k): the circulant on 3k − 1 vertices with connection set {x ≡ 1 (mod 3)}; k-regular, triangle-free. */
export function andrasfai(k: number): Graph {
  const p = resolveTyped(andrasfaiFamily, { k });
  return buildCirculant(3 * p.k - 1, andrasfaiSet(p.k));
}

export const andrasfaiFamily = defineFamily({
  name: "andrasfai",
  summary: "Andrásfai graph And(k): circulant on 3k−1 vertices joining x, y when x − y ≡ 1 (mod 3)",
  params: [{ name: "k", type: "integer", description: "degree", default: 3, min: 1, max: 10000 }],
  random: false,
  freeOf: () => [{ pattern: "K3", citation: "Andrásfai 1964: two residues ≡ 1 (mod 3) sum to ≡ 2, or to ≡ 0 once reduced mod 3k−1" }],
  predictedSize: (p) => {
    const k = p.k;
    return { n: 3 * k - 1, m: (k * (3 * k - 1)) / 2, mExact: true, minDegree: k, maxDegree: k };
  },
  build: (p) => buildCirculant(3 * p.k - 1, andrasfaiSet(p.k)),
});
