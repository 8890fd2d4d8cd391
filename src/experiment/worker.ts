// Worker-thread side of the sweep pool: receives batches of jobs, runs each (build the graph,
// bracket it, measure it) and posts the rows back. It never touches the store: the main thread
// is the only writer.

import { parentPort } from "node:worker_threads";
import { isInputError } from "../errors.js";
import { runJob, type JobInput } from "./job.js";
import type { BatchRequest, BatchResult, JobResult } from "./pool.js";

if (parentPort === null) throw new Error("worker.js runs inside a worker thread");
const port = parentPort;

port.on("message", (msg: BatchRequest) => {
  const results: JobResult[] = [];
  const t0 = performance.now();
  for (const job of msg.jobs as JobInput[]) {
    try {
      const out = runJob(job);
      results.push({ key: job.key, row: out.row, solverSeconds: out.solverSeconds });
    } catch (e) {
      results.push({ key: job.key, error: e instanceof Error ? e.message : String(e), inputError: isInputError(e), stack: e instanceof Error ? e.stack : undefined });
      break; // the sweep stops at the first failure; the rest of the batch is not run
    }
  }
  const reply: BatchResult = { batch: msg.batch, results, seconds: (performance.now() - t0) / 1000 };
  port.postMessage(reply);
});
