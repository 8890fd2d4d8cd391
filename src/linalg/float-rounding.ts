// Floating-point constants and directed rounding for certified bounds: the unit roundoff,
// Higham's γ_k = k·u / (1 − k·u), and a next-representable-double step used to round up.

/** Unit roundoff of IEEE binary64 with round-to-nearest: 2^-53. */
export const UNIT_ROUNDOFF = 2 ** -53;

/** Smallest positive normal double, 2^-1022; bounds absolute errors from gradual underflow. */
export const MIN_NORMAL = 2 ** -1022;

/**
 * γ_k = k·u / (1 − k·u) (Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., §3.1):
 * a sum of k terms computed in any order has absolute error ≤ γ_{k−1}·Σ|terms|.
 */
export function roundoffGamma(k: number): number {
  const ku = k * UNIT_ROUNDOFF;
  if (!(ku < 0.5)) throw new RangeError(`roundoffGamma: k = ${k} is too large for a rounding-error bound`);
  // The quotient itself is rounded; one extra ulp-scale factor keeps the result an upper bound.
  return (ku / (1 - ku)) * (1 + 4 * UNIT_ROUNDOFF);
}

/**
 * A double strictly greater than x (one or two ulps above), for finite x. Arithmetic only:
 * x + |x|·2^-52 is at least one ulp above x before rounding, and x + ulp is representable, so
 * round-to-nearest cannot fall back to x; MIN_VALUE covers subnormals, where the first step vanishes.
 */
export function nextUp(x: number): number {
  if (!Number.isFinite(x)) return x;
  return x + Math.abs(x) * 2 ** -52 + Number.MIN_VALUE;
}

/** x increased by at least `steps` representable steps: absorbs a few known roundings. */
export function roundUp(x: number, steps = 1): number {
  let y = x;
  for (let i = 0; i < steps; i++) y = nextUp(y);
  return y;
}
