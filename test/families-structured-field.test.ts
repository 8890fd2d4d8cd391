// Finite fields GF(q): prime-power recognition, the field axioms, the cyclic multiplicative group,
// and the irreducible-polynomial counts, each against an oracle written here or a published formula.
import { describe, expect, it } from "vitest";
import { InputError } from "../src/errors.js";
import { finiteField, finiteFieldOf, isIrreducible, isPrimePower, monicFromIndex } from "../src/families/finite-field.js";
import { Rng } from "../src/random/prng.js";

/** Trial-division factorisation (common practice, no source): the oracle for isPrimePower. */
function naivePrimePower(q: number): { p: number; k: number } | null {
  const primes: number[] = [];
  let r = q;
  for (let d = 2; d <= r; d++) {
    if (r % d === 0) {
      primes.push(d);
      while (r % d === 0) r /= d;
    }
  }
  if (primes.length !== 1) return null;
  return { p: primes[0], k: Math.round(Math.log(q) / Math.log(primes[0])) };
}

/** Collects the first few failures of a bulk check; one expect per test keeps 10^5 checks fast. */
function failures(): { check: (ok: boolean, what: () => string) => void; list: string[] } {
  const list: string[] = [];
  return { list, check: (ok, what) => void (ok || list.length >= 5 || list.push(what())) };
}

const PRIME_POWERS_TO_1000 = Array.from({ length: 1000 }, (_, i) => i + 1).filter((q) => naivePrimePower(q) !== null);

/** Base-p digitwise addition: the encoding's definition of +, independent of the Zech tables. */
function digitAdd(p: number, a: number, b: number): number {
  let r = 0, place = 1;
  while (a > 0 || b > 0) {
    r += (((a % p) + (b % p)) % p) * place;
    a = Math.floor(a / p);
    b = Math.floor(b / p);
    place *= p;
  }
  return r;
}

/** Schoolbook polynomial product reduced by the monic modulus (common practice, no source). */
function polyMulMod(p: number, modulus: Int32Array, a: number, b: number): number {
  const k = modulus.length - 1;
  const da: number[] = [], db: number[] = [];
  for (let i = 0; i < k; i++) {
    da.push(a % p);
    db.push(b % p);
    a = Math.floor(a / p);
    b = Math.floor(b / p);
  }
  const prod = new Array<number>(2 * k - 1).fill(0);
  for (let i = 0; i < k; i++) for (let j = 0; j < k; j++) prod[i + j] = (prod[i + j] + da[i] * db[j]) % p;
  for (let d = 2 * k - 2; d >= k; d--) {
    const c = prod[d];
    if (c === 0) continue;
    for (let i = 0; i <= k; i++) prod[d - k + i] = (((prod[d - k + i] - c * modulus[i]) % p) + p) % p;
  }
  let r = 0;
  for (let i = k - 1; i >= 0; i--) r = r * p + prod[i];
  return r;
}

function mobius(n: number): number {
  let mu = 1;
  for (let d = 2; d * d <= n; d++) {
    if (n % d === 0) {
      n /= d;
      if (n % d === 0) return 0;
      mu = -mu;
    }
  }
  return n > 1 ? -mu : mu;
}

describe("isPrimePower", () => {
  it("starts like the prime powers of OEIS A246655 (from memory) and has 168 primes below 1000", () => {
    // OEIS A246655: prime powers p^k, k ≥ 1 (first terms from memory); π(1000) = 168 (standard tables).
    const start = [2, 3, 4, 5, 7, 8, 9, 11, 13, 16, 17, 19, 23, 25, 27, 29, 31, 32, 37, 41, 43, 47, 49, 53, 59, 61, 64, 67, 71, 73, 79, 81, 83, 89, 97];
    expect(PRIME_POWERS_TO_1000.slice(0, start.length)).toEqual(start);
    const primes = PRIME_POWERS_TO_1000.filter((q) => isPrimePower(q)!.k === 1);
    expect(primes.length).toBe(168);
  });

  it("agrees with trial-division factorisation for every q ≤ 5000", () => {
    for (let q = -2; q <= 5000; q++) {
      expect(isPrimePower(q)).toEqual(q < 2 ? null : naivePrimePower(q));
    }
  });
});

describe("irreducible polynomials over GF(p)", () => {
  it("their number of each degree matches Gauss's necklace formula (1/k)·Σ_{d|k} μ(d)·p^(k/d)", () => {
    // Gauss's formula for the number of monic irreducible polynomials of degree k over GF(p)
    // (Lidl–Niederreiter, Finite Fields, Thm 3.25).
    for (const [p, maxK] of [[2, 10], [3, 6], [5, 4], [7, 3], [11, 2]] as const) {
      for (let k = 1; k <= maxK; k++) {
        let count = 0;
        for (let r = 0; r < p ** k; r++) if (isIrreducible(p, monicFromIndex(p, k, r))) count++;
        let formula = 0;
        for (let d = 1; d <= k; d++) if (k % d === 0) formula += mobius(d) * p ** (k / d);
        expect(count, `p=${p} k=${k}`).toBe(formula / k);
      }
    }
  });

  it("recognises known small cases (x²+x+1 irreducible over GF(2), x²+1 = (x+1)² not; x²+1 irreducible over GF(3))", () => {
    // Elementary: a quadratic is irreducible iff it has no root (common practice, no source).
    expect(isIrreducible(2, [1, 1, 1])).toBe(true);
    expect(isIrreducible(2, [1, 0, 1])).toBe(false);
    expect(isIrreducible(3, [1, 0, 1])).toBe(true);
    expect(isIrreducible(5, [1, 0, 1])).toBe(false); // 2² = −1 mod 5
  });
});

describe("GF(q) for every prime power q ≤ 1000", () => {
  it("has an irreducible primitive modulus and a cyclic multiplicative group of order q − 1", () => {
    for (const q of PRIME_POWERS_TO_1000) {
      const F = finiteField(q);
      const { p, k } = naivePrimePower(q)!;
      expect([F.p, F.k]).toEqual([p, k]);
      expect(isIrreducible(p, [...F.modulus])).toBe(true);
      // The powers g^0..g^{q−2} are pairwise distinct and nonzero: g has order q − 1, the group is cyclic.
      const seen = new Uint8Array(q);
      let x = 1, distinct = 0;
      for (let i = 0; i < q - 1; i++) {
        if (seen[x] === 0) distinct++;
        seen[x] = 1;
        x = polyMulMod(p, F.modulus, x, F.generator);
      }
      expect([distinct, x, seen[0]], `q=${q}`).toEqual([q - 1, 1, 0]);
    }
  });

  it("adds digitwise and multiplies as polynomials modulo its modulus (all pairs for q ≤ 64, samples above)", () => {
    const rng = new Rng(7);
    const f = failures();
    for (const q of PRIME_POWERS_TO_1000) {
      const F = finiteField(q);
      const pairs = q <= 64 ? q * q : 500;
      for (let t = 0; t < pairs; t++) {
        const a = q <= 64 ? Math.floor(t / q) : rng.nextInt(q);
        const b = q <= 64 ? t % q : rng.nextInt(q);
        f.check(F.add(a, b) === digitAdd(F.p, a, b), () => `GF(${q}): ${a} + ${b}`);
        f.check(F.mul(a, b) === polyMulMod(F.p, F.modulus, a, b), () => `GF(${q}): ${a} · ${b}`);
      }
    }
    expect(f.list).toEqual([]);
  });

  it("satisfies the field axioms (exhaustively for q ≤ 16, on random triples up to 1000)", () => {
    // Field axioms (common practice, no source).
    const rng = new Rng(11);
    const f = failures();
    for (const q of PRIME_POWERS_TO_1000) {
      const F = finiteField(q);
      for (let a = 0; a < q; a++) {
        f.check(F.add(a, 0) === a && F.mul(a, 1) === a, () => `GF(${q}): identities at ${a}`);
        f.check(F.add(a, F.neg(a)) === 0 && F.sub(a, a) === 0, () => `GF(${q}): negation at ${a}`);
        // Lagrange: a^(q−1) = 1 for a ≠ 0.
        if (a !== 0) f.check(F.mul(a, F.inv(a)) === 1 && F.div(a, a) === 1 && F.pow(a, q - 1) === 1, () => `GF(${q}): inverse at ${a}`);
        f.check(F.pow(a, q) === a, () => `GF(${q}): Frobenius moves ${a}`); // x^q = x on GF(q)
      }
      const triples = q <= 16 ? q * q * q : 300;
      for (let t = 0; t < triples; t++) {
        const [a, b, c] = q <= 16 ? [Math.floor(t / (q * q)), Math.floor(t / q) % q, t % q] : [rng.nextInt(q), rng.nextInt(q), rng.nextInt(q)];
        const what = () => `GF(${q}): (${a}, ${b}, ${c})`;
        f.check(F.add(F.add(a, b), c) === F.add(a, F.add(b, c)), what);
        f.check(F.mul(F.mul(a, b), c) === F.mul(a, F.mul(b, c)), what);
        f.check(F.mul(a, F.add(b, c)) === F.add(F.mul(a, b), F.mul(a, c)), what);
        f.check(F.add(a, b) === F.add(b, a) && F.mul(a, b) === F.mul(b, a), what);
      }
    }
    expect(f.list).toEqual([]);
  });

  it("has exactly (q−1)/2 nonzero squares in odd characteristic, and −1 is a square iff q ≡ 1 (mod 4)", () => {
    // Standard facts on quadratic residues in GF(q) (e.g. Lidl–Niederreiter, Finite Fields, §5).
    for (const q of PRIME_POWERS_TO_1000.filter((x) => x % 2 === 1)) {
      const F = finiteField(q);
      const squares = new Set<number>();
      for (let a = 1; a < q; a++) squares.add(F.mul(a, a));
      expect(squares.size).toBe((q - 1) / 2);
      let agree = 0;
      for (let a = 1; a < q; a++) if (F.isSquare(a) === squares.has(a)) agree++;
      expect(agree).toBe(q - 1);
      expect(F.isSquare(F.neg(1))).toBe(q % 4 === 1);
    }
  });
});

describe("larger fields", () => {
  it("builds GF(2^20), GF(3^12) and GF(999983) with a primitive generator", () => {
    for (const [p, k] of [[2, 20], [3, 12], [999983, 1]] as const) {
      const F = finiteFieldOf(p, k);
      expect(F.q).toBe(p ** k);
      // The exp table holds q − 1 distinct nonzero elements: g generates GF(q)*.
      const seen = new Uint8Array(F.q);
      for (let i = 0; i < F.q - 1; i++) seen[F.exp[i]] = 1;
      expect(seen.reduce((a, b) => a + b, 0)).toBe(F.q - 1);
      expect(seen[0]).toBe(0);
      const rng = new Rng(3);
      const f = failures();
      for (let t = 0; t < 1000; t++) {
        const a = rng.nextInt(F.q), b = rng.nextInt(F.q);
        f.check(F.add(a, b) === digitAdd(p, a, b), () => `${a} + ${b}`);
        f.check(F.mul(a, b) === polyMulMod(p, F.modulus, a, b), () => `${a} · ${b}`);
      }
      expect(f.list).toEqual([]);
    }
  });
});

describe("invalid orders", () => {
  it("throw InputError naming the parameter", () => {
    // Input validation, common practice, no source.
    for (const q of [0, 1, 6, 12, 100, 1.5]) {
      expect(() => finiteField(q)).toThrow(InputError);
      expect(() => finiteField(q)).toThrow(/invalid `q`: should be a prime power/);
    }
    expect(() => finiteField(1 << 21)).toThrow(/at most 1048576/);
    expect(() => finiteFieldOf(4, 2)).toThrow(/invalid `p`/);
  });
});
