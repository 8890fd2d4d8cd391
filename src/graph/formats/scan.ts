// Byte-level scanning for the text formats: lines, blank-separated tokens, integers and
// decimals read straight from a Buffer, so large files parse without split/regex/Number().

/** Space, tab, CR, VT, FF: CR counts as a blank so CRLF files read like LF files. */
export function isBlank(c: number): boolean {
  return c === 32 || c === 9 || c === 13 || c === 11 || c === 12;
}

/** Do the bytes [start, end) begin with the ASCII text `prefix`? */
export function hasPrefix(buf: Uint8Array, start: number, end: number, prefix: string): boolean {
  if (end - start < prefix.length) return false;
  for (let i = 0; i < prefix.length; i++) if (buf[start + i] !== prefix.charCodeAt(i)) return false;
  return true;
}

/** First non-blank position in [p, end), or end. */
export function skipBlanks(buf: Uint8Array, p: number, end: number): number {
  while (p < end && isBlank(buf[p])) p++;
  return p;
}

/** End of the token starting at p (first blank or end). */
export function tokenEnd(buf: Uint8Array, p: number, end: number): number {
  while (p < end && !isBlank(buf[p])) p++;
  return p;
}

/** Walks a buffer line by line; `start`/`end` delimit the current line without its "\n". */
export class LineCursor {
  readonly buf: Uint8Array;
  /** 1-based number of the current line (0 before the first `advance`). */
  line = 0;
  start = 0;
  end = 0;
  private nextStart: number;

  constructor(buf: Uint8Array) {
    this.buf = buf;
    // A UTF-8 byte order mark is an encoding marker, not content.
    this.nextStart = buf.length >= 3 && buf[0] === 0xef && buf[1] === 0xbb && buf[2] === 0xbf ? 3 : 0;
  }

  advance(): boolean {
    const buf = this.buf;
    if (this.nextStart >= buf.length) return false;
    let nl = buf.indexOf(10, this.nextStart);
    if (nl < 0) nl = buf.length;
    this.start = this.nextStart;
    this.end = nl;
    this.nextStart = nl + 1;
    this.line++;
    return true;
  }
}

/** Largest integer the readers accept for ids and counts (CSR arrays are Int32). */
export const MAX_INT_TOKEN = 0x7fffffff;
/** Returned by `readUint` for a token that is not a plain run of digits. */
export const NOT_UINT = -1;
/** Returned by `readUint` for digits above MAX_INT_TOKEN. */
export const UINT_TOO_BIG = -2;

/** Non-negative decimal integer in [s, e), or NOT_UINT / UINT_TOO_BIG. */
export function readUint(buf: Uint8Array, s: number, e: number): number {
  if (s >= e) return NOT_UINT;
  let v = 0;
  let big = false;
  for (let i = s; i < e; i++) {
    const d = buf[i] - 48;
    if (d < 0 || d > 9) return NOT_UINT;
    v = v * 10 + d;
    if (v > MAX_INT_TOKEN) big = true;
  }
  return big ? UINT_TOO_BIG : v;
}

// Exact powers of ten: every 10^k with k ≤ 22 is a double, which makes the fast path below exact.
const POW10: readonly number[] = Object.freeze([
  1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22,
]);
const TWO_POW_53 = 9007199254740992;

/**
 * Decimal number `[+-]digits[.digits][(e|E)[+-]digits]` in [s, e), or NaN for anything else
 * (hex, "inf", "nan", empty). Mantissas below 2^53 with |exponent| ≤ 22 are converted with one
 * correctly rounded operation (Clinger's fast path); everything else goes to Number() on the token.
 */
export function readDecimal(buf: Uint8Array, s: number, e: number): number {
  let i = s;
  let neg = false;
  if (i < e && (buf[i] === 43 || buf[i] === 45)) {
    neg = buf[i] === 45;
    i++;
  }
  const body = i;
  let mant = 0;
  let exact = true;
  let digits = 0;
  let exp10 = 0;
  while (i < e && buf[i] >= 48 && buf[i] <= 57) {
    mant = mant * 10 + (buf[i] - 48);
    if (mant >= TWO_POW_53) exact = false;
    digits++;
    i++;
  }
  if (i < e && buf[i] === 46) {
    i++;
    while (i < e && buf[i] >= 48 && buf[i] <= 57) {
      mant = mant * 10 + (buf[i] - 48);
      if (mant >= TWO_POW_53) exact = false;
      exp10--;
      digits++;
      i++;
    }
  }
  if (digits === 0) return NaN;
  if (i < e && (buf[i] === 101 || buf[i] === 69)) {
    i++;
    let eneg = false;
    if (i < e && (buf[i] === 43 || buf[i] === 45)) {
      eneg = buf[i] === 45;
      i++;
    }
    let ev = 0;
    let edigits = 0;
    while (i < e && buf[i] >= 48 && buf[i] <= 57) {
      if (ev < 100000) ev = ev * 10 + (buf[i] - 48);
      edigits++;
      i++;
    }
    if (edigits === 0) return NaN;
    exp10 += eneg ? -ev : ev;
  }
  if (i !== e) return NaN;
  let value: number;
  if (exact && exp10 >= -22 && exp10 <= 22) value = exp10 < 0 ? mant / POW10[-exp10] : mant * POW10[exp10];
  else value = Number(latin1(buf, body, e)); // syntax already checked: Number() sees plain decimal
  return neg ? -value : value;
}

/** The bytes [s, e) as text (ASCII formats: latin1 is exact and cheap). */
export function latin1(buf: Uint8Array, s: number, e: number): string {
  return Buffer.from(buf.buffer, buf.byteOffset + s, e - s).toString("latin1");
}

/** A token quoted for an error message, cut to a readable length. */
export function quoteToken(buf: Uint8Array, s: number, e: number): string {
  const cut = e - s > 40;
  const text = Buffer.from(buf.buffer, buf.byteOffset + s, (cut ? s + 40 : e) - s).toString("utf8");
  return JSON.stringify(cut ? `${text}...` : text);
}

/** Text or bytes as bytes (UTF-8, so non-ASCII characters stay invalid rather than aliasing ASCII). */
export function asBytes(text: string | Uint8Array): Uint8Array {
  return typeof text === "string" ? Buffer.from(text, "utf8") : text;
}

/** Message for a token `readUint` refused: `what` names the field, e.g. "vertex id". */
export function badUintMessage(buf: Uint8Array, s: number, e: number, code: number, what: string): string {
  return code === UINT_TOO_BIG
    ? `${what} ${quoteToken(buf, s, e)} is too large (at most ${MAX_INT_TOKEN})`
    : `expected ${what} (a non-negative integer), got ${quoteToken(buf, s, e)}`;
}

/** Message for a weight token `readDecimal` refused or read as ±Infinity. */
export function badWeightMessage(buf: Uint8Array, s: number, e: number, value: number): string {
  return Number.isNaN(value)
    ? `expected a number as edge weight, got ${quoteToken(buf, s, e)}`
    : `edge weight ${quoteToken(buf, s, e)} is out of the floating-point range`;
}

/** Collects the tokens of one line into fixed slots (no allocation): up to `starts.length`, then counts only. */
export class LineTokens {
  readonly starts: Int32Array;
  readonly ends: Int32Array;
  count = 0;
  constructor(slots: number) {
    this.starts = new Int32Array(slots);
    this.ends = new Int32Array(slots);
  }

  /**
   * Split buf[s, e) at blanks. With `comments`, a token starting with '#' or '%' ends the line.
   * Returns the number of tokens (which may exceed the slots; extra tokens are only counted).
   */
  split(buf: Uint8Array, s: number, e: number, comments: boolean): number {
    let c = 0;
    let p = skipBlanks(buf, s, e);
    while (p < e) {
      if (comments && (buf[p] === 35 || buf[p] === 37)) break;
      const t = tokenEnd(buf, p, e);
      if (c < this.starts.length) {
        this.starts[c] = p;
        this.ends[c] = t;
      }
      c++;
      p = skipBlanks(buf, t, e);
    }
    this.count = c;
    return c;
  }
}
