// Cayley graphs of the elementary abelian group GF(2)^dim: x ~ x ⊕ s for s in the connection set
// (bitmasks). The hypercube Q_dim (unit vectors) and the Clebsch graph are built here.

import { invalidParameter } from "../errors.js";
import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { bipartiteFreeOf } from "./free-of.js";
import { resolveTyped } from "./typed-build.js";
import { defineFamily, type FreeOfClaim } from "./types.js";
import { popcount } from "../graph/bits.js";

export function checkBitmaskSet(owner: string, dim: number, s: readonly number[]): void {
  const seen = new Set<number>();
  const top = 2 ** dim - 1;
  for (const x of s) {
    if (!Number.isInteger(x) || x < 1 || x > top) throw invalidParameter(owner, "s", `should list bitmasks between 1 and 2^dim − 1 = ${top}`, x);
    if (seen.has(x)) throw invalidParameter(owner, "s", "should list each element once", x);
    seen.add(x);
  }
}

/** Builds Cay(GF(2)^dim, S); trusts its arguments. Vertex x is the vector with bits of x. */
export function buildCayleyGf2(dim: number, s: readonly number[]): Graph {
  const n = 2 ** dim;
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
export function cayleyGf2FreeOf(s: readonly number[]): FreeOfClaim[] {
  if (s.every((x) => popcount(x) % 2 === 1)) return bipartiteFreeOf("every s has odd weight, so the parity of x is a proper 2-colouring");
  const inS = new Set(s);
  for (const a of s) for (const b of s) if (a !== b && inS.has(a ^ b)) return [];
  return [{ pattern: "K3", citation: "no a ⊕ b lies in S; a triangle x, x⊕a, x⊕a⊕b needs one (elementary)" }];
}

/** Cay(GF(2)^dim, s), validated like the spec `cayley-gf2:dim=…,s=…`. */
export function cayleyGf2(dim: number, s: readonly number[]): Graph {
  const p = resolveTyped(cayleyGf2Family, { dim, s: [...s] });
  return buildCayleyGf2(p.dim, p.s);
}

export const cayleyGf2Family = defineFamily({
  name: "cayley-gf2",
  summary: "Cayley graph of GF(2)^dim: x ~ x xor s for each bitmask s in the connection set",
  params: [
    { name: "dim", type: "integer", description: "dimension (2^dim vertices)", default: 4, min: 1, max: 26 },
    { name: "s", type: "integer-list", description: "connection set, bitmasks 1..2^dim−1 joined by +", default: [1, 2, 4, 8, 15] },
  ],
  random: false,
  validate: (p) => checkBitmaskSet("cayley-gf2", p.dim, p.s),
  freeOf: (p) => cayleyGf2FreeOf(p.s),
  predictedSize: (p) => {
    const n = 2 ** p.dim, d = p.s.length;
    return { n, m: (n * d) / 2, mExact: true, minDegree: d, maxDegree: d };
  },
  build: (p) => buildCayleyGf2(p.dim, p.s),
});

// ---- hypercube ----

function unitVectors(d: number): number[] {
  return Array.from({ length: d }, (_, i) => 2 ** i);
}

/** Q_dim: 2^dim vertices, x ~ y iff they differ in one bit. */
export function hypercube(dim: number): Graph {
  const p = resolveTyped(hypercubeFamily, { dim });
  return buildCayleyGf2(p.dim, unitVectors(p.dim));
}

export const hypercubeFamily = defineFamily({
  name: "hypercube",
  summary: "hypercube Q_dim: binary dim-tuples adjacent when they differ in one coordinate",
  params: [{ name: "dim", type: "integer", description: "dimension", default: 4, min: 1, max: 26 }],
  random: false,
  freeOf: () => [
    ...bipartiteFreeOf("parity of the weight"),
    { pattern: "K2,3", citation: "two vertices at distance 2 have exactly 2 common neighbours (elementary)" },
  ],
  predictedSize: (p) => {
    const d = p.dim, n = 2 ** d;
    return { n, m: (d * n) / 2, mExact: true, minDegree: d, maxDegree: d };
  },
  build: (p) => buildCayleyGf2(p.dim, unitVectors(p.dim)),
});
