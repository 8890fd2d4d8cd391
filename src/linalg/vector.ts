// Dense vector kernels on Float64Array (views allowed): dot, axpy, norm, scale, fill with
// normal deviates. Shared by Lanczos and the certificate code so each formula lives once.

import type { Rng } from "../random/prng.js";

export function dot(a: Float64Array, b: Float64Array): number {
  const n = a.length;
  // Two accumulators shorten the dependency chain; any summation order is covered by γ_n bounds.
  let s0 = 0, s1 = 0;
  let i = 0;
  for (; i + 1 < n; i += 2) {
    s0 += a[i] * b[i];
    s1 += a[i + 1] * b[i + 1];
  }
  if (i < n) s0 += a[i] * b[i];
  return s0 + s1;
}

/** y ← y + alpha·x. */
export function axpy(alpha: number, x: Float64Array, y: Float64Array): void {
  const n = x.length;
  for (let i = 0; i < n; i++) y[i] += alpha * x[i];
}

export function norm2(a: Float64Array): number {
  return Math.sqrt(dot(a, a));
}

export function scale(alpha: number, a: Float64Array): void {
  const n = a.length;
  for (let i = 0; i < n; i++) a[i] *= alpha;
}

/** Fill with independent standard normal deviates from `rng`. */
export function fillNormal(rng: Rng, a: Float64Array): void {
  for (let i = 0; i < a.length; i++) a[i] = rng.nextNormal();
}

/** Normalise in place; returns the norm it divided by (0 leaves the vector unchanged). */
export function normalize(a: Float64Array): number {
  const r = norm2(a);
  if (r > 0) scale(1 / r, a);
  return r;
}
