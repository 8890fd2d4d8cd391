// Inputs for the figure suites. The rows are made up for the figures' mechanics (invented data,
// like a demo): every check compares what a figure draws with these inputs, never with
// properties of real graphs. The fit is a fixed power law with a ±15 % band, so every sampled
// point can be recomputed by hand.
import type { CurveFit, ExponentEstimate, SurplusRow } from "../../src/plot/types.js";

export const FAMILIES = ["kneser", "polarity", "triangle-free-process", "gnp"] as const;

/** Four families × five sizes; the two smallest of each are exact (bracket closed). */
export function sampleRows(): SurplusRow[] {
  const rows: SurplusRow[] = [];
  FAMILIES.forEach((family, fi) => {
    for (let k = 0; k < 5; k++) {
      const n = 16 * 2 ** k;
      const d = 3 + fi + k;
      const m = (n * d) / 2;
      const surplus = Math.round(0.3 * (m / Math.sqrt(d)) * (0.9 + 0.05 * ((fi + k) % 4)) * 4) / 4;
      const gap = k < 2 ? 0 : Math.round(surplus * 0.12 * 4) / 4;
      rows.push({
        key: `${family}:n=${n}`,
        family,
        n,
        m,
        degeneracy: d,
        maxDegree: d + 2,
        averageDegree: d - 0.5,
        surplusLower: surplus,
        surplusUpper: surplus + gap,
        exact: gap === 0,
        bestCut: m / 2 + surplus,
        sdpBound: m / 2 + surplus + gap + 1,
        vectorGuarantee: m / 2 + surplus / 3,
        edwardsBound: m / 2 + (n - 1) / 4,
        degrees: Array.from({ length: n }, (_, v) => d - 1 + (v % 3)),
      });
    }
  });
  return rows;
}

/** surplus ≈ 0.31·x^0.98 with a band 15 % either side. */
export function sampleFit(family?: string): CurveFit {
  return {
    law: "surplus = c·(m/√d)^a",
    response: "surplusLower",
    family,
    predict(x: number | { m: number; d: number }, level = 0.95) {
      const v = typeof x === "number" ? x : x.m / Math.sqrt(x.d);
      const e = 0.31 * v ** 0.98;
      const w = level === 0.95 ? 0.15 : 0.1;
      return { estimate: e, lower: e * (1 - w), upper: e * (1 + w) };
    },
  };
}

export function sampleExponents(): ExponentEstimate[] {
  return [
    { family: "kneser", name: "exponent of m/√d", estimate: 0.97, lower: 0.9, upper: 1.04, conjectured: 1 },
    { family: "polarity", name: "exponent of m/√d", estimate: 0.9, lower: 0.8, upper: 1.0, conjectured: 1 },
    { family: "gnp", name: "exponent of m/√d", estimate: 1.02, lower: 0.95, upper: 1.1, conjectured: 1 },
    { family: "gnp", name: "exponent of d", estimate: -0.48, lower: -0.6, upper: -0.36, conjectured: -0.5 },
  ];
}
