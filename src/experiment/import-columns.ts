// The columns `halfplus import` reads, apart from the importer so that its help can list them
// without loading it.

/** Columns an imported CSV may have; `d` is the degree measure named by `dIs`. */
export const IMPORT_COLUMNS = [
  "key",
  "family",
  "n",
  "m",
  "d",
  "degeneracy",
  "maxDegree",
  "averageDegree",
  "minDegree",
  "totalWeight",
  "surplusLower",
  "surplusUpper",
  "surplus",
  "lower",
  "upper",
  "exact",
  "notes",
] as const;
