// The one number parser for spec strings and command-line options: plain decimal notation only.
// Number() would also take "0x10", "0b101", "0o7", " 5", "" (as 0) and "Infinity" without a word.

/** Optional sign, digits with an optional fraction (or a fraction alone), optional exponent; nothing else. */
export const DECIMAL_RE = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** The value of a plain decimal number, or NaN for anything else (hex, binary, octal, blanks, words). */
export function parseDecimal(text: string): number {
  return DECIMAL_RE.test(text) ? Number(text) : NaN;
}
