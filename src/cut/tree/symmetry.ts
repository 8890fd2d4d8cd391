// Orbital branching in the exact max-cut tree (Ostrowski, Linderoth, Rossi and Smriglio, "Orbital
// branching", Math. Programming 126 (2011) 147–178), for the cut problem with one vertex fixed.
//
// At a node with fixings F, let H be automorphisms of the graph that map F onto itself keeping each
// side (the node's stabiliser), v the vertex to branch on, s its likely side and O the orbit of v
// under H. Every cut of the node either has all of O on side 1 − s, or has some u ∈ O on side s;
// an h ∈ H with h(u) = v maps such a cut to a cut of the node with v on side s and the same value.
// So two children suffice: "v on side s" and "all of O on side 1 − s" (the second fixes |O|
// vertices at once). With |O| = 1 this is ordinary branching.
//
// The certificate lists, for each orbital branch, the node's fixings, v, s, O and for each u ∈ O
// the automorphism used (as a permutation of the vertices); verify checks that each one is an
// automorphism, maps u to v and F onto F with its sides, and that both children are covered.

/** One orbital branch of the tree (see the file header); its children are regions or branches below it. */
export interface TreeOrbitalBranch {
  /** The node's fixings after the root vertex, in branching order. */
  vertices: number[];
  sides: number[];
  /** The branching vertex and its side in the first child. */
  vertex: number;
  side: number;
  /** The orbit of `vertex`, in the order the second child fixes it (on side 1 − side); holds `vertex`. */
  orbit: number[];
  /** For each orbit vertex: index into the certificate's `automorphisms` of one mapping it to `vertex` (−1 for `vertex` itself). */
  maps: number[];
}

/**
 * The stabiliser kept by a child: the elements of `parent` (indices into `elements`) that map the
 * newly fixed vertices `fixed` onto themselves (they share one side), so they still map the child's
 * fixings onto themselves with every side kept.
 */
export function childStabiliser(elements: readonly Int32Array[], parent: Int32Array, fixed: ArrayLike<number>): Int32Array {
  const inSet = new Set<number>(Array.from(fixed));
  const out: number[] = [];
  for (const e of parent) {
    const g = elements[e];
    let ok = true;
    for (let i = 0; i < fixed.length && ok; i++) if (!inSet.has(g[fixed[i]])) ok = false;
    if (ok) out.push(e);
  }
  return Int32Array.from(out);
}

/**
 * The orbit of `v` under the stabiliser `group` (indices into `elements`): each u with some h(u) = v,
 * and that h (the first one found); `v` comes first, with −1 (it needs no map).
 */
export function orbitWithWitnesses(elements: readonly Int32Array[], group: Int32Array, v: number): { orbit: number[]; witness: number[] } {
  const orbit: number[] = [v], witness: number[] = [-1];
  const seen = new Set<number>();
  for (const e of group) {
    const g = elements[e];
    // u with g(u) = v: scan (n is small next to the search's other work per node).
    let u = -1;
    for (let x = 0; x < g.length; x++) {
      if (g[x] === v) {
        u = x;
        break;
      }
    }
    if (u === v || seen.has(u)) continue;
    seen.add(u);
    orbit.push(u);
    witness.push(e);
  }
  return { orbit, witness };
}

/**
 * Does `perm` map the fixings (root on side 0, then `vertices` on `sides`) onto themselves with every
 * side kept? `perm` must be a permutation of 0..n−1.
 */
export function keepsFixings(perm: ArrayLike<number>, root: number, vertices: readonly number[], sides: readonly number[]): boolean {
  const side = new Map<number, number>([[root, 0]]);
  vertices.forEach((v, i) => side.set(v, sides[i]));
  for (const [v, s] of side) if (side.get(perm[v]) !== s) return false;
  return true;
}
