// Exact max cut for graphs of about a hundred vertices: best-first branch and bound whose nodes are
// bounded by the SDP relaxation, plain or strengthened by triangle inequalities (the scheme of the
// SDP-based exact solvers, Rendl, Rinaldi and Wiegele, Math. Programming 121 (2010)).
//
// One vertex (the largest degree) is fixed on side 0 by symmetry. A node fixes more vertices and is
// solved as its reduced problem (./reduced-graph.ts): offset + a bound of a graph on the free
// vertices plus z. Nodes with few free vertices are solved exactly (Gray code). A node is closed when
// ⌊offset + bound⌋ ≤ the best cut; otherwise its vectors are rounded for a better cut, and it branches
// on the free vertex least decided by the relaxation (|⟨v_z, v_u⟩| smallest). The open node with the
// largest bound goes next, so that bound is the search's upper end at every moment (anytime).
//
// The evidence (`regions`): closed nodes with their certificates, and for an unfinished search the
// parents of the open nodes with theirs; together they cover every cut with the fixed vertex on
// side 0 (`verifyTreeCertificate` checks the covering and re-proves every bound).

import { InputError, invalidParameter } from "../../errors.js";
import { checkPartition, cutValue, floorCutBound } from "../../graph/cut-value.js";
import type { Graph } from "../../graph/graph.js";
import { EXACT_INTEGER_TOTAL, hasIntegerWeights, positiveWeightSum } from "../../graph/weights.js";
import { roundUp } from "../../linalg/float-rounding.js";
import { checkSeed } from "../../random/seed.js";
import { checkSeconds } from "../../validate.js";
import { checkWork, nowSeconds, PROGRESS_INTERVAL } from "../exact/common.js";
import { exactMaxCut } from "../exact/exact-max-cut.js";
import { hyperplaneRound } from "../heuristic/hyperplane-rounding.js";
import { localSearch } from "../heuristic/local-search.js";
import { triangleListProblem, verifyTriangleCertificate, type TriangleCertificate } from "../relaxation/triangle-dual.js";
import { solveTriangleSdp } from "../relaxation/triangle-sdp.js";
import type { CutRecord } from "../types.js";
import { mapTrianglesAfterFix, reducedProblem, trianglesAtRoot } from "./reduced-graph.js";
import { nodeParity, oddDegreeVertices, parityFloor } from "./parity.js";
import { childStabiliser, keepsFixings, orbitWithWitnesses, type TreeOrbitalBranch } from "./symmetry.js";
import { isAutomorphism, listAutomorphisms } from "../../graph/structure/automorphisms.js";

// The choices live in a module of their own so that the command line can list them without
// loading the search.
export { TREE_BRANCHINGS, TREE_RELAXATIONS, type TreeBranching, type TreeRelaxation } from "./tree-choices.js";
import { TREE_BRANCHINGS, TREE_RELAXATIONS, type TreeBranching, type TreeRelaxation } from "./tree-choices.js";

/** Nodes with at most this many free vertices are solved exactly by Gray code. */
export const TREE_LEAF_VERTICES = 16;
/**
 * Parity branching (see `TreeSearchOptions.parity`) only for graphs with at most this many vertices
 * of odd degree: fixing them all takes that many levels (fewer under orbital branching); ER_9 has 10.
 */
export const PARITY_BRANCH_LIMIT = 24;

/**
 * A part of the search space and why no cut in it beats the record's upper end: the vertices fixed
 * on the way to it (in branching order) with their sides, and either a strengthened-SDP certificate
 * of its reduced problem or "exhaustive" (verify solves the small reduced problem itself).
 */
export interface TreeRegion {
  vertices: number[];
  sides: number[];
  /** offset + the reduced problem's bound, rounded down: no cut in the region exceeds it. */
  bound: number;
  certificate: (Omit<TriangleCertificate, "y" | "triangles" | "mu"> & { y: number[]; triangles: number[]; mu: number[] }) | { kind: "exhaustive" };
}

export interface TreeCertificate {
  /** The vertex fixed on side 0 by symmetry. */
  rootVertex: number;
  relaxation: TreeRelaxation;
  regions: TreeRegion[];
  /** Orbital branches (./symmetry.ts); absent when none. */
  orbital?: TreeOrbitalBranch[];
  /** The automorphisms `orbital` refers to, as permutations of the vertices. */
  automorphisms?: number[][];
}

export interface TreeSearchOptions {
  /** Wall-clock budget (default 600 s); checked between nodes. */
  seconds?: number;
  /** Deterministic work budget: nodes (default none). Same seed and work give the same result. */
  work?: number;
  solverSeed?: number;
  /** A known good partition to start from (the best cut so far). */
  initial?: ArrayLike<number>;
  /** Node bound (default "triangles"). */
  relaxation?: TreeRelaxation;
  /** Separation rounds per node for "triangles" (default 100; fewer when the descent is too slow to prune). */
  roundsPerNode?: number;
  /** Separation rounds at the root (default 1000: on a random 3-regular graph with 100 vertices the bound fell from 138.6 after 25 rounds to 135.0 after 800, bench/exact-hundred). */
  rootRounds?: number;
  /**
   * "triangles": strengthen a node only when its plain bound is within this much, plus 1.5 times what
   * the inequalities gained at the nearest strengthened ancestor, of pruning (default 2; the root is
   * always strengthened; Infinity: every node).
   */
  strengthenWithin?: number;
  /** "triangles": separation every this many rounds after the first two (default 3). */
  separateEvery?: number;
  /**
   * Branching rule (default "auto"): the free vertex whose SDP vector is closest to orthogonal to z's
   * ("least-decided"), or closest to ±z's ("most-decided"), or "auto": short probes of both decide
   * (`relaxationTreeSearch`).
   */
  branching?: TreeBranching;
  /**
   * Bytes of warm-start data (parent vectors, inherited inequalities) the open nodes may hold
   * (default 2^30). Past it, the open nodes farthest from the top of the heap lose theirs (down to
   * three quarters of the allowance) and start cold when reached: bounds stay certified, only
   * their cost changes. Deterministic: it counts array bytes, not the process's memory.
   */
  warmMemory?: number;
  /**
   * Open nodes the best-first heap may hold (default 200,000). Past it, each node taken from the
   * heap has its whole subtree searched depth first (a stack of about two nodes per level) before
   * the heap is used again, so the open list stops growing; the upper end stays proven (the largest
   * region bound) but may fall later than best first would let it.
   */
  maxOpen?: number;
  /**
   * "triangles": inequalities of the whole graph (four integers each, as in a `triangle-dual`
   * certificate) and their multipliers to start the root's rounds from, e.g. those of an earlier
   * strengthened bound of the same graph; the root then continues instead of starting over.
   */
  rootTriangles?: { triangles: ArrayLike<number>; mu: ArrayLike<number> };
  /**
   * Orbital branching (default true; ./symmetry.ts): where automorphisms of the graph keep a node's
   * fixings, branch on "v on its likely side" and "v's whole orbit on the other side". The
   * automorphisms are listed once, within a fixed work cap (src/graph/structure/automorphisms.ts).
   */
  symmetry?: boolean;
  /**
   * Parity of the cut (default true; ./parity.ts): a node that has fixed every vertex of odd weighted
   * degree closes at the largest integer of its cuts' parity below its bound. When the graph has at
   * most `PARITY_BRANCH_LIMIT` such vertices, the root is one of them and a node whose bound is one
   * above the incumbent branches on them first (the rule's pick among them), so that half its cuts
   * can close by parity.
   */
  parity?: boolean;
  /** Called about every half second with the bracket so far; `closedShare` is the share of all cuts in closed regions (2^−depth each under ordinary branching); `warmBytes` the warm-start data held by open nodes. */
  onProgress?: (p: { lower: number; upper: number; nodes: number; open: number; seconds: number; closedShare: number; warmBytes: number }) => void;
}

export interface TreeSearchRecord extends CutRecord {
  status: "optimal" | "time-limit" | "work-limit";
  /** Proven: no cut exceeds it (the largest bound of a region, or the cut itself). */
  upper: number;
  nodes: number;
  relaxation: TreeRelaxation;
  certificate: TreeCertificate;
}

/** A parent's SDP vectors without the rows of the vertices a child fixes: under ordinary branching one copy shared by both children. */
interface WarmVectors {
  data: Float64Array;
  rank: number;
  /** Open children still holding it; its bytes leave the count when this reaches 0. */
  holders: number;
}

/** Default `warmMemory`: 1 GiB. ER_8 held 4 GB after 350,000 open nodes without a cap (bench/exact-hundred). */
export const TREE_WARM_MEMORY = 2 ** 30;

const NO_SIDE = new Uint8Array(0);

/** Default `maxOpen`: ER_8 held 350,000 open nodes in 4 GB before warm data was capped (bench/exact-hundred). */
export const TREE_MAX_OPEN = 200_000;

interface Node {
  /** Sides of every vertex (255 = free) while the node is open; emptied once it is evaluated. */
  side: Uint8Array;
  /** The (vertex, side) fixings in order while open; emptied once evaluated (its region keeps them). */
  path: number[];
  depth: number;
  /** The parent's bound (Infinity at the root): an upper end for every cut in the node. */
  bound: number;
  parent: Node | null;
  /** The parent's SDP vectors restricted to this node's reduced vertices (a warm start), or null. */
  warm: WarmVectors | null;
  /** The parent's triangle inequalities and multipliers written for this node (a warm start), or null. */
  warmTriangles: { triangles: Int32Array; mu: Float64Array } | null;
  /** How much the inequalities lowered the nearest strengthened ancestor's bound (Infinity at the root). */
  gain: number;
  /** Set when the node was evaluated: its own region evidence; dropped from a branched node once neither child is open (no certificate can need it then). */
  region: TreeRegion | null;
  /** Children not yet evaluated (2 after branching). */
  openKids: number;
  seq: number;
  /** Automorphisms (indices into the listed ones) keeping the node's fixings and sides, or null when none but the identity. */
  stab: Int32Array | null;
  /** The share of all cuts the node stands for: 2^−depth under ordinary branching; an orbital branch's second child gets 2^−|orbit| of its parent's, the first the rest (it stands for the orbit's images too). */
  share: number;
  /** An ancestor (or the node itself) has a bound below the root's: its share is counted in `droppedShare`. */
  dropped: boolean;
}

/** Max-heap on (bound, depth, −seq): best bound first, deeper first among equals, then oldest. */
class NodeHeap {
  private readonly a: Node[] = [];
  get size(): number {
    return this.a.length;
  }
  top(): Node | undefined {
    return this.a[0];
  }
  private before(x: Node, y: Node): boolean {
    return x.bound !== y.bound ? x.bound > y.bound : x.depth !== y.depth ? x.depth > y.depth : x.seq < y.seq;
  }
  push(x: Node): void {
    const a = this.a;
    a.push(x);
    let i = a.length - 1;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (!this.before(a[i], a[p])) break;
      [a[i], a[p]] = [a[p], a[i]];
      i = p;
    }
  }
  pop(): Node | undefined {
    const a = this.a;
    const top = a[0];
    const last = a.pop();
    if (a.length > 0 && last !== undefined) {
      a[0] = last;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1, r = l + 1;
        let b = i;
        if (l < a.length && this.before(a[l], a[b])) b = l;
        if (r < a.length && this.before(a[r], a[b])) b = r;
        if (b === i) break;
        [a[i], a[b]] = [a[b], a[i]];
        i = b;
      }
    }
    return top;
  }
  all(): Node[] {
    return this.a.slice();
  }
  /** The nodes ordered from the bottom (popped last) to the top. */
  worstFirst(): Node[] {
    return this.a.slice().sort((x, y) => (this.before(x, y) ? 1 : this.before(y, x) ? -1 : 0));
  }
}

const OWNER = "relaxationTreeSearch";

function plainCertificate(c: TriangleCertificate): TreeRegion["certificate"] {
  return { kind: c.kind, y: Array.from(c.y), shift: c.shift, shiftProof: c.shiftProof, triangles: Array.from(c.triangles), mu: Array.from(c.mu) };
}

/**
 * Nodes each probe of `branching: "auto"` may use (`relaxationTreeSearch`), at most a quarter of the
 * work budget. At 30–100 nodes the two rules already differ clearly on the targets of issue 11
 * (bench/exact-hundred; see DEVELOPERS.md): after 48 nodes from a breakout cut, G(80, 0.3) has upper
 * ends 580 (least-decided) and 585 (most-decided); on ER_7 the upper ends are equal and most-decided
 * had 3.8 % of the cuts closed after 100 nodes and least-decided none.
 */
export const AUTO_PROBE_NODES = 48;

/**
 * Exact max cut by relaxation-bounded branch and bound (see the file header). Integer weights only.
 *
 * `branching: "auto"` (the default) probes: a search with each rule under `AUTO_PROBE_NODES` nodes
 * (least-decided first; a probe that finishes is the answer), then the whole search with the rule
 * whose probe left the lower upper end; ties go to the larger share of the cuts closed, then to the
 * larger share in nodes whose bound fell below the root's (`droppedShare`: progress that does not
 * wait for a good incumbent), then to least-decided. The probes' best cut seeds the search; their nodes count in `workUsed` and in the
 * work budget. Deterministic under a work budget, like every rule.
 */
export function relaxationTreeSearch(graph: Graph, options: TreeSearchOptions = {}): TreeSearchRecord {
  const branching = options.branching ?? "auto";
  if (!TREE_BRANCHINGS.includes(branching)) throw invalidParameter(OWNER, "branching", `should be one of ${TREE_BRANCHINGS.join(", ")}`, branching);
  if (branching !== "auto") return searchWithRule(graph, { ...options, branching });
  const t0 = nowSeconds();
  const seconds = checkSeconds(OWNER, options.seconds, 600);
  const workLimit = checkWork(OWNER, options.work);
  const probe = Math.min(AUTO_PROBE_NODES, Math.floor(workLimit / 4));
  const withProbes = (r: TreeSearchRecord, chosen: TreeBranching, probeNodes: number): TreeSearchRecord => {
    const used = Number(r.details?.workUsed ?? r.nodes) + probeNodes;
    return { ...r, seconds: nowSeconds() - t0, details: { ...r.details, workUsed: used, branching: chosen, probeNodes } };
  };
  if (probe < 1) return withProbes(searchWithRule(graph, { ...options, branching: "least-decided" }), "least-decided", 0);
  const left = (): number => Math.max(1e-3, seconds - (nowSeconds() - t0));
  const probeOptions = { ...options, onProgress: undefined, work: probe };
  const least = searchWithRule(graph, { ...probeOptions, seconds: left(), branching: "least-decided" });
  if (least.status !== "work-limit") return withProbes(least, "least-decided", 0);
  const most = searchWithRule(graph, { ...probeOptions, seconds: left(), initial: least.partition, branching: "most-decided" });
  if (most.status !== "work-limit") return withProbes(most, "most-decided", least.nodes);
  // Compared in turn: the upper end (what the search must bring down to the incumbent), the share of
  // cuts closed, the share whose bound fell below the root's (progress even while the incumbent is
  // too weak to close anything).
  const score = (r: TreeSearchRecord): number[] => [-r.upper, Number(r.details?.closedShare ?? 0), Number(r.details?.droppedShare ?? 0)];
  const [a, b] = [score(least), score(most)];
  const k = a.findIndex((x, i) => x !== b[i]);
  const chosen: TreeBranching = k >= 0 && b[k] > a[k] ? "most-decided" : "least-decided";
  const probeNodes = least.nodes + most.nodes;
  const best = most.value >= least.value ? most.partition : least.partition;
  const work = options.work === undefined ? undefined : Math.max(1, workLimit - probeNodes);
  return withProbes(searchWithRule(graph, { ...options, seconds: left(), work, initial: best, branching: chosen }), chosen, probeNodes);
}

/** The search with a fixed branching rule. */
function searchWithRule(graph: Graph, options: TreeSearchOptions & { branching: Exclude<TreeBranching, "auto"> }): TreeSearchRecord {
  const t0 = nowSeconds();
  const seconds = checkSeconds(OWNER, options.seconds, 600);
  const workLimit = checkWork(OWNER, options.work);
  const seed = checkSeed(OWNER, "solverSeed", options.solverSeed);
  const relaxation = options.relaxation ?? "triangles";
  if (!TREE_RELAXATIONS.includes(relaxation)) throw invalidParameter(OWNER, "relaxation", `should be one of ${TREE_RELAXATIONS.join(", ")}`, relaxation);
  const rounds = options.roundsPerNode ?? 100;
  if (!(Number.isInteger(rounds) && rounds >= 0)) throw invalidParameter(OWNER, "roundsPerNode", "should be a non-negative integer", rounds);
  const rootRounds = options.rootRounds ?? 1000;
  if (!(Number.isInteger(rootRounds) && rootRounds >= 0)) throw invalidParameter(OWNER, "rootRounds", "should be a non-negative integer", rootRounds);
  if (!hasIntegerWeights(graph) || positiveWeightSum(graph) > EXACT_INTEGER_TOTAL) {
    throw new InputError(`${OWNER}: the graph should have integer weights (every cut then is an exact integer)`);
  }
  if (options.initial !== undefined) checkPartition(graph, options.initial, `${OWNER}: initial`);
  const n = graph.n;
  const deadline = t0 + seconds;
  const warmMemory = options.warmMemory ?? TREE_WARM_MEMORY;
  if (!(warmMemory >= 0)) throw invalidParameter(OWNER, "warmMemory", "should be a number of bytes ≥ 0", warmMemory);
  const maxOpen = options.maxOpen ?? TREE_MAX_OPEN;
  if (!(Number.isInteger(maxOpen) && maxOpen >= 0)) throw invalidParameter(OWNER, "maxOpen", "should be a non-negative integer", maxOpen);
  const strengthenWithin = options.strengthenWithin ?? 2;
  if (!(strengthenWithin >= 0)) throw invalidParameter(OWNER, "strengthenWithin", "should be a number ≥ 0", strengthenWithin);

  // The incumbent: the caller's cut or a quick local search, whichever is better.
  let partition: Uint8Array = Uint8Array.from(options.initial ?? localSearch(graph, { iterations: 8, solverSeed: seed }).partition);
  let lower = cutValue(graph, partition);
  const offer = (p: Uint8Array): void => {
    const v = cutValue(graph, p);
    if (v > lower) {
      lower = v;
      partition = p;
    }
  };

  // Parity (./parity.ts): the odd-degree vertices; branch on them first when they are few.
  const useParity = options.parity !== false;
  const odd = oddDegreeVertices(graph);
  const parityBranching = useParity && odd.length > 0 && odd.length <= PARITY_BRANCH_LIMIT;
  const isOdd = new Uint8Array(n);
  for (const v of odd) isOdd[v] = 1;
  let rootVertex = parityBranching ? odd[0] : 0;
  for (let v = 0; v < n; v++) if ((!parityBranching || isOdd[v] === 1) && graph.degree(v) > graph.degree(rootVertex)) rootVertex = v;
  let parityClosed = 0, parityBranches = 0;
  const closed: Node[] = [];
  const heap = new NodeHeap();
  let seq = 0;
  const rootSide = new Uint8Array(n).fill(255);
  if (n > 0) rootSide[rootVertex] = 0;
  let rootWarm: Node["warmTriangles"] = null;
  if (options.rootTriangles !== undefined && relaxation === "triangles" && n > 0) {
    const { triangles, mu } = options.rootTriangles;
    const problem = triangleListProblem(n, triangles, mu);
    if (problem !== null) throw invalidParameter(OWNER, "rootTriangles", problem, triangles.length);
    rootWarm = trianglesAtRoot(n, rootVertex, triangles, mu);
  }
  // Orbital branching: the automorphisms, and those used by the branches so far (renumbered).
  const autos = options.symmetry === false || n === 0 ? null : listAutomorphisms(graph);
  const elements = autos !== null && autos.elements.length > 1 ? autos.elements : null;
  const orbital: TreeOrbitalBranch[] = [];
  const usedAutos: number[][] = [];
  const autoIndex = new Map<number, number>();
  const useAuto = (e: number): number => {
    let k = autoIndex.get(e);
    if (k === undefined) {
      k = usedAutos.length;
      usedAutos.push(Array.from(elements![e]));
      autoIndex.set(e, k);
    }
    return k;
  };
  let rootStab: Int32Array | null = null;
  let orbitalBranches = 0;
  if (elements !== null) {
    const all = Int32Array.from(elements.keys());
    rootStab = childStabiliser(elements, all, [rootVertex]);
    if (rootStab.length <= 1) rootStab = null;
  }
  heap.push({ side: rootSide, path: [], depth: 0, bound: Infinity, parent: null, warm: null, region: null, openKids: 0, seq: seq++, warmTriangles: rootWarm, gain: Infinity, stab: rootStab, share: 1, dropped: false });
  let nodes = 0;
  let status: TreeSearchRecord["status"] = "optimal";
  let lastProgress = t0;
  let closedShare = 0;
  // The share of the cuts in nodes whose bound fell below the root's (the first such node on each
  // path): progress that does not wait for the incumbent, compared by the "auto" probes.
  let rootBound = Infinity, droppedShare = 0;
  const noteBound = (x: Node, b: number): void => {
    if (x.parent === null) rootBound = b;
    else if (!x.dropped && b < rootBound) {
      x.dropped = true;
      droppedShare += x.share;
    }
  };
  const branching = options.branching;
  // Depth-first dives (see `maxOpen`): the subtree of a node taken from a full heap, last in first out.
  const stack: Node[] = [];
  let dives = 0, beatenOnDives = 0;
  const upperNow = (): number => {
    let u = Math.max(lower, heap.size > 0 ? heap.top()!.bound : -Infinity);
    for (const x of stack) u = Math.max(u, x.bound);
    return u;
  };
  // Warm-start bytes held by open nodes (shared vectors counted once) and how many nodes lost theirs.
  let warmBytes = 0, warmDropped = 0;
  const releaseWarm = (x: Node): void => {
    if (x.warm !== null && --x.warm.holders === 0) warmBytes -= x.warm.data.byteLength;
    if (x.warmTriangles !== null) warmBytes -= x.warmTriangles.triangles.byteLength + x.warmTriangles.mu.byteLength;
    x.warm = null;
    x.warmTriangles = null;
  };
  // Over the allowance: drop the warm data of the nodes to be reached last, down to ¾ of it (so
  // the sort is paid once per quarter of the allowance, not once per node).
  const capWarm = (): void => {
    if (warmBytes <= warmMemory) return;
    for (const x of heap.worstFirst()) {
      if (warmBytes <= 0.75 * warmMemory) break;
      if (x.warm === null && x.warmTriangles === null) continue;
      releaseWarm(x);
      warmDropped++;
    }
  };

  while (heap.size > 0 || stack.length > 0) {
    const fromStack = stack.length > 0;
    const node = fromStack ? stack[stack.length - 1] : heap.top()!;
    if (node.bound <= lower) {
      if (!fromStack) break; // every open node is beaten by the incumbent: closed by its parent's bound
      // Beaten on a dive: it joins the heap's nodes at or below the incumbent, never taken again
      // and covered, like them, by its parent's region (the parent keeps it: openKids stays).
      stack.pop();
      releaseWarm(node);
      heap.push(node);
      beatenOnDives++;
      continue;
    }
    if (nodes >= workLimit) {
      status = "work-limit";
      break;
    }
    if (nowSeconds() > deadline) {
      status = "time-limit";
      break;
    }
    if (fromStack) stack.pop();
    else heap.pop();
    nodes++;
    // Its parent's region is needed only while a child is open.
    if (node.parent !== null && --node.parent.openKids === 0) node.parent.region = null;
    const red = reducedProblem(graph, node.side);
    const path = node.path, nodeSide = node.side;
    node.path = [];
    node.side = NO_SIDE;
    const freeCount = red.free.length;
    const toFull = (redSide: ArrayLike<number>): Uint8Array => {
      const p = new Uint8Array(n);
      for (let v = 0; v < n; v++) p[v] = nodeSide[v] === 255 ? 0 : nodeSide[v];
      for (let i = 0; i < freeCount; i++) p[red.free[i]] = redSide[i + 1] === redSide[0] ? 0 : 1;
      return p;
    };
    if (freeCount <= TREE_LEAF_VERTICES) {
      const ex = exactMaxCut(red.graph, { seconds: 60, solverSeed: seed });
      offer(toFull(ex.partition));
      node.region = { vertices: path.filter((_, i) => i % 2 === 0), sides: path.filter((_, i) => i % 2 === 1), bound: floorCutBound(red.offset + ex.upper), certificate: { kind: "exhaustive" } };
      noteBound(node, node.region.bound);
      releaseWarm(node);
      closed.push(node);
      closedShare += node.share;
      continue;
    }
    const target = lower - red.offset;
    const warm = node.warm !== null ? { initial: node.warm.data, rank: node.warm.rank } : {};
    const warmTri = node.warmTriangles !== null ? { warmTriangles: node.warmTriangles.triangles, warmMu: node.warmTriangles.mu } : {};
    releaseWarm(node);
    const sdp = solveTriangleSdp(red.graph, {
      solverSeed: seed, iterations: relaxation === "triangles" ? (node.parent === null ? rootRounds : rounds) : 0, target, stopGap: 1, firstTolerance: 1e-7,
      strengthenWithin: strengthenWithin + 1.5 * node.gain, stopWhenHopeless: true, separateEvery: options.separateEvery ?? 3, ...warm, ...warmTri,
    });
    // offset is an exact integer, the bound a float rounded up: round the sum up, then down to an
    // integer, then to the cuts' parity once every odd-degree vertex is fixed.
    const plainBound = floorCutBound(roundUp(red.offset + sdp.value, 1));
    const bound = useParity ? parityFloor(plainBound, nodeParity(odd, nodeSide)) : plainBound;
    if (bound < plainBound && bound <= lower) parityClosed++;
    noteBound(node, bound);
    node.region = {
      vertices: path.filter((_, i) => i % 2 === 0),
      sides: path.filter((_, i) => i % 2 === 1),
      bound,
      certificate: plainCertificate(sdp.certificate),
    };
    // A better cut from the node's vectors.
    const rounded = hyperplaneRound(red.graph, sdp.vectors, sdp.rank, { trials: 8, solverSeed: seed, polish: true });
    offer(toFull(rounded.partition));
    if (bound <= lower) {
      closed.push(node);
      closedShare += node.share;
    } else {
      // Branch on the free vertex least (or most) decided relative to z.
      const r = sdp.rank, V = sdp.vectors;
      const sign = branching === "least-decided" ? 1 : -1;
      let pick = 1, best = Infinity;
      // One above the incumbent: only odd-degree vertices (while some are free), so the parity can close it.
      let oddOnly = false;
      if (parityBranching && bound === lower + 1) for (let i = 0; i < freeCount && !oddOnly; i++) oddOnly = isOdd[red.free[i]] === 1;
      if (oddOnly) parityBranches++;
      for (let i = 1; i <= freeCount; i++) {
        if (oddOnly && isOdd[red.free[i - 1]] === 0) continue;
        let dot = 0;
        for (let t = 0; t < r; t++) dot += V[t] * V[i * r + t];
        if (sign * Math.abs(dot) < best) {
          best = sign * Math.abs(dot);
          pick = i;
        }
      }
      const v = red.free[pick - 1];
      let dotZ = 0;
      for (let t = 0; t < r; t++) dotZ += V[t] * V[pick * r + t];
      // Orbital branching where automorphisms keep the node's fixings: children "v on its likely
      // side" and "v's orbit on the other side" (./symmetry.ts); else the two sides of v.
      const orbit = node.stab !== null ? orbitWithWitnesses(elements!, node.stab, v) : null;
      const kids: { fix: number[]; side: number; stab: Int32Array | null; share: number }[] = [];
      if (orbit !== null && orbit.orbit.length > 1) {
        const likely = dotZ >= 0 ? 0 : 1;
        orbital.push({
          vertices: path.filter((_, i) => i % 2 === 0), sides: path.filter((_, i) => i % 2 === 1),
          vertex: v, side: likely, orbit: orbit.orbit, maps: orbit.witness.map((e) => (e < 0 ? -1 : useAuto(e))),
        });
        const tail = 2 ** -orbit.orbit.length;
        kids.push({ fix: [v], side: likely, stab: childStabiliser(elements!, node.stab!, [v]), share: node.share * (1 - tail) });
        kids.push({ fix: orbit.orbit, side: 1 - likely, stab: childStabiliser(elements!, node.stab!, orbit.orbit), share: node.share * tail });
        orbitalBranches++;
      } else {
        const stab = node.stab !== null ? childStabiliser(elements!, node.stab, [v]) : null;
        kids.push({ fix: [v], side: 0, stab, share: node.share / 2 }, { fix: [v], side: 1, stab, share: node.share / 2 });
      }
      // On a dive the second child goes on the stack first, so the first is searched first, as the heap would.
      const dive = fromStack || heap.size > maxOpen;
      if (dive) {
        if (!fromStack) dives++;
        kids.reverse();
      }
      node.openKids = kids.length;
      // Both children of an ordinary branch share one copy of the warm start.
      let shared: WarmVectors | null = null;
      for (const kid of kids) {
        // Reduced indices of the fixed vertices, largest first (so the earlier ones keep their index).
        const picks = kid.fix.map((x) => 1 + lowerBoundIndex(red.free, x)).sort((a, b) => b - a);
        // The child's warm start: the parent's vectors without the fixed vertices' rows.
        let warmKid: WarmVectors;
        if (shared !== null && kid.fix.length === 1) {
          warmKid = shared;
          warmKid.holders++;
        } else {
          const drop = new Uint8Array(freeCount + 1);
          for (const q of picks) drop[q] = 1;
          const data = new Float64Array((freeCount + 1 - picks.length) * r);
          for (let i = 0, o = 0; i <= freeCount; i++) if (drop[i] === 0) data.set(V.subarray(i * r, (i + 1) * r), r * o++);
          warmBytes += data.byteLength;
          warmKid = { data, rank: r, holders: 1 };
          if (kids.every((k) => k.fix.length === 1)) shared = warmKid;
        }
        const side = nodeSide.slice();
        const added: number[] = [];
        let inherited: Node["warmTriangles"] = relaxation === "triangles" && sdp.certificate.mu.length > 0 ? { triangles: sdp.certificate.triangles, mu: sdp.certificate.mu } : null;
        for (const q of picks) if (inherited !== null) inherited = mapTrianglesAfterFix(inherited.triangles, inherited.mu, q, kid.side);
        for (const x of kid.fix) {
          side[x] = kid.side;
          added.push(x, kid.side);
        }
        const gain = sdp.rounds > 0 ? sdp.plainValue - sdp.value : node.gain;
        if (inherited !== null) warmBytes += inherited.triangles.byteLength + inherited.mu.byteLength;
        const child: Node = {
          side, path: [...path, ...added], depth: node.depth + 1, bound, parent: node, warm: warmKid, region: null, openKids: 0,
          seq: seq++, warmTriangles: inherited, gain, stab: kid.stab !== null && kid.stab.length > 1 ? kid.stab : null, share: kid.share, dropped: node.dropped,
        };
        if (dive) stack.push(child);
        else heap.push(child);
      }
      capWarm();
    }
    const now = nowSeconds();
    if (options.onProgress !== undefined && now - lastProgress >= PROGRESS_INTERVAL) {
      lastProgress = now;
      options.onProgress({ lower, upper: upperNow(), nodes, open: heap.size + stack.length, seconds: now - t0, closedShare, warmBytes });
    }
  }
  // The evidence: closed regions, plus the parents of open nodes still above the incumbent (their
  // own region covers both children). Open nodes at or below the incumbent are covered the same way.
  const regionNodes = new Set<Node>(closed);
  // The root still open (a budget spent before it was bounded): no evidence, no bound.
  const rootOpen = heap.all().some((x) => x.parent === null);
  for (const open of [...heap.all(), ...stack]) if (open.parent !== null) regionNodes.add(open.parent);
  // A region whose ancestor is a region adds nothing: drop it.
  const regions: TreeRegion[] = [];
  let upper = lower;
  for (const node of regionNodes) {
    let a = node.parent;
    let covered = false;
    while (a !== null) {
      if (regionNodes.has(a)) {
        covered = true;
        break;
      }
      a = a.parent;
    }
    if (covered) continue;
    regions.push(node.region!);
    upper = Math.max(upper, node.region!.bound);
  }
  if (rootOpen) upper = floorCutBound(positiveWeightSum(graph));
  return {
    method: `exact-sdp-tree`,
    value: lower,
    partition,
    status,
    seconds: nowSeconds() - t0,
    solverSeed: seed,
    upper,
    nodes,
    relaxation,
    certificate: { rootVertex, relaxation, regions, ...(orbital.length > 0 ? { orbital, automorphisms: usedAutos } : {}) },
    details: {
      workUsed: nodes, nodes, regions: regions.length, relaxation, openNodes: heap.size + stack.length, warmDropped, dives, beatenOnDives,
      automorphisms: autos === null ? 0 : autos.elements.length, automorphismsComplete: autos === null ? false : autos.complete, orbitalBranches,
      oddDegreeVertices: odd.length, parityClosed, parityBranches, closedShare, droppedShare,
    },
  };
}

export interface TreeCheck {
  ok: boolean;
  /** The largest proven region bound (NaN when a check fails). */
  bound: number;
  message: string;
}

/**
 * Re-check a tree certificate from the graph alone: the regions must cover every cut with the root
 * vertex on side 0 (a region covers all cuts agreeing with its fixed vertices; an uncovered prefix
 * needs both sides of one vertex covered below it), and every region's bound is re-derived from
 * its reduced problem (a strengthened-SDP certificate re-proved, or the small problem re-solved).
 */
export function verifyTreeCertificate(graph: Graph, cert: TreeCertificate): TreeCheck {
  const bad = (message: string): TreeCheck => ({ ok: false, bound: NaN, message });
  const n = graph.n;
  if (!Number.isInteger(cert.rootVertex) || cert.rootVertex < 0 || cert.rootVertex >= Math.max(1, n)) return bad(`rootVertex ${cert.rootVertex} is not a vertex`);
  if (!Array.isArray(cert.regions) || cert.regions.length === 0) return bad("no regions");
  // Trie of region paths.
  interface Trie { region: boolean; kids: Map<string, Trie> }
  const root: Trie = { region: false, kids: new Map() };
  let bound = -Infinity;
  const odd = oddDegreeVertices(graph);
  for (let q = 0; q < cert.regions.length; q++) {
    const reg = cert.regions[q];
    if (!Array.isArray(reg.vertices) || !Array.isArray(reg.sides) || reg.vertices.length !== reg.sides.length) return bad(`region ${q}: vertices and sides differ in length`);
    const side = new Uint8Array(n).fill(255);
    if (n > 0) side[cert.rootVertex] = 0;
    let at = root;
    for (let k = 0; k < reg.vertices.length; k++) {
      const v = reg.vertices[k], s = reg.sides[k];
      if (!Number.isInteger(v) || v < 0 || v >= n || side[v] !== 255 || (s !== 0 && s !== 1)) return bad(`region ${q}: fixing ${k} (vertex ${v}, side ${s}) is invalid or repeated`);
      side[v] = s;
      const key = `${v}:${s}`;
      let next = at.kids.get(key);
      if (next === undefined) {
        next = { region: false, kids: new Map() };
        at.kids.set(key, next);
      }
      at = next;
    }
    at.region = true;
    const red = reducedProblem(graph, side);
    let b: number;
    if (reg.certificate.kind === "exhaustive") {
      if (red.free.length > TREE_LEAF_VERTICES) return bad(`region ${q}: ${red.free.length} free vertices are too many for an exhaustive region`);
      const ex = exactMaxCut(red.graph, { seconds: 60 });
      if (ex.status !== "optimal") return bad(`region ${q}: the exact search did not finish`);
      b = floorCutBound(red.offset + ex.upper);
    } else if (reg.certificate.kind === "triangle-dual") {
      const c = reg.certificate;
      const check = verifyTriangleCertificate(red.graph, { kind: "triangle-dual", y: Float64Array.from(c.y), shift: c.shift, shiftProof: c.shiftProof, triangles: Int32Array.from(c.triangles), mu: Float64Array.from(c.mu) });
      if (!check.ok) return bad(`region ${q}: ${check.message}`);
      // Every cut of the region has the parity its fixings decide, if they fix every odd-degree vertex (./parity.ts).
      b = parityFloor(floorCutBound(roundUp(red.offset + check.value, 1)), nodeParity(odd, side));
    } else return bad(`region ${q}: unknown certificate kind`);
    if (b > reg.bound) return bad(`region ${q}: re-derived bound ${b} is above the claimed ${reg.bound}`);
    bound = Math.max(bound, b);
  }
  // Fixings after the root: distinct vertices other than the root, sides 0 or 1.
  const validPath = (vertices: unknown, sides: unknown): vertices is number[] => {
    if (!Array.isArray(vertices) || !Array.isArray(sides) || vertices.length !== sides.length) return false;
    const seen = new Set<number>([cert.rootVertex]);
    for (let k = 0; k < vertices.length; k++) {
      const v = vertices[k], s = sides[k];
      if (!Number.isInteger(v) || v < 0 || v >= n || seen.has(v) || (s !== 0 && s !== 1)) return false;
      seen.add(v);
    }
    return true;
  };
  const walk = (vertices: readonly number[], sides: readonly number[]): Trie => {
    let t = root;
    for (let k = 0; k < vertices.length; k++) {
      const key = `${vertices[k]}:${sides[k]}`;
      let next = t.kids.get(key);
      if (next === undefined) t.kids.set(key, (next = { region: false, kids: new Map() }));
      t = next;
    }
    return t;
  };
  // Orbital branches (./symmetry.ts): each map must be an automorphism keeping the node's fixings
  // and sides and sending its orbit vertex to the branching vertex.
  const orbital = cert.orbital ?? [];
  const branchAt = new Map<Trie, TreeOrbitalBranch[]>();
  if (orbital.length > 0) {
    const autos = cert.automorphisms;
    if (!Array.isArray(autos)) return bad("orbital branches without automorphisms");
    const autoOk = new Map<number, boolean>();
    for (let q = 0; q < orbital.length; q++) {
      const b = orbital[q];
      if (!validPath(b.vertices, b.sides)) return bad(`orbital branch ${q}: invalid fixings`);
      const withOrbit = [...b.vertices, ...(Array.isArray(b.orbit) ? b.orbit : [])];
      if (!Array.isArray(b.orbit) || b.orbit.length < 1 || b.orbit[0] !== b.vertex || !validPath(withOrbit, withOrbit.map(() => 0)) || (b.side !== 0 && b.side !== 1)) return bad(`orbital branch ${q}: invalid orbit`);
      if (!Array.isArray(b.maps) || b.maps.length !== b.orbit.length || b.maps[0] !== -1) return bad(`orbital branch ${q}: one map per orbit vertex needed (−1 for the branching vertex)`);
      for (let i = 1; i < b.orbit.length; i++) {
        const e = b.maps[i];
        const perm = Number.isInteger(e) && e >= 0 && e < autos.length ? autos[e] : undefined;
        if (perm === undefined) return bad(`orbital branch ${q}: automorphism ${e} is not listed`);
        let ok = autoOk.get(e);
        if (ok === undefined) autoOk.set(e, (ok = Array.isArray(perm) && isAutomorphism(graph, perm)));
        if (!ok) return bad(`automorphism ${e} is not an automorphism of the graph`);
        if (perm[b.orbit[i]] !== b.vertex || !keepsFixings(perm, cert.rootVertex, b.vertices, b.sides)) {
          return bad(`orbital branch ${q}: automorphism ${e} does not send vertex ${b.orbit[i]} to ${b.vertex} keeping the fixings`);
        }
      }
      const t = walk(b.vertices, b.sides);
      branchAt.set(t, [...(branchAt.get(t) ?? []), b]);
    }
  }
  const covers = (t: Trie): boolean => {
    if (t.region) return true;
    const byVertex = new Map<string, number>();
    for (const [key, kid] of t.kids) {
      if (!covers(kid)) continue;
      const v = key.split(":")[0];
      byVertex.set(v, (byVertex.get(v) ?? 0) + 1);
    }
    for (const c of byVertex.values()) if (c === 2) return true;
    // An orbital branch: "vertex on side" covered, and the chain fixing the whole orbit on the other side.
    for (const b of branchAt.get(t) ?? []) {
      const first = t.kids.get(`${b.vertex}:${b.side}`);
      if (first === undefined || !covers(first)) continue;
      let at: Trie | undefined = t, done = false;
      for (let k = 0; k < b.orbit.length && at !== undefined && !done; k++) {
        at = at.kids.get(`${b.orbit[k]}:${1 - b.side}`);
        if (at !== undefined && at.region) done = true;
      }
      if (done || (at !== undefined && covers(at))) return true;
    }
    return false;
  };
  if (!covers(root)) return bad("the regions do not cover every cut");
  const also = orbital.length > 0 ? ` and ${orbital.length} orbital branches` : "";
  return { ok: true, bound, message: `${cert.regions.length} regions${also} cover every cut; largest bound ${bound}` };
}

/** Index of x in the sorted array a (x must be present). */
function lowerBoundIndex(a: Int32Array, x: number): number {
  let lo = 0, hi = a.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (a[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
