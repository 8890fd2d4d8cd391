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
  const t0 = performance.now();
  const sdp = solveSdp(graph, options.sdp);
  const rec = certifyDual(graph, sdp.y, { name: "sdp-certified", ...options.certify });
  const bound: UpperBoundRecord = {
    ...rec,
    status: sdp.status === "converged" ? rec.status : sdp.status,
    seconds: (performance.now() - t0) / 1000,
    relaxationValue: sdp.value,
    details: { ...rec.details, sweeps: sdp.sweeps, rank: sdp.rank, solverSeed: sdp.solverSeed, sdpStatus: sdp.status, sdpSeconds: sdp.seconds, certifySeconds: rec.seconds },
  };
  return { sdp, bound };
}

/** The certified Goemans–Williamson bound ¼(Σy + n·λ̄) ≥ SDP ≥ max cut; `relaxationValue` is the primal value reached. */
export function sdpUpperBound(graph: Graph, options: SdpBoundOptions = {}): UpperBoundRecord {
  return solveAndCertifySdp(graph, options).bound;
}
