// The census: exact max cut of every graph of a graph6/sparse6 stream, aggregated per (n, m) in
// the results store, in parallel and resumable.
export { runCensus, DEFAULT_CENSUS, DEFAULT_WITNESS_LIMIT, DEFAULT_BATCH_GRAPHS, type CensusOptions, type CensusProgress, type CensusSummary, type CensusLowest } from "./run.js";
export { censusCellRecord, censusRecords, censusSurplusRows, censusesToShow, CENSUS_CELL_KIND, CENSUS_CELL_VERSION, type CensusCellRecord } from "./records.js";
export { type CensusCell, mergeCell, emptyCell } from "./cells.js";
export { type CensusState, type CensusTables } from "./census-store.js";
export { censusOfLines } from "./batch.js";
export { censusProgressDisplay, censusProgressLine, censusProgressSentence, type CensusProgressDisplay } from "./progress.js";
