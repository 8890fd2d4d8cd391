// Points of the projective plane PG(2, q) as normalised vectors of GF(q)^3, and the points of a
// polar line x·y = 0 enumerated directly (q+1 of them) — shared by the polarity and incidence graphs.

import type { GaloisField } from "./finite-field.js";

/**
 * Index of a normalised point: (1, a, b) ↦ a·q + b; (0, 1, b) ↦ q² + b; (0, 0, 1) ↦ q² + q.
 * The first nonzero coordinate of a normalised point is 1.
 */
export function pg2PointCount(q: number): number {
  return q * q + q + 1;
}

/** Coordinates of point `i` written into out[0..2]. */
export function pg2Coordinates(q: number, i: number, out: Int32Array): void {
  const qq = q * q;
  if (i < qq) {
    out[0] = 1;
    out[1] = Math.floor(i / q);
    out[2] = i % q;
  } else if (i < qq + q) {
    out[0] = 0;
    out[1] = 1;
    out[2] = i - qq;
  } else {
    out[0] = 0;
    out[1] = 0;
    out[2] = 1;
  }
}

/**
 * Writes into `out` the indices of the q+1 points y with x0·y0 + x1·y1 + x2·y2 = 0, solving the
 * linear equation for the last free coordinate instead of testing all points. Returns q + 1.
 */
export function pg2PolarLine(F: GaloisField, x0: number, x1: number, x2: number, out: Int32Array): number {
  const q = F.q;
  const qq = q * q;
  let c = 0;
  if (x2 !== 0) {
    // (1, a, b): b = −(x0 + x1·a)/x2 for each a; (0, 1, b): b = −x1/x2.
    const minusInv = F.neg(F.inv(x2));
    for (let a = 0; a < q; a++) {
      const b = F.mul(F.add(x0, F.mul(x1, a)), minusInv);
      out[c++] = a * q + b;
    }
    out[c++] = qq + F.mul(x1, minusInv);
  } else if (x1 !== 0) {
    // x2 = 0: (1, a, b) needs a = −x0/x1 with b free; (0, 1, b) needs x1 = 0: none; (0, 0, 1) lies on it.
    const a = F.neg(F.div(x0, x1));
    for (let b = 0; b < q; b++) out[c++] = a * q + b;
    out[c++] = qq + q;
  } else {
    // x = (1, 0, 0): the line y0 = 0, i.e. every (0, 1, b) and (0, 0, 1).
    for (let b = 0; b < q; b++) out[c++] = qq + b;
    out[c++] = qq + q;
  }
  return c;
}
