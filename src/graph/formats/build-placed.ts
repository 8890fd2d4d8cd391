// Builds a parsed edge buffer through the one validating builder, with every builder error
// naming the file and line the edge came from (EdgeBuffer tags hold the line numbers).

import { InputError } from "../../errors.js";
import { GraphBuildError, type BuildOptions, type BuildResult, type EdgeBuffer } from "../builder.js";
import { Graph } from "../graph.js";

/**
 * Build `edges` (tagged with 1-based line numbers) on n vertices. `fileBase` is the numbering
 * the file uses: the builder speaks 0-based ids, so for 1-based files its message says so.
 * A weight column that ends up all ones is dropped: `weights === null` means exactly that.
 */
export function buildPlaced(edges: EdgeBuffer, n: number, source: string, fileBase: 0 | 1, build: BuildOptions | undefined): BuildResult {
  const options: BuildOptions = { ...build, describeEdge: (i) => `${source}:${edges.tagOf(i)}` };
  let result: BuildResult;
  try {
    result = edges.build(n, options);
  } catch (e) {
    if (fileBase === 1 && e instanceof GraphBuildError) {
      throw new InputError(`${e.message} (vertex ids counted from 0; the file counts from 1)`);
    }
    // Errors about the graph as a whole (its vertex count) still name the file.
    if (e instanceof InputError && !(e instanceof GraphBuildError)) throw new InputError(`${source}: ${e.message}`);
    throw e;
  }
  return dropUnitWeights(result);
}

/** Same graph without its weight array when every weight is exactly 1 (nothing is lost). */
export function dropUnitWeights(result: BuildResult): BuildResult {
  const w = result.graph.weights;
  if (w === null) return result;
  for (let i = 0; i < w.length; i++) if (w[i] !== 1) return result;
  const g = result.graph;
  // The CSR arrays were validated by the builder; only the redundant weights go.
  return { graph: new Graph(g.n, g.offsets, g.neighbors, null), report: result.report };
}
