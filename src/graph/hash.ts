// A fingerprint of a graph as an input to max cut: records carry it so a record, a structure
// summary and the graph itself can be matched (and joined in a results store) by hash alone.

import { createHash } from "node:crypto";
import { graphFromParts, type Graph, type GraphParts } from "./graph.js";
import { graphSlot } from "./per-graph.js";

// Reused between calls (hash.update copies what it is given): sweeps hash one small graph per job.
const HEAD = Buffer.alloc(24);
const CHUNKS = Buffer.alloc(4096 * 16);

/** Hashes already computed for graphs rebuilt from parts (graphFromPartsWithHash); graphs are immutable. */
const known = graphSlot<string>();

/**
 * The graph of `parts` (graphFromParts, trusted), with `hash` remembered as its graphHash. The
 * caller vouches that `hash` is graphHash of the graph `parts` came from (graphToParts): a sweep
 * hashes each file graph for its row key on the main thread and rebuilds it in a worker, where
 * hashing it again would cost as much as a tiny graph's whole exact search.
 */
export function graphFromPartsWithHash(parts: GraphParts, hash: string): Graph {
  const g = graphFromParts(parts);
  known.set(g, hash);
  return g;
}

/**
 * SHA-256 over n, m and the sorted edge list (u < v, u32 little-endian each, weight as f64
 * little-endian; unweighted edges hash with weight 1), hex-encoded with a "sha256:" prefix.
 * Vertex labels matter: a relabelled graph is a different input to a partition.
 */
export function graphHash(graph: Graph): string {
  const remembered = known.get(graph);
  if (remembered !== undefined) return remembered;
  const h = createHash("sha256");
  const head = HEAD;
  head.write("hpg1", 0, "latin1");
  head.writeUInt32LE(0, 4);
  head.writeDoubleLE(graph.n, 8);
  head.writeDoubleLE(graph.m, 16);
  h.update(head);
  const CHUNK = Math.max(1, Math.min(4096, graph.m));
  const buf = CHUNKS.subarray(0, CHUNK * 16);
  let k = 0;
  const { offsets, neighbors, weights } = graph;
  for (let u = 0; u < graph.n; u++) {
    for (let i = offsets[u]; i < offsets[u + 1]; i++) {
      const v = neighbors[i];
      if (v <= u) continue;
      const o = k * 16;
      buf.writeUInt32LE(u, o);
      buf.writeUInt32LE(v, o + 4);
      buf.writeDoubleLE(weights === null ? 1 : weights[i], o + 8);
      if (++k === CHUNK) {
        h.update(buf);
        k = 0;
      }
    }
  }
  if (k > 0) h.update(buf.subarray(0, k * 16));
  return `sha256:${h.digest("hex")}`;
}
