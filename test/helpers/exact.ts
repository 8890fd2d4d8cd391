// Exact arithmetic on doubles for the rigour tests: every finite double is a dyadic rational, so
// sums and products of a few of them are exact as BigInt numerators over 2^SCALE_BITS. Common
// practice, no source (IEEE 754 binary64 layout).

/** Doubles have exponents ≥ −1074; three-factor products need 3·1074 bits of scale. */
const SCALE_BITS = 1100n;
const view = new DataView(new ArrayBuffer(8));

/** x as an exact integer multiple of 2^-1100 (a single double). */
export function exact(x: number): bigint {
  if (!Number.isFinite(x)) throw new RangeError(`exact: ${x} is not finite`);
  view.setFloat64(0, x);
  const hi = view.getUint32(0);
  const lo = view.getUint32(4);
  const sign = hi >>> 31 ? -1n : 1n;
  const e = (hi >>> 20) & 0x7ff;
  let m = (BigInt(hi & 0xfffff) << 32n) | BigInt(lo);
  let exp: number;
  if (e === 0) exp = -1074;
  else {
    m |= 1n << 52n;
    exp = e - 1075;
  }
  return sign * m * (1n << (BigInt(exp) + SCALE_BITS));
}

/** Exact Σ xs, on the same 2^-1100 scale. */
export function exactSum(xs: ArrayLike<number>): bigint {
  let s = 0n;
  for (let i = 0; i < xs.length; i++) s += exact(xs[i]);
  return s;
}

/** The next double above / below x (finite x). */
export function nextUp(x: number): number {
  if (x === 0) return Number.MIN_VALUE;
  view.setFloat64(0, x);
  const b = view.getBigUint64(0);
  view.setBigUint64(0, x > 0 ? b + 1n : b - 1n);
  return view.getFloat64(0);
}

export function nextDown(x: number): number {
  return -nextUp(-x);
}

/** The largest double strictly below the exact value `target` (on the 2^-1100 scale), starting near `guess`. */
export function largestDoubleBelow(target: bigint, guess: number): number {
  let t = guess;
  while (!(exact(t) < target)) t = nextDown(t);
  while (exact(nextUp(t)) < target) t = nextUp(t);
  return t;
}
