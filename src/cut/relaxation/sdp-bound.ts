// The Goemans–Williamson SDP bound in one call: solve the relaxation by the mixing method, then
// certify its dual vector. The bracket and direct callers share this path.

import type { Graph } from "../../graph/graph.js";
import type { UpperBoundRecord } from "../types.js";
import { certifyDual, type CertifyOptions } from "./certificate.js";
import { solveSdp, type SdpOptions, type SdpRecord } from "./sdp-mixing.js";

export interface SdpBoundOptions {
  sdp?: SdpOptions;
  certify?: CertifyOptions;
}

/** Solve the SDP by the mixing method and certify its dual: the vectors (for rounding) and the bound together. */
export function solveAndCertifySdp(graph: Graph, options: SdpBoundOptions = {}): { sdp: SdpRecord; bound: UpperBoundRecord } {
  const sdp = solveSdp(graph, options.sdp);
  return { sdp, bound: certifySdpDual(graph, sdp, options.certify) };
}

/**
 * The certified bound of a solved SDP (its dual vector y), as the record `sdp-certified`. Separate
 * from the solve so that a caller keeps the SDP's vectors when certifying is refused (the bracket
 * skips a certificate that would not fit in memory and still rounds the vectors).
 */
export function certifySdpDual(graph: Graph, sdp: SdpRecord, certify: CertifyOptions = {}): UpperBoundRecord {
  const rec = certifyDual(graph, sdp.y, { name: "sdp-certified", ...certify });
  const bound: UpperBoundRecord = {
    ...rec,
    status: sdp.status === "converged" ? rec.status : sdp.status,
    seconds: sdp.seconds + rec.seconds,
    relaxationValue: sdp.value,
    details: { ...rec.details, sweeps: sdp.sweeps, rank: sdp.rank, solverSeed: sdp.solverSeed, sdpStatus: sdp.status, sdpSeconds: sdp.seconds, certifySeconds: rec.seconds },
  };
  return bound;
}

/** The certified Goemans–Williamson bound ¼(Σy + n·λ̄) ≥ SDP ≥ max cut; `relaxationValue` is the primal value reached. */
export function sdpUpperBound(graph: Graph, options: SdpBoundOptions = {}): UpperBoundRecord {
  return solveAndCertifySdp(graph, options).bound;
}
