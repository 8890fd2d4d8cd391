// What every result record shares: where its graph came from (with the graph embedded when it
// cannot be found again), the envelope (kind, version, hash, source), and reading records back.
export { sourceLabel, type EmbeddedFormat, type EmbeddedGraph, type GraphSource } from "./source.js";
export { EMBED_MAX_CHARS, embedGraph, readEmbeddedGraph } from "./embed.js";
export * from "./envelope.js";
export * from "./json-records.js";
