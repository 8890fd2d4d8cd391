// The extended binary Golay code [24,12,8] as 4096 bitmask codewords: the span of the cyclic shifts of
// the quadratic residues mod 23 (the [23,12,7] quadratic-residue code) plus an overall parity bit 23.

import { popcount } from "../../graph/bits.js";

export function extendedGolayCodewords(): Uint32Array {
  const residues = new Set<number>();
  for (let x = 1; x < 23; x++) residues.add((x * x) % 23);
  // Reduced row echelon over GF(2), keyed by leading bit, from the 23 shifts.
  const basis: number[] = [];
  for (let s = 0; s < 23; s++) {
    let v = 0;
    for (const r of residues) v |= 1 << ((r + s) % 23);
    for (const b of basis) if ((v ^ b) < v) v ^= b;
    if (v !== 0) {
      basis.push(v);
      basis.sort((a, b) => b - a); // largest leading bit first keeps the reduction greedy-correct
    }
  }
  const words = new Uint32Array(1 << basis.length);
  for (let i = 1; i < words.length; i++) {
    const low = i & -i;
    const w = words[i ^ low] ^ basis[31 - Math.clz32(low)];
    words[i] = w;
  }
  for (let i = 0; i < words.length; i++) if (popcount(words[i]) % 2 === 1) words[i] |= 1 << 23;
  return words;
}
