// Shared wording for `freeOf` entries that follow from one structural fact (bipartite, a forest),
// so each family states the fact once and the derived patterns stay consistent.

/** A bipartite graph has no odd cycle: K3, C5 and C7 are the odd patterns `halfplus graph` names. */
export function bipartiteFreeOf(source: string): { pattern: string; source: string }[] {
  return ["K3", "C5", "C7"].map((pattern) => ({ pattern, source: `bipartite: ${source}` }));
}

/** Girth g rules out every cycle shorter than g (K3 = C3). */
export function girthFreeOf(girth: number, source: string): { pattern: string; source: string }[] {
  const out: { pattern: string; source: string }[] = [];
  for (let len = 3; len < girth && len <= 8; len++) out.push({ pattern: len === 3 ? "K3" : `C${len}`, source: `girth ${girth}: ${source}` });
  return out;
}
