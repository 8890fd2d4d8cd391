// The surplus of the Erdős–Rényi polarity graphs ER_q grows like m^{5/6}: bracket ER_q for the prime
// powers q = 5..23, fit both bracket ends, and check that the exponent band sits near 5/6.
import { describe, expect, it } from "vitest";
import { bracket, degeneracy, family, fitConstant, fitSurplusBand, type FitRow } from "../src/index.js";

// Why 5/6 (the ER_q asymptotics; construction: Erdős & Rényi 1962, spectrum: Brown 1966):
// - ER_q has n = q² + q + 1 vertices; q + 1 absolute points have degree q, the rest q + 1, so
//   m = q(q + 1)²/2 ≈ q³/2 and every degree measure d is q or q + 1, d ≈ q.
// - With the absolute points' loops, A² = qI + J, so the adjacency spectrum is q + 1 once and ±√q.
//   For a (nearly) d-regular graph maxcut ≤ m/2 + n·|λ_min|/4, so surplus ≤ ≈ n√q/4 = Θ(q^{5/2}).
// - A C4-free graph has surplus ≥ c·Σᵥ √d(v) up to its few triangles' loss (the vector-method
//   guarantee, src/bounds/vector-method.ts), here ≈ c·n√q = Θ(q^{5/2}).
// So surplus = Θ(q^{5/2}) = Θ(m/√d), and with m ≈ q³/2 that is Θ(m^{5/6}). That ER_q is the
// extremal example for the m^{5/6} growth is stated by Alon, Krivelevich & Sudakov, "MaxCut in
// H-free graphs", Combin. Probab. Comput. 14 (2005) (from memory). At q = 5..23 lower-order terms
// still matter: the local slope of n√q against m is 0.85 at q = 12 (d/dln q of ln(n√q) = 2.41 over
// d/dln q of ln m = 2.85), so the fitted upper-end exponent lands a little above 5/6.
const PRIME_POWERS = [5, 7, 8, 9, 11, 13, 16, 17, 19, 23];

// Budget: a deterministic work budget per graph (src/cut/bracket/work-units.ts), so the rows, and
// every fitted number below, are the same on any machine and load. 10^7 units is about what one
// second did here before (wall-clock budgets were checked down to 1/100 of that: the exponent of a
// bracket end barely moves with the bracket's quality). The upper ends are the eigenvalue bound.
// Measured with this budget: m-band 0.818..0.842 widened, m/√d-band 0.994..1.025, C in 0.446..0.452;
// the limits below stay looser so that better solvers (which change the lower ends) still pass.
const WORK_PER_GRAPH = 10_000_000;

function bracketRows(): FitRow[] {
  return PRIME_POWERS.map((q) => {
    const spec = `polarity:q=${q}`;
    const g = family(spec);
    const r = bracket(g, { work: WORK_PER_GRAPH });
    let maxDegree = 0;
    for (let v = 0; v < g.n; v++) maxDegree = Math.max(maxDegree, g.offsets[v + 1] - g.offsets[v]);
    return {
      key: spec,
      family: "polarity",
      n: g.n,
      m: g.m,
      degeneracy: degeneracy(g).degeneracy,
      maxDegree,
      averageDegree: (2 * g.m) / g.n,
      surplusLower: r.surplusLower,
      surplusUpper: r.surplusUpper,
      exact: r.exact,
    };
  });
}

describe("ER_q surplus exponent", () => {
  it("the band of fitted exponents of surplus vs m over q = 5..23 contains values near 5/6 and excludes 2/3 and 1", () => {
    const rows = bracketRows();
    // The family's own sizes (src/families/polarity.ts agrees with the count above).
    for (const [i, q] of PRIME_POWERS.entries()) expect(rows[i].m).toBe((q * (q + 1) ** 2) / 2);
    const band = fitSurplusBand(rows, { law: "m", bootstrap: false });
    expect(band.lower.used).toHaveLength(10);
    const b = band.band("slope");
    // Near 5/6: the band, widened by the fits' 95 % t-intervals, reaches within 0.01 of 5/6 ...
    expect(b.widenedLow).toBeLessThanOrEqual(5 / 6 + 0.01);
    expect(b.widenedHigh).toBeGreaterThanOrEqual(5 / 6 - 0.01);
    // ... and is narrow enough to say something: it excludes m^{2/3} (surplus ∝ n), m^{3/4}, and
    // linear growth m^1, the exponents of the competing laws.
    expect(b.widenedLow).toBeGreaterThan(0.76);
    expect(b.widenedHigh).toBeLessThan(0.92);
    // Only the smallest graphs close their brackets: no exact fit, and the band says why.
    expect(band.exactProblem).toMatch(/closed brackets? usable; the law "m" needs at least 3/);

    // The same data in the conjecture's own variable: surplus against m/√d (d = degeneracy) has
    // slope near 1, and the slope-1 line's constant is well determined.
    const over = fitSurplusBand(rows, { law: "m-over-sqrt-d", bootstrap: false }).band("slope");
    expect(over.widenedLow).toBeLessThanOrEqual(1.02);
    expect(over.widenedHigh).toBeGreaterThanOrEqual(0.98);
    expect(over.widenedHigh - over.widenedLow).toBeLessThan(0.15);
    const C = fitConstant(rows, { bootstrap: false }).scale();
    expect(C.upper / C.lower).toBeLessThan(1.3);
  }, 120_000);
});
