// What every result record shares: where its graph came from (with the graph embedded when it
// cannot be found again), the envelope (kind, version, hash, source), and reading records back.
export * from "./source.js";
export * from "./embed.js";
export * from "./envelope.js";
export * from "./json-records.js";
