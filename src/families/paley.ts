// Paley graph P(q) for a prime power q ≡ 1 (mod 4): vertices GF(q), x ~ y iff x − y is a nonzero
// square. −1 is a square for such q, so adjacency is symmetric; srg(q, (q−1)/2, (q−5)/4, (q−1)/4).

import { invalidParameter } from "../errors.js";
import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { checkPrimePower, finiteField } from "./finite-field.js";
import { resolveTyped } from "./typed-build.js";
import { defineFamily } from "./types.js";

function buildPaley(q: number): Graph {
  const F = finiteField(q, "paley");
  const half = (q - 1) / 2;
  const buf = new EdgeBuffer({ capacity: (q * half) / 2 });
  for (let x = 0; x < q; x++) {
    // The nonzero squares are the even powers of the primitive element.
    for (let j = 0; j < half; j++) {
      const y = F.add(x, F.exp[2 * j]);
      if (y > x) buf.add(x, y);
    }
  }
  return buf.build(q).graph;
}

/** P(q), validated like the spec `paley:q=…`. */
export function paley(q: number): Graph {
  const p = resolveTyped(paleyFamily, { q });
  return buildPaley(p.q);
}

export const paleyFamily = defineFamily({
  name: "paley",
  summary: "Paley graph on GF(q), q ≡ 1 (mod 4): x ~ y iff x − y is a nonzero square",
  params: [{ name: "q", type: "integer", description: "field order, a prime power ≡ 1 (mod 4)", default: 13, min: 5, max: 30000 }],
  random: false,
  validate: (p) => {
    const q = p.q;
    checkPrimePower("paley", "q", q);
    if (q % 4 !== 1) throw invalidParameter("paley", "q", "should be ≡ 1 (mod 4) so that −1 is a square", q);
  },
  freeOf: (p) =>
    p.q === 5 ? [{ pattern: "K3", citation: "P(5) is the 5-cycle (λ = (q−5)/4 = 0)" }] : [],
  predictedSize: (p) => {
    const q = p.q;
    return { n: q, m: (q * (q - 1)) / 4, mExact: true, minDegree: (q - 1) / 2, maxDegree: (q - 1) / 2 };
  },
  build: (p) => buildPaley(p.q),
  notes: ["Strongly regular srg(q, (q−1)/2, (q−5)/4, (q−1)/4); self-complementary."],
});
