// Cayley graphs of the elementary abelian group GF(2)^k: x ~ x ⊕ s for s in the connection set
// (bitmasks). The hypercube Q_d (unit vectors) and the Clebsch graph are built here.

import { invalidParameter } from "../errors.js";
import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { bipartiteFreeOf } from "./free-of.js";
import { resolveTyped } from "./typed-build.js";
import type { FamilyDefinition, Params } from "./types.js";

function popcount(x: number): number {
  let c = 0;
  for (; x !== 0; x &= x - 1) c++;
  return c;
}

export function checkBitmaskSet(owner: string, k: number, s: readonly number[]): void {
  const seen = new Set<number>();
  const top = 2 ** k - 1;
  for (const x of s) {
    if (!Number.isInteger(x) || x < 1 || x > top) throw invalidParameter(owner, "s", `should list bitmasks between 1 and 2^k − 1 = ${top}`, x);
    if (seen.has(x)) throw invalidParameter(owner, "s", "should list each element once", x);
    seen.add(x);
  }
}

/** Builds Cay(GF(2)^k, S); trusts its arguments. Vertex x is the vector with bits of x. */
export function buildCayleyGf2(k: number, s: readonly number[]): Graph {
  const n = 2 ** k;
  const buf = new EdgeBuffer({ capacity: Math.max(16, (n * s.length) / 2) });
  for (let x = 0; x < n; x++) {
    for (let i = 0; i < s.length; i++) {
      const y = x ^ s[i];
      if (y > x) buf.add(x, y);
    }
  }
  return buf.build(n).graph;
}

/** What the connection set alone proves (elementary, no source beyond the argument given). */
export function cayleyGf2FreeOf(s: readonly number[]): { pattern: string; source: string }[] {
  if (s.every((x) => popcount(x) % 2 === 1)) return bipartiteFreeOf("every s has odd weight, so the parity of x is a proper 2-colouring");
  const inS = new Set(s);
  for (const a of s) for (const b of s) if (a !== b && inS.has(a ^ b)) return [];
  return [{ pattern: "K3", source: "no a ⊕ b lies in S; a triangle x, x⊕a, x⊕a⊕b needs one (elementary)" }];
}

export function cayleyGf2Graph(k: number, s: readonly number[]): Graph {
  const p = resolveTyped(cayleyGf2, { k, s: [...s] });
  return buildCayleyGf2(p.k as number, p.s as number[]);
}

export const cayleyGf2: FamilyDefinition = {
  name: "cayley-gf2",
  summary: "Cayley graph of GF(2)^k: x ~ x xor s for each bitmask s in the connection set",
  params: [
    { name: "k", type: "integer", description: "dimension (2^k vertices)", default: 4, min: 1, max: 26 },
    { name: "s", type: "integer-list", description: "connection set, bitmasks 1..2^k−1 joined by +", default: [1, 2, 4, 8, 15] },
  ],
  random: false,
  validate: (p: Params) => checkBitmaskSet("cayley-gf2", p.k as number, p.s as number[]),
  freeOf: (p) => cayleyGf2FreeOf(p.s as number[]),
  expected: (p) => {
    const n = 2 ** (p.k as number), d = (p.s as number[]).length;
    return { n, m: (n * d) / 2, mExact: true, minDegree: d, maxDegree: d };
  },
  build: (p) => buildCayleyGf2(p.k as number, p.s as number[]),
};

// ---- hypercube ----

function unitVectors(d: number): number[] {
  return Array.from({ length: d }, (_, i) => 2 ** i);
}

/** Q_d: 2^d vertices, x ~ y iff they differ in one bit. */
export function hypercubeGraph(d: number): Graph {
  const p = resolveTyped(hypercube, { d });
  return buildCayleyGf2(p.d as number, unitVectors(p.d as number));
}

export const hypercube: FamilyDefinition = {
  name: "hypercube",
  summary: "hypercube Q_d: binary d-tuples adjacent when they differ in one coordinate",
  params: [{ name: "d", type: "integer", description: "dimension", default: 4, min: 1, max: 26 }],
  random: false,
  freeOf: () => [
    ...bipartiteFreeOf("parity of the weight"),
    { pattern: "K2,3", source: "two vertices at distance 2 have exactly 2 common neighbours (elementary)" },
  ],
  expected: (p) => {
    const d = p.d as number, n = 2 ** d;
    return { n, m: (d * n) / 2, mExact: true, minDegree: d, maxDegree: d };
  },
  build: (p) => buildCayleyGf2(p.d as number, unitVectors(p.d as number)),
};
