// A floating-point proof that a symmetric matrix is positive semidefinite: a Cholesky
// factorisation of A − c·I that runs to completion, with c above a stated rounding-error bound.
//
// The bound. If floating-point Cholesky of a symmetric B runs to completion (no underflow),
// the computed factor satisfies R̂ᵀR̂ = B + ΔB with |ΔB| ≤ γ_{n+1}|R̂ᵀ||R̂| (Higham, Accuracy and
// Stability of Numerical Algorithms, 2nd ed., Thm 10.3; the proof needs only completion, not
// definiteness, as Rump, "Verification of positive definiteness", BIT 46 (2006) 433–452, notes).
// By Cauchy–Schwarz (|R̂ᵀ||R̂|)_ij ≤ ρ_i ρ_j with ρ_i² = (R̂ᵀR̂)_ii ≤ b_ii / (1 − γ_{n+1}), so
// ‖ΔB‖₂ ≤ γ' · tr B with γ' = γ_{n+1} / (1 − γ_{n+1}), and λmin(B) ≥ −γ'·tr B.
// With B = fl(Ã − c·I) (diagonal error ≤ u·(max|ã_ii| + c)) and |A − Ã| ≤ e on the diagonal:
//   λmin(A) ≥ c − γ'·tr B − u·(max|ã_ii| + c) − e − (underflow),
// so the test proves A ⪰ 0 once the right-hand side is ≥ 0. Gradual underflow adds at most
// n²·2^-1022·(1 + max|ã_ii|) to ‖ΔB‖ (a generous overestimate; Rump's theorem carries a like term).
// A sparse factor (src/linalg/envelope-cholesky.ts) rests on the same theorem: its inner products skip
// only exact zeros, so γ_{t+1}, t the most nonzero terms in a row of the factor, replaces γ_{n+1}
// (Higham's proof bounds each entry through its own inner product, Lemma 8.4). `certifyCholesky` is the
// one place these margins are computed and checked.

import { InputError } from "../errors.js";
import { MIN_NORMAL, UNIT_ROUNDOFF, roundoffGamma } from "./float-rounding.js";

export interface PsdProof {
  /** True only when the factorisation completed and the margin inequality above holds. */
  proven: boolean;
  /** The diagonal shift c subtracted before factorising. */
  shift: number;
  /** Lower bound on λmin(A) implied by the run when proven (≥ 0), else NaN. */
  lambdaMinLowerBound: number;
  /** Row where a pivot was not positive, or −1. */
  failedAt: number;
  message: string;
}

/**
 * Proves A ⪰ 0 for the exact symmetric matrix A whose floating-point image `a` (row-major n×n;
 * only the lower triangle is read) has exact off-diagonal entries and diagonal entries within
 * `diagonalError` of A's. Overwrites the lower triangle of `a` with the Cholesky factor.
 */
export function provePsdByCholesky(a: Float64Array, n: number, diagonalError = 0): PsdProof {
  if (!Number.isInteger(n) || n < 0 || a.length < n * n) {
    throw new InputError(`provePsdByCholesky: expected a row-major ${n}×${n} matrix, got ${a.length} entries`);
  }
  const diagonal = new Float64Array(n);
  for (let i = 0; i < n; i++) diagonal[i] = a[i * n + i];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) if (!Number.isFinite(a[i * n + j])) return fail(0, i, `entry (${i}, ${j}) is ${a[i * n + j]}`);
  }
  return certifyCholesky({ n, termCount: n, diagonal, diagonalError }, (c, minPivot) => {
    for (let i = 0; i < n; i++) a[i * n + i] -= c;
    return factorLower(a, n, minPivot);
  });
}

/** What the rounding-error margin of a Cholesky proof depends on (see the file header). */
export interface CholeskyProofInput {
  /** Order of the matrix. */
  n: number;
  /**
   * Most nonzero terms in one row of the factor, diagonal included (n for a dense factor): every
   * inner product of the factorisation has at most this many nonzero terms, and a zero term adds
   * nothing to a rounded sum, so γ_{termCount+1} replaces Higham's γ_{n+1}.
   */
  termCount: number;
  /** The floating-point diagonal of Ã (before the shift). */
  diagonal: ArrayLike<number>;
  /** Bound on |A − Ã| on the diagonal (off-diagonal entries must be exact). */
  diagonalError: number;
}

/**
 * The one home of the Cholesky proof's rigour, for any storage (dense rows, an envelope): computes
 * the margin c of the file header from the input, calls `factor(c, minPivot)`, which must subtract
 * c from the diagonal, run a Cholesky factorisation whose inner products obey Higham's Lemma 8.4
 * (any summation order) and return the first row whose pivot was ≤ minPivot, or −1; then checks
 * the a-posteriori inequality λmin(A) ≥ c − γ'·tr B − u·(max|ã_ii| + c) − e − underflow ≥ 0.
 */
export function certifyCholesky(input: CholeskyProofInput, factor: (c: number, minPivot: number) => number): PsdProof {
  const { n, termCount, diagonal, diagonalError } = input;
  if (!(diagonalError >= 0) || !Number.isFinite(diagonalError)) {
    throw new InputError(`provePsdByCholesky: invalid \`diagonalError\`: should be a finite number ≥ 0 (got ${diagonalError})`);
  }
  if (!(Number.isInteger(termCount) && termCount >= Math.min(1, n) && termCount <= n)) {
    throw new InputError(`provePsdByCholesky: invalid \`termCount\`: should be an integer between 1 and n = ${n} (got ${termCount})`);
  }
  const u = UNIT_ROUNDOFF;
  const g = roundoffGamma(termCount + 1);
  const gp = (g / (1 - g)) * (1 + 4 * u);
  let traceAbs = 0;
  let maxDiag = 0;
  for (let i = 0; i < n; i++) {
    const d = diagonal[i];
    if (!Number.isFinite(d)) return fail(0, i, `diagonal entry ${i} is ${d}`);
    traceAbs += Math.abs(d);
    maxDiag = Math.max(maxDiag, Math.abs(d));
  }
  traceAbs *= 1 + roundoffGamma(n + 1);
  const underflow = n * n * MIN_NORMAL * (1 + maxDiag);
  // Twice the needed margin, so the a-posteriori check below passes whenever the factorisation does.
  const c = 2 * (gp * traceAbs + u * maxDiag + diagonalError + underflow) + MIN_NORMAL;

  const failedAt = factor(c, MIN_NORMAL * 2 ** 60);
  if (failedAt >= 0) return fail(c, failedAt, `pivot ${failedAt} is not positive after shifting the diagonal by ${c}`);
  // b_ii = fl(ã_ii − c) ≤ |ã_ii|, so the rounded-up trace of |Ã| bounds tr B.
  const needed = (gp * traceAbs + u * (maxDiag + c) + diagonalError + underflow) * (1 + 1e-10);
  const lower = c - needed;
  if (!(lower >= 0)) return fail(c, -1, `factorisation completed but the margin ${c} is below the error bound ${needed}`);
  return { proven: true, shift: c, lambdaMinLowerBound: lower, failedAt: -1, message: `Cholesky of A − ${c.toExponential(3)}·I completed: A is positive semidefinite` };
}

function fail(shift: number, at: number, message: string): PsdProof {
  return { proven: false, shift, lambdaMinLowerBound: NaN, failedAt: at, message };
}

/**
 * In-place row-oriented (Cholesky–Banachiewicz) factorisation of the lower triangle: every entry
 * is one inner product over two contiguous rows. Rows go in groups of four that share each
 * earlier row j as it streams through the cache; the arithmetic per entry is unchanged, and
 * the γ_{n+1} bound holds for any order of the inner-product sums. Returns the first row whose
 * pivot is ≤ minPivot, or −1.
 */
function factorLower(a: Float64Array, n: number, minPivot: number): number {
  for (let i0 = 0; i0 < n; i0 += 4) {
    const rows = Math.min(4, n - i0);
    if (rows === 4) {
      const r0 = i0 * n, r1 = r0 + n, r2 = r1 + n, r3 = r2 + n;
      for (let j = 0; j < i0; j++) {
        const rj = j * n;
        let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
        for (let t = 0; t < j; t++) {
          const x = a[rj + t];
          s0 += a[r0 + t] * x;
          s1 += a[r1 + t] * x;
          s2 += a[r2 + t] * x;
          s3 += a[r3 + t] * x;
        }
        const d = a[rj + j];
        a[r0 + j] = (a[r0 + j] - s0) / d;
        a[r1 + j] = (a[r1 + j] - s1) / d;
        a[r2 + j] = (a[r2 + j] - s2) / d;
        a[r3 + j] = (a[r3 + j] - s3) / d;
      }
    }
    // The rest of each row: columns the group did not cover, then the pivot.
    for (let i = i0; i < i0 + rows; i++) {
      const ri = i * n;
      for (let j = rows === 4 ? i0 : 0; j <= i; j++) {
        const rj = j * n;
        let s0 = 0, s1 = 0;
        let t = 0;
        for (; t + 1 < j; t += 2) {
          s0 += a[ri + t] * a[rj + t];
          s1 += a[ri + t + 1] * a[rj + t + 1];
        }
        if (t < j) s0 += a[ri + t] * a[rj + t];
        const s = a[ri + j] - (s0 + s1);
        if (j < i) a[ri + j] = s / a[rj + j];
        else {
          if (!(s > minPivot)) return i;
          a[ri + i] = Math.sqrt(s);
        }
      }
    }
  }
  return -1;
}
