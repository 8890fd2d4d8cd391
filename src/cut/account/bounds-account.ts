// The per-graph account of the surplus arguments: the bracket's surplus interval, then each
// evaluator (Edwards' two forms, the triangle-free form, the vector method with its default and its
// best choice found, the few-triangles form, the decomposition cut and its guarantee) as a surplus,
// as a fraction of the bracket's lower end, and the proof step that gives most away.
//
// Losses are measured from L, the surplus of the bracket's lower end (the best cut known), down to
// the evaluator's surplus, split into the steps of its argument so that they add up to L − surplus:
//   vector evaluators:  L − E (a random hyperplane instead of the best cut; E the exact expectation),
//                       E − normed (arcsine replaced by lines), normed − guarantee (norms replaced by
//                       their bounds 1 and 2); see src/bounds/vector-guarantee.ts;
//   decomposition:      L − S (S the decomposition cut's surplus), then S − guarantee by stage: the
//                       remainder's and the pieces' cuts above their guarantees, and the edges between
//                       parts, whose guarantee counts them as cut half the time;
//   Edwards:            one step, the whole gap (the bound reads only m, or only n and the components).

import { invalidParameter } from "../../errors.js";
import { surplusOf } from "../../graph/cut-value.js";
import type { Graph } from "../../graph/graph.js";
import { graphHash } from "../../graph/hash.js";
import { recordEnvelope, type RecordEnvelope } from "../../graph/record/envelope.js";
import type { GraphSource } from "../../graph/record/source.js";
import { edwardsEdgeBound, edwardsVertexBound } from "../../bounds/edwards.js";
import { fewTrianglesBound, type FewTrianglesRecord } from "../../bounds/few-triangles.js";
import { triangleFreeBound } from "../../bounds/triangle-free.js";
import type { LowerBoundRecord } from "../../bounds/types.js";
import { optimiseVectorChoice, vectorChoiceOptions, vectorOptimisedBound } from "../../bounds/vector-choice.js";
import { vectorMethodGuarantee, type VectorGuaranteeRecord } from "../../bounds/vector-guarantee.js";
import type { VectorSetOptions } from "../../bounds/vector-sets.js";
import { checkSeed } from "../../random/seed.js";
import { bracket, type BracketProgress } from "../bracket/bracket.js";
import type { BracketEffort, BracketRecord } from "../bracket/record.js";
import { decompositionBounds, decompositionBoundsOf, decompositionCut, type DecompositionCutRecord, type DecompositionOptions } from "../decomposition/decomposition-cut.js";
import { checkTrials } from "../heuristic/hyperplane-rounding.js";
import { vectorMethodExpectedCut, vectorMethodRound } from "../heuristic/vector-rounding.js";

const OWNER = "bounds account";

export const BOUNDS_ACCOUNT_KIND = "halfplus/bounds-account";
export const BOUNDS_ACCOUNT_VERSION = 1;

/** The evaluators of an account, in the order they are listed. */
export const ACCOUNT_EVALUATORS = [
  "edwards-edges",
  "edwards-vertices",
  "triangle-free",
  "vector-method",
  "vector-optimised",
  "few-triangles",
  "decomposition-cut",
  "decomposition-guarantee",
] as const;
export type AccountEvaluator = (typeof ACCOUNT_EVALUATORS)[number];

/** A named step of an argument and the surplus it gives away (negative: it gains). */
export type AccountStepName =
  | "reads-m-only"
  | "reads-n-and-components-only"
  | "hyperplane-vs-best-cut"
  | "arcsine-linearised"
  | "norms-bounded"
  | "best-cut-vs-decomposition"
  | "remainder-above-guarantee"
  | "pieces-above-guarantee"
  | "between-parts-counted-as-half";

export interface AccountStep {
  step: AccountStepName;
  loss: number;
}

export interface AccountRow {
  name: AccountEvaluator;
  applies: boolean;
  /** The surplus the evaluator gives (a lower bound, or for decomposition-cut a cut's surplus); null when it does not apply. */
  surplus: number | null;
  /** surplus / the bracket's lower-end surplus; null when either is missing or that surplus is not positive. */
  fractionOfLower: number | null;
  reason: string;
  /** The argument's steps from the bracket's lower end down to `surplus`; the losses add up to the gap. */
  steps: AccountStep[];
  /** The step with the largest loss, or null when the evaluator does not apply. */
  largestLoss: AccountStep | null;
}

/** A vector choice's guarantee next to its actual rounded cuts. */
export interface VectorChoiceCuts {
  guarantee: number;
  /** Exact expected surplus of one rounding (Σ_edges arccos(⟨x̂_i, x̂_j⟩)/π − m/2). */
  expectedSurplus: number;
  meanSurplus: number;
  stdErr: number;
  /** Best raw rounded cut's surplus (no local search). */
  bestSurplus: number;
  trials: number;
  solverSeed: number;
}

export interface BoundsAccountRecord extends RecordEnvelope<typeof BOUNDS_ACCOUNT_KIND> {
  version: typeof BOUNDS_ACCOUNT_VERSION;
  n: number;
  m: number;
  totalWeight: number;
  bracket: {
    lower: number;
    upper: number;
    surplusLower: number;
    surplusUpper: number;
    exact: boolean;
    upperKind: BracketRecord["upperKind"];
    lowerMethod: string;
    upperMethod: string;
    effort: BracketEffort;
    seconds: number;
    solverSeed: number;
  };
  evaluators: AccountRow[];
  /** The vector method's choices side by side; null for weighted graphs. */
  vector: {
    default: VectorChoiceCuts;
    optimised: VectorChoiceCuts & {
      optimiseSets: boolean;
      start: "default" | "uniform";
      sweeps: number;
      status: "converged" | "iteration-limit";
      switchedOff: number;
      droppedMembers: number;
      /** ε_i of the choice found. */
      eps: number[];
      /** [i, k]: k ∈ N(i) left out of V_i (V_i = N(i) minus these; ignored where ε_i = 0). */
      dropped: [number, number][];
    };
    uniform: { eps: number; guarantee: number; expectedSurplus: number; regime: FewTrianglesRecord["regime"]; triangles: number; maxDegree: number };
  } | null;
  /** The decomposition cut (its partition and pieces); null for weighted graphs. */
  decomposition: (Omit<DecompositionCutRecord, "partition"> & { partition: number[] }) | null;
  notes: string[];
}

export interface BoundsAccountOptions {
  /** Bracket time budget in seconds (default 10, unless `work` is given). */
  seconds?: number;
  /** Bracket work budget in units instead of seconds (deterministic; see `bracket`'s `work`). */
  work?: number;
  effort?: BracketEffort;
  /** Seed of the bracket's solvers and of every rounding (default 0). */
  solverSeed?: number;
  /** A bracket of this graph already computed (e.g. by a notebook or a store); it must carry the graph's hash. */
  bracket?: BracketRecord;
  /** Rounding trials per vector choice (default 200). */
  trials?: number;
  /** Optimise the sets V_i as well as ε (default true). */
  optimiseSets?: boolean;
  /** Options of the decomposition cut (its solverSeed comes from `solverSeed`). */
  decomposition?: Omit<DecompositionOptions, "solverSeed">;
  source?: GraphSource;
  notes?: readonly string[];
  /** Progress of the bracket. */
  onProgress?: (p: BracketProgress) => void;
  /** Called before each later stage ("vector method", "decomposition"). */
  onStage?: (stage: string) => void;
}

function seedFor(seed: number, k: number): number {
  return (seed + Math.imul(k + 1, 0x6c8e9cf5)) >>> 0;
}

function stepsWithLargest(steps: AccountStep[]): { steps: AccountStep[]; largestLoss: AccountStep | null } {
  let largest: AccountStep | null = null;
  for (const s of steps) if (largest === null || s.loss > largest.loss) largest = s;
  return { steps, largestLoss: largest };
}

function row(name: AccountEvaluator, b: LowerBoundRecord, lowerSurplus: number, steps: AccountStep[]): AccountRow {
  if (!b.applies || b.surplus === null) return { name, applies: false, surplus: null, fractionOfLower: null, reason: b.reason, steps: [], largestLoss: null };
  return { name, applies: true, surplus: b.surplus, fractionOfLower: lowerSurplus > 0 ? b.surplus / lowerSurplus : null, reason: b.reason, ...stepsWithLargest(steps) };
}

/** The three steps of a vector argument: best cut → expectation → normed form → guarantee. */
function vectorSteps(lowerSurplus: number, expected: number, g: VectorGuaranteeRecord): AccountStep[] {
  return [
    { step: "hyperplane-vs-best-cut", loss: lowerSurplus - expected },
    { step: "arcsine-linearised", loss: expected - g.normedTerm },
    { step: "norms-bounded", loss: g.normedTerm - (g.surplus as number) },
  ];
}

function roundChoice(graph: Graph, choice: VectorSetOptions, trials: number, solverSeed: number, guarantee: number): VectorChoiceCuts {
  const r = vectorMethodRound(graph, { ...choice, trials, solverSeed });
  const d = r.details!;
  return {
    guarantee,
    expectedSurplus: d.expectedSurplus as number,
    meanSurplus: d.meanSurplus as number,
    stdErr: d.stdErr as number,
    bestSurplus: d.bestRoundedSurplus as number,
    trials,
    solverSeed,
  };
}

/**
 * The account of one graph: how close each surplus argument comes to the best cut known, and which
 * of its steps gives most away. Runs `bracket()` unless one is passed in.
 */
export function boundsAccount(graph: Graph, options: BoundsAccountOptions = {}): BoundsAccountRecord {
  const solverSeed = checkSeed(OWNER, "solverSeed", options.solverSeed);
  const trials = checkTrials(OWNER, options.trials, 200);
  const optimiseSets = options.optimiseSets ?? true;
  if (typeof optimiseSets !== "boolean") throw invalidParameter(OWNER, "optimiseSets", "should be true or false", optimiseSets);
  let br = options.bracket;
  if (br !== undefined) {
    const h = graphHash(graph);
    if (br.graphHash !== h) throw invalidParameter(OWNER, "bracket", `should be a bracket of this graph (hash ${h})`, br.graphHash);
  } else {
    br = bracket(graph, { seconds: options.seconds, work: options.work, effort: options.effort, solverSeed, onProgress: options.onProgress, source: options.source });
  }
  const L = br.surplusLower;
  const notes = [...(options.notes ?? [])];
  const rows: AccountRow[] = [];

  const ee = edwardsEdgeBound(graph);
  rows.push(row("edwards-edges", ee, L, ee.surplus === null ? [] : [{ step: "reads-m-only", loss: L - ee.surplus }]));
  const ev = edwardsVertexBound(graph);
  rows.push(row("edwards-vertices", ev, L, ev.surplus === null ? [] : [{ step: "reads-n-and-components-only", loss: L - ev.surplus }]));

  let vector: BoundsAccountRecord["vector"] = null;
  let decomposition: BoundsAccountRecord["decomposition"] = null;
  if (graph.weighted) {
    // Each evaluator says itself why it does not apply.
    rows.push(row("triangle-free", triangleFreeBound(graph), L, []));
    rows.push(row("vector-method", vectorMethodGuarantee(graph), L, []));
    rows.push(row("vector-optimised", vectorOptimisedBound(graph), L, []));
    rows.push(row("few-triangles", fewTrianglesBound(graph), L, []));
    const asBounds = decompositionBounds(graph);
    rows.push(row("decomposition-cut", asBounds.cut, L, []), row("decomposition-guarantee", asBounds.guarantee, L, []));
    notes.push("weighted graph: only the bracket applies; every surplus argument here is for unweighted graphs");
  } else {
    options.onStage?.("vector method");
    const def = vectorMethodGuarantee(graph);
    const defCuts = roundChoice(graph, {}, trials, seedFor(solverSeed, 0), def.surplus as number);
    const tf = triangleFreeBound(graph);
    rows.push(row("triangle-free", tf, L, vectorSteps(L, defCuts.expectedSurplus, def)));
    rows.push(row("vector-method", def, L, vectorSteps(L, defCuts.expectedSurplus, def)));

    const best = optimiseVectorChoice(graph, { optimiseSets });
    const chosen = vectorChoiceOptions(best.choice);
    const optCuts = roundChoice(graph, chosen, trials, seedFor(solverSeed, 1), best.guarantee.surplus as number);
    rows.push(row("vector-optimised", best.guarantee, L, vectorSteps(L, optCuts.expectedSurplus, best.guarantee)));

    const few = fewTrianglesBound(graph);
    const uniformEps = Array.from({ length: graph.n }, (_, i) => (graph.degree(i) > 0 ? few.eps : 0));
    // The uniform choice's guarantee from the one evaluator: its normed form gives the steps.
    const uniform = vectorMethodGuarantee(graph, { eps: uniformEps });
    const uniformExpected = surplusOf(graph, vectorMethodExpectedCut(graph, { eps: uniformEps }));
    rows.push(row("few-triangles", few, L, vectorSteps(L, uniformExpected, { ...uniform, surplus: few.surplus })));

    const dropped: [number, number][] = [];
    const { offsets: co, members: cm, eps } = best.choice;
    for (let i = 0; i < graph.n; i++) {
      if (eps[i] === 0) continue;
      let p = co[i];
      for (const k of graph.neighborsOf(i)) {
        if (p < co[i + 1] && cm[p] === k) p++;
        else dropped.push([i, k]);
      }
    }
    vector = {
      default: defCuts,
      optimised: {
        ...optCuts,
        optimiseSets: best.optimiseSets,
        start: best.start,
        sweeps: best.sweeps,
        status: best.status,
        switchedOff: best.switchedOff,
        droppedMembers: best.droppedMembers,
        eps: Array.from(eps),
        dropped,
      },
      uniform: { eps: few.eps, guarantee: few.surplus as number, expectedSurplus: uniformExpected, regime: few.regime, triangles: few.triangles, maxDegree: few.maxDegree },
    };

    options.onStage?.("decomposition");
    const dc = decompositionCut(graph, { ...options.decomposition, solverSeed: seedFor(solverSeed, 3) });
    const bySum = (kind: string, f: "surplus" | "guarantee") => dc.stages.filter((s) => s.kind === kind).reduce((a, s) => a + s[f], 0);
    const asBounds = decompositionBoundsOf(graph, dc);
    rows.push(row("decomposition-cut", asBounds.cut, L, [{ step: "best-cut-vs-decomposition", loss: L - dc.surplus }]));
    rows.push(
      row("decomposition-guarantee", asBounds.guarantee, L, [
        { step: "best-cut-vs-decomposition", loss: L - dc.surplus },
        { step: "remainder-above-guarantee", loss: bySum("remainder", "surplus") - bySum("remainder", "guarantee") },
        { step: "pieces-above-guarantee", loss: bySum("piece", "surplus") - bySum("piece", "guarantee") },
        { step: "between-parts-counted-as-half", loss: bySum("between", "surplus") },
      ]),
    );
    decomposition = { ...dc, partition: Array.from(dc.partition) };
    if (!dc.reached) notes.push("the decomposition's rounding did not reach every stage guarantee within its trials");
  }

  const env = recordEnvelope(BOUNDS_ACCOUNT_KIND, BOUNDS_ACCOUNT_VERSION, graph, options.source ?? br.source);
  return {
    kind: env.kind,
    version: BOUNDS_ACCOUNT_VERSION,
    graphHash: env.graphHash,
    n: graph.n,
    m: graph.m,
    totalWeight: graph.totalWeight,
    bracket: {
      lower: br.lower,
      upper: br.upper,
      surplusLower: br.surplusLower,
      surplusUpper: br.surplusUpper,
      exact: br.exact,
      upperKind: br.upperKind,
      lowerMethod: br.lowerMethod,
      upperMethod: br.upperMethod,
      effort: br.effort,
      seconds: br.seconds,
      solverSeed: br.solverSeed,
    },
    evaluators: rows,
    vector,
    decomposition,
    notes,
    // The embedded graph goes last, so the numbers come first in a JSON line.
    source: env.source,
  };
}
