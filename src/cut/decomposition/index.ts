// Constructive cuts that follow a proof: the decomposition cut for H-free graphs (pieces set aside
// while too many triangles remain, the remainder rounded, pieces cut exactly or recursively, joined
// by a derandomised orientation).
export {
  decompositionCut,
  decompositionBounds,
  decompositionBoundsOf,
  setDecompositionMemo,
  patternMinusVertex,
  DEFAULT_TRIANGLE_FACTOR,
  DEFAULT_EXACT_VERTICES,
  type DecompositionOptions,
  type DecompositionCutRecord,
  type DecompositionPiece,
  type DecompositionStage,
  type DecompositionMethod,
} from "./decomposition-cut.js";
