// Where a graph came from, precisely enough to rebuild it: the description every result record
// carries. A plain type at the bottom of the layers, so solvers can copy it without knowing how a
// source is opened (that is src/sources/).

import type { GraphFormat } from "./formats/types.js";

/** Where a graph came from, precisely enough to rebuild it (stored in result records). */
export interface SourceRef {
  /** Canonical family spec (seed written out), when the graph is a family member. */
  spec?: string;
  /** File path ("-" for standard input) and 0-based position in the file's stream. */
  path?: string;
  index?: number;
  format?: GraphFormat;
}
