// Seeded random families and the graph operations on nested specs. One file per family.
import { bipartiteGnpFamily } from "./bipartite-gnp.js";
import { gnmFamily } from "./gnm.js";
import { gnpFamily } from "./gnp.js";
import { hfreeProcessFamily } from "./hfree-process.js";
import { blowupFamily } from "./operations/blow-up.js";
import { complementFamily } from "./operations/complement.js";
import { deleteEdgesFamily } from "./operations/delete-edges.js";
import { unionFamily } from "./operations/disjoint-union.js";
import { inducedFamily } from "./operations/induced-subgraph.js";
import { randomRegularFamily } from "./random-regular.js";
import type { FamilyDefinition } from "./types.js";

export const RANDOM_FAMILIES: FamilyDefinition[] = [
  gnpFamily,
  gnmFamily,
  bipartiteGnpFamily,
  randomRegularFamily,
  hfreeProcessFamily,
  blowupFamily,
  unionFamily,
  complementFamily,
  inducedFamily,
  deleteEdgesFamily,
];
