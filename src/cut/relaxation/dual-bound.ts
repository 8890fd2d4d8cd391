// The value of a dual certificate: for any y and shift ≥ λmax(L − Diag(y)), every cut x ∈ {±1}ⁿ has
// cut = ¼xᵀLx = ¼Σy_i + ¼xᵀ(L − Diag(y))x ≤ ¼(Σy_i + n·shift). The one place that sum is taken.

import { roundoffGamma, roundUp } from "../../linalg/float-rounding.js";

/**
 * The bound ¼(Σy + n·shift), rounded up past every rounding error of its own evaluation
 * (a sum of n + 1 terms: error ≤ γ_{n+1}·(Σ|y_i| + n·|shift|)). The one place this formula lives.
 */
export function dualBoundValue(y: ArrayLike<number>, shift: number): number {
  const n = y.length;
  let s = 0, abs = 0;
  for (let i = 0; i < n; i++) {
    s += y[i];
    abs += Math.abs(y[i]);
  }
  const total = s + n * shift;
  const err = roundoffGamma(n + 2) * (abs + n * Math.abs(shift));
  return roundUp((total + err) / 4, 2);
}
