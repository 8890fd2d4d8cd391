// Seeded random families. One file per family.
import type { FamilyDefinition } from "./types.js";

export const RANDOM_FAMILIES: FamilyDefinition[] = [];
