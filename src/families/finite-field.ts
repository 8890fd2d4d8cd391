// Finite fields GF(p^k) for the algebraic families: elements are integers 0..q−1 whose base-p
// digits are polynomial coefficients modulo a fixed monic primitive polynomial; arithmetic via log/antilog and Zech tables.

import { InputError, invalidParameter } from "../errors.js";

/** Largest field order built (tables take about 16·q bytes). */
export const MAX_FIELD_ORDER = 1 << 20;

export interface PrimePower {
  p: number;
  k: number;
}

/** q = p^k with p prime and k ≥ 1, or null (so 1 is not a prime power). */
export function isPrimePower(q: number): PrimePower | null {
  if (!Number.isSafeInteger(q) || q < 2) return null;
  let p = 0;
  for (let d = 2; d * d <= q; d++) {
    if (q % d === 0) {
      p = d;
      break;
    }
  }
  if (p === 0) return { p: q, k: 1 };
  let k = 0;
  let r = q;
  while (r % p === 0) {
    r /= p;
    k++;
  }
  return r === 1 ? { p, k } : null;
}

/** The parameter check every prime-power family shares: names the parameter and its rule. */
export function checkPrimePower(owner: string, name: string, q: number, maxOrder = MAX_FIELD_ORDER): PrimePower {
  const pk = isPrimePower(q);
  if (pk === null) throw invalidParameter(owner, name, "should be a prime power (2, 3, 4, 5, 7, 8, 9, 11, ...)", q);
  if (q > maxOrder) throw invalidParameter(owner, name, `should be a prime power at most ${maxOrder}`, q);
  return pk;
}

// ---- polynomials over GF(p): coefficient arrays, lowest degree first ----

function trimDegree(a: number[]): number {
  let d = a.length - 1;
  while (d >= 0 && a[d] === 0) d--;
  return d;
}

function modInverse(a: number, p: number): number {
  // Fermat: a^(p−2) mod p; p < 2^20 so products stay below 2^53.
  let r = 1, b = a % p, e = p - 2;
  while (e > 0) {
    if (e & 1) r = (r * b) % p;
    b = (b * b) % p;
    e >>= 1;
  }
  return r;
}

/** Remainder of a modulo b over GF(p) (b nonzero); coefficients lowest degree first. */
export function polyRemainder(p: number, a: readonly number[], b: readonly number[]): number[] {
  const r = a.slice();
  const db = trimDegree(b as number[]);
  if (db < 0) throw new RangeError("polyRemainder: division by the zero polynomial");
  const lead = modInverse(b[db], p);
  for (let d = trimDegree(r); d >= db; d--) {
    const c = (r[d] * lead) % p;
    if (c === 0) continue;
    for (let i = 0; i <= db; i++) r[d - db + i] = (((r[d - db + i] - c * b[i]) % p) + p) % p;
  }
  r.length = Math.max(db, 1);
  return r;
}

/**
 * Irreducibility of a monic polynomial of degree k ≥ 1 over GF(p) by trial division by every
 * monic polynomial of degree 1..⌊k/2⌋ (a reducible one has a factor of degree ≤ k/2).
 */
export function isIrreducible(p: number, poly: readonly number[]): boolean {
  const k = trimDegree(poly as number[]);
  if (k < 1) return false;
  if (k === 1) return true;
  if (poly[0] === 0) return false; // divisible by x
  const divisor: number[] = [];
  for (let d = 1; 2 * d <= k; d++) {
    const count = p ** d;
    for (let r = 0; r < count; r++) {
      divisor.length = 0;
      let x = r;
      for (let i = 0; i < d; i++) {
        divisor.push(x % p);
        x = Math.floor(x / p);
      }
      divisor.push(1);
      const rem = polyRemainder(p, poly, divisor);
      if (trimDegree(rem) < 0) return false;
    }
  }
  return true;
}

/** Monic polynomial x^k + (lower part given by the base-p digits of r), lowest degree first. */
export function monicFromIndex(p: number, k: number, r: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < k; i++) {
    out.push(r % p);
    r = Math.floor(r / p);
  }
  out.push(1);
  return out;
}

/** A finite field GF(q), q = p^k, with its tables. Immutable after construction. */
export class GaloisField {
  readonly q: number;
  readonly p: number;
  readonly k: number;
  /** The modulus x^k + c_{k−1}x^{k−1} + … + c_0, coefficients lowest first (length k+1). */
  readonly modulus: Int32Array;
  /** The primitive element g: the class of x (the modulus is primitive). */
  readonly generator: number;
  /** exp[i] = g^i for 0 ≤ i < 2(q−1): doubled so exp[log a + log b] needs no reduction. */
  readonly exp: Int32Array;
  /** log[a] with g^log[a] = a; log[0] = −1. */
  readonly log: Int32Array;
  /** zech[i] = log(1 + g^i), or −1 when 1 + g^i = 0: addition in O(1) for any p. */
  readonly zech: Int32Array;
  /** q − 1, the order of the multiplicative group. */
  readonly order: number;

  /** Use `finiteField(q)`, which validates q. */
  constructor(p: number, k: number) {
    const q = p ** k;
    this.q = q;
    this.p = p;
    this.k = k;
    this.order = q - 1;
    const exp = new Int32Array(Math.max(2 * (q - 1), 1));
    const { modulus, length } = findPrimitiveModulus(p, k, exp);
    if (length !== q - 1) throw new Error(`no primitive polynomial found for GF(${p}^${k})`); // cannot happen: one exists for every (p, k)
    this.modulus = modulus;
    for (let i = q - 1; i < 2 * (q - 1); i++) exp[i] = exp[i - (q - 1)];
    this.exp = exp;
    this.generator = q === 2 ? 1 : exp[1];
    const log = new Int32Array(q);
    log[0] = -1;
    for (let i = 0; i < q - 1; i++) log[exp[i]] = i;
    this.log = log;
    const zech = new Int32Array(Math.max(q - 1, 1));
    for (let i = 0; i < q - 1; i++) {
      const a = exp[i];
      const low = a % p;
      const onePlus = a - low + ((low + 1) % p); // adding 1 changes only the constant coefficient
      zech[i] = log[onePlus];
    }
    this.zech = zech;
    Object.freeze(this);
  }

  add(a: number, b: number): number {
    if (this.p === 2) return a ^ b;
    if (this.k === 1) return (a + b) % this.p;
    if (a === 0) return b;
    if (b === 0) return a;
    const la = this.log[a];
    let d = this.log[b] - la;
    if (d < 0) d += this.order;
    const z = this.zech[d];
    return z < 0 ? 0 : this.exp[la + z];
  }

  neg(a: number): number {
    if (this.p === 2 || a === 0) return a;
    if (this.k === 1) return this.p - a;
    // −1 = g^((q−1)/2) in odd characteristic.
    return this.exp[this.log[a] + this.order / 2];
  }

  sub(a: number, b: number): number {
    return this.add(a, this.neg(b));
  }

  mul(a: number, b: number): number {
    if (a === 0 || b === 0) return 0;
    return this.exp[this.log[a] + this.log[b]];
  }

  inv(a: number): number {
    if (a === 0) throw new RangeError("GF inverse of 0");
    const l = this.log[a];
    return this.exp[l === 0 ? 0 : this.order - l];
  }

  div(a: number, b: number): number {
    if (b === 0) throw new RangeError("GF division by 0");
    if (a === 0) return 0;
    return this.exp[this.log[a] + this.order - this.log[b]];
  }

  /** a^e for integer e ≥ 0 (0^0 = 1). */
  pow(a: number, e: number): number {
    if (e === 0) return 1;
    if (a === 0) return 0;
    return this.exp[(this.log[a] * (e % this.order)) % this.order];
  }

  /** Is a a nonzero square? In odd characteristic exactly the even powers of g. */
  isSquare(a: number): boolean {
    if (a === 0) return false;
    return this.p === 2 || (this.log[a] & 1) === 0;
  }

  /** Coefficients of a (lowest degree first). */
  coefficients(a: number): number[] {
    const out: number[] = [];
    for (let i = 0; i < this.k; i++) {
      out.push(a % this.p);
      a = Math.floor(a / this.p);
    }
    return out;
  }
}

/** a·b mod f over GF(p); a, b of degree < k = deg f, f monic; coefficients lowest first. */
function mulMod(p: number, f: readonly number[], a: readonly number[], b: readonly number[]): number[] {
  const k = f.length - 1;
  const prod = new Array<number>(2 * k - 1).fill(0);
  for (let i = 0; i < k; i++) {
    if (a[i] === 0) continue;
    for (let j = 0; j < k; j++) prod[i + j] = (prod[i + j] + a[i] * b[j]) % p;
  }
  for (let d = 2 * k - 2; d >= k; d--) {
    const c = prod[d];
    if (c === 0) continue;
    for (let i = 0; i <= k; i++) prod[d - k + i] = (((prod[d - k + i] - c * f[i]) % p) + p) % p;
  }
  return prod.slice(0, k);
}

/** Is x^e ≡ 1 (mod f)? Square-and-multiply, O(k² log e). */
function xPowerIsOne(p: number, f: readonly number[], e: number): boolean {
  const k = f.length - 1;
  let result = new Array<number>(k).fill(0);
  result[0] = 1;
  let base = new Array<number>(k).fill(0);
  if (k === 1) base[0] = (p - f[0]) % p; // x ≡ −c_0
  else base[1] = 1;
  while (e > 0) {
    if (e % 2 === 1) result = mulMod(p, f, result, base);
    base = mulMod(p, f, base, base);
    e = Math.floor(e / 2);
  }
  return result[0] === 1 && result.every((c, i) => i === 0 || c === 0);
}

function primeFactors(x: number): number[] {
  const out: number[] = [];
  for (let d = 2; d * d <= x; d++) {
    if (x % d === 0) {
      out.push(d);
      while (x % d === 0) x /= d;
    }
  }
  if (x > 1) out.push(x);
  return out;
}

/**
 * The modulus: the first monic polynomial of degree k, in order of the integer whose base-p digits
 * are its lower coefficients, that is primitive (x^(q−1) = 1 and x^((q−1)/r) ≠ 1 for every prime
 * r | q−1, so x has order q−1) and irreducible (trial division). Fills `exp` with the powers of x.
 */
function findPrimitiveModulus(p: number, k: number, exp: Int32Array): { modulus: Int32Array; length: number } {
  const q = p ** k;
  if (q === 2) {
    exp[0] = 1;
    return { modulus: Int32Array.from([1, 1]), length: 1 }; // x + 1: x ≡ 1 generates GF(2)*
  }
  const digits = new Int32Array(k);
  const place = new Int32Array(k);
  place[0] = 1;
  for (let i = 1; i < k; i++) place[i] = place[i - 1] * p;
  const cofactors = primeFactors(q - 1).map((r) => (q - 1) / r);
  for (let r = 1; r < q; r++) {
    const poly = monicFromIndex(p, k, r);
    // Cheap test first: x of order exactly q−1 makes every nonzero residue a unit, so f is
    // irreducible; trial division then confirms it for the one polynomial kept.
    if (!xPowerIsOne(p, poly, q - 1) || cofactors.some((e) => xPowerIsOne(p, poly, e))) continue;
    if (!isIrreducible(p, poly)) continue;
    const c = Int32Array.from(poly);
    return { modulus: c, length: walkPowersOfX(p, k, c, exp, digits, place, q - 1) };
  }
  return { modulus: new Int32Array(0), length: 0 };
}

/** Writes x^0, x^1, … into exp until the power returns to 1 or `limit` steps; returns the order reached. */
function walkPowersOfX(p: number, k: number, c: Int32Array, exp: Int32Array, digits: Int32Array, place: Int32Array, limit: number): number {
  digits.fill(0);
  digits[0] = 1;
  exp[0] = 1;
  if (p === 2) {
    // Bit form: multiply by x = shift, reduce by the modulus mask when degree k appears.
    let mask = 0;
    for (let i = 0; i < k; i++) if (c[i] !== 0) mask |= 1 << i;
    const top = 1 << k;
    let a = 1;
    for (let i = 1; i <= limit; i++) {
      a <<= 1;
      if (a & top) a = (a ^ top) ^ mask;
      if (a === 1) return i;
      if (i < limit) exp[i] = a;
    }
    return limit + 1;
  }
  if (k === 1) {
    // GF(p): x ≡ −c_0, so the powers are those of the integer g = p − c_0.
    const g = (p - c[0]) % p;
    let a = 1;
    for (let i = 1; i <= limit; i++) {
      a = (a * g) % p; // a, g < 2^20: the product is exact
      if (a === 1) return i;
      if (i < limit) exp[i] = a;
    }
    return limit + 1;
  }
  // x^k ≡ Σ_j r_j x^j with r_j = −c_j mod p, kept non-negative so one % per digit suffices.
  const r = new Int32Array(k);
  for (let j = 0; j < k; j++) r[j] = (p - c[j]) % p;
  for (let i = 1; i <= limit; i++) {
    const t = digits[k - 1];
    let a = 0;
    for (let j = k - 1; j >= 1; j--) {
      const d = (digits[j - 1] + t * r[j]) % p;
      digits[j] = d;
      a += d * place[j];
    }
    const d0 = (t * r[0]) % p;
    digits[0] = d0;
    a += d0;
    if (a === 1) return i;
    if (i < limit) exp[i] = a;
  }
  return limit + 1;
}

/** GF(q) for a prime power q ≤ maxOrder; `owner`/`name` label the error (e.g. "polarity", "q"). */
export function finiteField(q: number, owner = "finiteField", name = "q", maxOrder = MAX_FIELD_ORDER): GaloisField {
  const { p, k } = checkPrimePower(owner, name, q, maxOrder);
  return new GaloisField(p, k);
}

/** GF(p^k) given the prime and the degree directly (for extension fields such as GF(q^{t−1})). */
export function finiteFieldOf(p: number, k: number, owner = "finiteField"): GaloisField {
  const pk = isPrimePower(p);
  if (pk === null || pk.k !== 1) throw invalidParameter(owner, "p", "should be a prime", p);
  if (!Number.isInteger(k) || k < 1) throw invalidParameter(owner, "k", "should be a positive integer", k);
  if (p ** k > MAX_FIELD_ORDER) throw new InputError(`${owner}: field GF(${p}^${k}) has more than ${MAX_FIELD_ORDER} elements`);
  return new GaloisField(p, k);
}
