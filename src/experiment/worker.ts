// Worker-thread side of the sweep pool: receives batches of jobs, runs each (build the graph,
// bracket it, measure it) and posts the rows back. It never touches the store: the main thread
// is the only writer.

import { parentPort } from "node:worker_threads";
import type { JobContext } from "./job.js";
import { runJobsMessage, transferables, type JobsMessage } from "./wire.js";

if (parentPort === null) throw new Error("worker.js runs inside a worker thread");
const port = parentPort;
/** The sweep's context, sent with the first batch (and again only when it changes). */
let context: JobContext | null = null;

port.on("message", (msg: JobsMessage) => {
  if (msg.context !== null) context = msg.context;
  if (context === null) throw new Error("a sweep worker got a batch before its context");
  const rows = runJobsMessage(msg, context);
  port.postMessage(rows, transferables(rows));
});
