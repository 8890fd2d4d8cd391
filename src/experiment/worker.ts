// Worker-thread side of the sweep pool: receives batches of jobs, runs each (build the graph,
// bracket it, measure it) and posts the rows back. It never touches the store: the main thread
// is the only writer.

import { parentPort } from "node:worker_threads";
import { runBatch, type BatchRequest } from "./pool.js";

if (parentPort === null) throw new Error("worker.js runs inside a worker thread");
const port = parentPort;

port.on("message", (msg: BatchRequest) => {
  port.postMessage(runBatch(msg));
});
