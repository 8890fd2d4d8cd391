// The hunt's two prices for a graph: a cheap screen (a few warm-started mixing-method sweeps; the
// primal SDP value is below the SDP optimum, so it never overstates what a certificate could prove)
// and the certified bracket (the SDP solved further from the same vectors, its dual certified by
// the relaxation's own certificate code, a rounded cut, and the bracket record `verify` re-checks).

import { bracketFromResults } from "../cut/bracket/bracket.js";
import type { BracketRecord } from "../cut/bracket/record.js";
import { hyperplaneRound } from "../cut/heuristic/hyperplane-rounding.js";
import { certifySdpDual } from "../cut/relaxation/sdp-bound.js";
import { solveSdp, type SdpRecord } from "../cut/relaxation/sdp-mixing.js";
import { floorCutBound, surplusOf } from "../graph/cut-value.js";
import type { Graph } from "../graph/graph.js";
import { degeneracy } from "../graph/structure/degeneracy.js";
import { objectiveValue, type HuntObjective } from "./objective.js";

export interface Screen {
  graph: Graph;
  degeneracy: number;
  sdp: SdpRecord;
  /** The objective at the primal SDP value: what the annealing compares. */
  value: number;
  /**
   * The objective at ⌊primal⌋: no certificate can prove less than ⌊SDP optimum⌋ ≥ ⌊primal⌋, so a
   * graph whose `floorValue` does not beat the frontier is not worth certifying.
   */
  floorValue: number;
}

export interface HuntScreenOptions {
  /** Mixing-method sweeps per screen (default 60). */
  sweeps: number;
  solverSeed: number;
}

/** Screen a graph, warm-starting the SDP from `initial` (the vectors of the graph one move away) when given. */
export function screenGraph(graph: Graph, objective: HuntObjective, initial: Float64Array | null, options: HuntScreenOptions): Screen {
  const d = degeneracy(graph).degeneracy;
  const sdp = solveSdp(graph, {
    solverSeed: options.solverSeed,
    maxSweeps: options.sweeps,
    // The Lanczos gap check would cost more than the sweeps at this size.
    gapTolerance: 0,
    tolerance: 1e-9,
    ...(initial === null ? {} : { initial }),
  });
  return {
    graph,
    degeneracy: d,
    sdp,
    value: objectiveValue(objective, surplusOf(graph, sdp.value), graph.m, d),
    floorValue: objectiveValue(objective, surplusOf(graph, floorCutBound(sdp.value)), graph.m, d),
  };
}

export interface Certified {
  record: BracketRecord;
  /** The objective at the record's surplus upper end: the certified value. */
  value: number;
  degeneracy: number;
}

/** Sweeps for the solve before certifying (warm-started, stopping on the relaxation's own gap test). */
export const CERTIFY_SWEEPS = 4000;

/** The certified bracket of a screened graph, and the objective at its proven surplus upper end. */
export function certifyScreen(s: Screen, objective: HuntObjective, solverSeed: number, notes: readonly string[] = []): Certified {
  const { graph } = s;
  const sdp = solveSdp(graph, { solverSeed, maxSweeps: CERTIFY_SWEEPS, gapTolerance: 1e-8, tolerance: 1e-14, initial: s.sdp.vectors });
  const bound = certifySdpDual(graph, sdp, { solverSeed: 1 });
  const cut = hyperplaneRound(graph, sdp.vectors, sdp.rank, { trials: 32, solverSeed, polish: true });
  const record = bracketFromResults(graph, { cuts: [cut], bounds: [bound], solverSeed, notes });
  return { record, value: objectiveValue(objective, record.surplusUpper, graph.m, s.degeneracy), degeneracy: s.degeneracy };
}
