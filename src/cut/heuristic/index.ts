// Heuristic search for good cuts: anytime searchers (multi-start local search, breakout, rank-2)
// and rounding of vectors (hyperplane rounding of SDP vectors, sparse vector rounding); the memetic
// search for large sparse graphs and its partition crossover.
export { type HeuristicBudget, type AnytimeOptions, type AnytimeSearch } from "./anytime.js";
export { localSearch, MultiStartSearcher } from "./local-search.js";
export { breakoutSearch, BreakoutSearcher, type BreakoutOptions, type BreakoutSearchOptions } from "./breakout.js";
export { rank2Search, Rank2Searcher, type Rank2Options, type Rank2SearchOptions } from "./rank2.js";
export { hyperplaneRound, hyperplaneExpectedCut, separationProbability, type RoundingOptions } from "./hyperplane-rounding.js";
export { vectorMethodRound, vectorMethodExpectedCut, vectorMethodCosine, type VectorRoundingOptions } from "./vector-rounding.js";
export { memeticSearch, MEMETIC_MIN_VERTICES, type MemeticOptions, type MemeticProgress, type MemeticCutRecord } from "./memetic.js";
export { PartitionCrossover } from "./partition-crossover.js";
