// Seeded random families: the graph depends on the graph seed (`seed=` in the spec). One file per family.
import { bipartiteGnpFamily } from "./bipartite-gnp.js";
import { gnmFamily } from "./gnm.js";
import { gnpFamily } from "./gnp.js";
import { hfreeProcessFamily } from "./hfree-process.js";
import { randomRegularFamily } from "./random-regular.js";
import type { FamilyDefinition } from "./types.js";

export const RANDOM_FAMILIES: readonly FamilyDefinition[] = [gnpFamily, gnmFamily, bipartiteGnpFamily, randomRegularFamily, hfreeProcessFamily];
