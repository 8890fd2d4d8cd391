// Deterministic families (algebraic, structured, named, operations). One file per family.
import { cayleyGf2, hypercube } from "./cayley-gf2.js";
import { andrasfai, cayleyZn, circulant, cycle } from "./circulant.js";
import { complete } from "./complete.js";
import { completeBipartite, completeMultipartite } from "./complete-multipartite.js";
import { generalizedPetersen } from "./generalized-petersen.js";
import { kneser } from "./kneser.js";
import { mycielski } from "./mycielski.js";
import { chvatal } from "./named/chvatal.js";
import { clebsch } from "./named/clebsch.js";
import { grotzsch } from "./named/grotzsch.js";
import { heawood } from "./named/heawood.js";
import { higmanSims } from "./named/higman-sims.js";
import { hoffmanSingleton } from "./named/hoffman-singleton.js";
import { dodecahedron, petersen } from "./named/petersen.js";
import { normGraphFamily } from "./norm-graph.js";
import { paley } from "./paley.js";
import { path } from "./path.js";
import { polarity } from "./polarity.js";
import { projectivePlane } from "./projective-plane.js";
import type { FamilyDefinition } from "./types.js";

export const STRUCTURED_FAMILIES: FamilyDefinition[] = [
  // elementary
  complete,
  completeBipartite,
  completeMultipartite,
  cycle,
  path,
  hypercube,
  circulant,
  cayleyZn,
  cayleyGf2,
  generalizedPetersen,
  // algebraic and extremal
  polarity,
  projectivePlane,
  normGraphFamily,
  kneser,
  paley,
  andrasfai,
  mycielski,
  // named graphs
  petersen,
  dodecahedron,
  heawood,
  clebsch,
  hoffmanSingleton,
  higmanSims,
  grotzsch,
  chvatal,
];
