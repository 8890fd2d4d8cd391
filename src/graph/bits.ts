// Bit tricks on 32-bit integers, for the searches and constructions that keep vertex sets as masks.

/**
 * Number of set bits of the 32-bit integer x (SWAR count: Warren, Hacker's Delight, 2nd ed., §5-1).
 * Any JavaScript number is read as its low 32 bits.
 */
export function popcount(x: number): number {
  x = x - ((x >>> 1) & 0x55555555);
  x = (x & 0x33333333) + ((x >>> 2) & 0x33333333);
  return (Math.imul((x + (x >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24) & 0xff;
}
