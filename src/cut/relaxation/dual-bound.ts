// The value of a dual certificate: for any y and shift ≥ λmax(L − Diag(y)), every cut x ∈ {±1}ⁿ has
// cut = ¼xᵀLx = ¼Σy_i + ¼xᵀ(L − Diag(y))x ≤ ¼(Σy_i + n·shift). With nonnegative multipliers μ_t on
// valid inequalities ⟨A_t, X⟩ ≤ 1 (the triangle inequalities, src/cut/relaxation/triangle-dual.ts)
// and shift ≥ λmax(L − Diag(y) − 4Σμ_t A_t) the bound becomes ¼(Σy_i + n·shift) + Σμ_t.
// The one place that sum is taken.

import { roundoffGamma, roundUp } from "../../linalg/float-rounding.js";

/**
 * The bound ¼(Σy + n·shift + 4Σμ), rounded up past every rounding error of its own evaluation
 * (a sum of n + T + 1 terms: error ≤ γ_{n+T+2}·(Σ|y_i| + n·|shift| + 4Σ|μ_t|)). `multipliers` are
 * the μ_t of inequalities with right-hand side 1 (none for the plain certificate). The one place
 * this formula lives.
 */
export function dualBoundValue(y: ArrayLike<number>, shift: number, multipliers?: ArrayLike<number>): number {
  const n = y.length;
  let s = 0, abs = 0;
  for (let i = 0; i < n; i++) {
    s += y[i];
    abs += Math.abs(y[i]);
  }
  const t = multipliers === undefined ? 0 : multipliers.length;
  for (let k = 0; k < t; k++) {
    // ×4 is exact in binary floating point.
    s += 4 * multipliers![k];
    abs += 4 * Math.abs(multipliers![k]);
  }
  const total = s + n * shift;
  const err = roundoffGamma(n + t + 2) * (abs + n * Math.abs(shift));
  return roundUp((total + err) / 4, 2);
}
