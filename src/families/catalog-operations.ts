// Operations on graphs given as nested specs in brackets (`blow-up:of=[petersen],t=3`). Random
// deletion is the one that needs a graph seed. One file per operation.
import { mycielskiOfFamily } from "./mycielski.js";
import { blowUpFamily } from "./operations/blow-up.js";
import { complementFamily } from "./operations/complement.js";
import { deleteRandomEdgesFamily } from "./operations/delete-random-edges.js";
import { disjointUnionFamily } from "./operations/disjoint-union.js";
import { inducedSubgraphFamily } from "./operations/induced-subgraph.js";
import type { FamilyDefinition } from "./types.js";

export const OPERATION_FAMILIES: readonly FamilyDefinition[] = [
  blowUpFamily,
  disjointUnionFamily,
  complementFamily,
  inducedSubgraphFamily,
  mycielskiOfFamily,
  deleteRandomEdgesFamily,
];
