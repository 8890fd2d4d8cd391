// Shared wording for `freeOf` claims that follow from one structural fact (bipartite, a forest),
// so each family states the fact once and the derived patterns stay consistent.

import type { FreeOfClaim } from "./types.js";

/** A bipartite graph has no odd cycle: K3, C5 and C7 are the odd patterns `halfplus graph` names. */
export function bipartiteFreeOf(citation: string): FreeOfClaim[] {
  return ["K3", "C5", "C7"].map((pattern) => ({ pattern, citation: `bipartite: ${citation}` }));
}

/** Girth g rules out every cycle shorter than g (K3 = C3). */
export function girthFreeOf(girth: number, citation: string): FreeOfClaim[] {
  const out: FreeOfClaim[] = [];
  for (let len = 3; len < girth && len <= 8; len++) out.push({ pattern: len === 3 ? "K3" : `C${len}`, citation: `girth ${girth}: ${citation}` });
  return out;
}
