// Deterministic families (algebraic, structured, named, operations). One file per family.
import { complete } from "./complete.js";
import type { FamilyDefinition } from "./types.js";

export const STRUCTURED_FAMILIES: FamilyDefinition[] = [complete];
