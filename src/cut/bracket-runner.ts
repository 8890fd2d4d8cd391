// Runs a bracket in a worker thread so that the caller's thread stays responsive: it can stop the
// run at any moment (SIGINT, SIGTERM) and still hold the best verifiable record so far, which the
// worker sends whenever the bracket improves. Falls back to running in this thread when no worker
// can be started (the TypeScript sources under a test runner) or the graph's copy would not fit.

import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import { InputError } from "../errors.js";
import type { Graph } from "../graph/graph.js";
import { graphToParts } from "../graph/graph.js";
import { graphBytes, memoryRoom } from "../limits/memory.js";
import { bracketSnapshot, type BracketOptions, type BracketSnapshot } from "./bracket.js";
import type { BracketWorkerMessage, BracketWorkerRequest } from "./bracket-worker.js";

export interface RunningBracket {
  /** The final record; or, after `stop()`, the best snapshot (null when none had arrived). */
  readonly done: Promise<{ record: BracketSnapshot | null; stopped: boolean }>;
  /** The latest snapshot (null before the first). */
  latest(): BracketSnapshot | null;
  /** End the run now; `done` then resolves with the latest snapshot. */
  stop(): void;
  /** False when the bracket runs in this thread (then `stop` takes effect only after it returns). */
  readonly inWorker: boolean;
}

const WORKER_URL = new URL("./bracket-worker.js", import.meta.url);

/** Start a bracket; see the module header. `options.onProgress` receives progress without snapshots. */
export function runBracket(graph: Graph, options: BracketOptions = {}): RunningBracket {
  const { onProgress, ...plain } = options;
  const workerFile = fileURLToPath(WORKER_URL);
  // The worker gets a copy of the graph: only when that copy fits beside the original.
  const copyFits = graphBytes(graph.n, graph.m, graph.weighted) < 64 * 2 ** 20 || graphBytes(graph.n, graph.m, graph.weighted) < memoryRoom().bytes;
  if (!existsSync(workerFile) || !copyFits) {
    let last: BracketSnapshot | null = null;
    const record = bracketSnapshot(graph, {
      ...options,
      onProgress: (p) => {
        onProgress?.(p);
        last = p.snapshot();
      },
    });
    return { done: Promise.resolve({ record, stopped: false }), latest: () => last ?? record, stop: () => {}, inWorker: false };
  }
  const worker = new Worker(WORKER_URL);
  let latest: BracketSnapshot | null = null;
  let settle: ((v: { record: BracketSnapshot | null; stopped: boolean }) => void) | null = null;
  let fail: ((e: Error) => void) | null = null;
  const done = new Promise<{ record: BracketSnapshot | null; stopped: boolean }>((resolve, reject) => {
    settle = resolve;
    fail = reject;
  });
  const finish = (): void => {
    settle = null;
    fail = null;
    void worker.terminate();
  };
  worker.on("message", (m: BracketWorkerMessage) => {
    if (m.type === "progress") {
      onProgress?.({
        method: m.method,
        lower: m.lower,
        upper: m.upper,
        elapsed: m.elapsed,
        snapshot: () => {
          if (latest === null) throw new Error("runBracket: no snapshot has arrived yet");
          return latest;
        },
      });
    } else if (m.type === "snapshot") {
      latest = m.record;
    } else if (m.type === "done") {
      settle?.({ record: m.record, stopped: false });
      finish();
    } else {
      fail?.(m.input ? new InputError(m.message) : new Error(`bracket worker: ${m.message}`));
      finish();
    }
  });
  worker.on("error", (e) => {
    fail?.(e);
    finish();
  });
  worker.on("exit", (code) => {
    if (settle !== null) fail?.(new Error(`bracket worker exited with code ${code}`));
  });
  worker.postMessage({ parts: graphToParts(graph), options: plain } satisfies BracketWorkerRequest);
  return {
    done,
    latest: () => latest,
    stop() {
      settle?.({ record: latest, stopped: true });
      finish();
    },
    inWorker: true,
  };
}
