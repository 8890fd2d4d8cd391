// Deterministic families (elementary, algebraic and extremal, named graphs), in the order
// `halfplus families` lists them. One file per family.
import { cayleyGf2Family, hypercubeFamily } from "./cayley-gf2.js";
import { andrasfaiFamily, circulantFamily, cycleFamily } from "./circulant.js";
import { completeFamily } from "./complete.js";
import { completeBipartiteFamily, completeMultipartiteFamily } from "./complete-multipartite.js";
import { generalizedPetersenFamily } from "./generalized-petersen.js";
import { kneserFamily } from "./kneser.js";
import { mycielskiChainFamily } from "./mycielski.js";
import { chvatalFamily } from "./named/chvatal.js";
import { clebschFamily } from "./named/clebsch.js";
import { grotzschFamily } from "./named/grotzsch.js";
import { heawoodFamily } from "./named/heawood.js";
import { higmanSimsFamily } from "./named/higman-sims.js";
import { hoffmanSingletonFamily } from "./named/hoffman-singleton.js";
import { dodecahedronFamily, petersenFamily } from "./named/petersen.js";
import { normGraphFamily } from "./norm-graph.js";
import { paleyFamily } from "./paley.js";
import { pathFamily } from "./path.js";
import { polarityFamily } from "./polarity.js";
import { projectivePlaneFamily } from "./projective-plane.js";
import type { FamilyDefinition } from "./types.js";

export const STRUCTURED_FAMILIES: readonly FamilyDefinition[] = [
  // elementary
  completeFamily,
  completeBipartiteFamily,
  completeMultipartiteFamily,
  cycleFamily,
  pathFamily,
  hypercubeFamily,
  circulantFamily,
  cayleyGf2Family,
  generalizedPetersenFamily,
  // algebraic and extremal
  polarityFamily,
  projectivePlaneFamily,
  normGraphFamily,
  kneserFamily,
  paleyFamily,
  andrasfaiFamily,
  mycielskiChainFamily,
  // named graphs
  petersenFamily,
  dodecahedronFamily,
  heawoodFamily,
  clebschFamily,
  hoffmanSingletonFamily,
  higmanSimsFamily,
  grotzschFamily,
  chvatalFamily,
];
