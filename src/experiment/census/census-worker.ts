// Worker-thread side of the census: receives batches of stream lines, posts back their cells.
// It never touches the store: the main thread merges batches in stream order and is the only writer.

import { parentPort } from "node:worker_threads";
import { runCensusBatch, type CensusBatchRequest } from "./batch.js";

if (parentPort === null) throw new Error("census-worker.js runs inside a worker thread");
const port = parentPort;

port.on("message", (msg: CensusBatchRequest) => {
  port.postMessage(runCensusBatch(msg));
});
