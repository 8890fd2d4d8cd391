// Runs brackets in a worker thread so that the caller's thread stays responsive: it can stop a run
// at any moment (SIGINT, SIGTERM) and still hold the best verifiable record so far, which the
// worker sends whenever the bracket improves. One worker serves a whole stream of graphs (starting
// a worker costs far more than bracketing a small graph). The worker starts from one file, the
// build's bundle of bracket-worker.js and everything it imports (scripts/bundle-worker.mjs), which
// it loads in a third of the CPU of the module graph. Falls back to running in this thread when no
// worker can be started (the TypeScript sources under a test runner) or the graph's copy would not
// fit; only then does this thread import the solvers (bracket.js), so `halfplus cut` does not load
// them twice.

import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import { InputError } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { graphToParts } from "../../graph/graph.js";
import { graphBytes, memoryRoom } from "../../limits/memory.js";
import type { BracketOptions } from "./bracket.js";
import type { BracketSnapshot } from "./record.js";
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

const WORKER_URL = new URL("./bracket-worker-bundle.js", import.meta.url);

/**
 * Brackets one graph after another in one worker thread (started on the first run that needs it).
 * Runs must not overlap: start the next once the previous `done` has settled. `close()` ends the
 * worker; a stopped run ends it too (the next run starts a fresh one).
 */
export class BracketRunner {
  private worker: Worker | null = null;

  /** Start a bracket; see the module header. `options.onProgress` receives progress; its snapshots are those the worker sent. */
  run(graph: Graph, options: BracketOptions = {}): RunningBracket {
    const { onProgress, ...plain } = options;
    // The worker gets a copy of the graph: only when that copy fits beside the original.
    const bytes = graphBytes(graph.n, graph.m, graph.weighted);
    const copyFits = bytes < 64 * 2 ** 20 || bytes < memoryRoom().bytes;
    if (!existsSync(fileURLToPath(WORKER_URL)) || !copyFits) return inThisThread(graph, options);
    const worker = (this.worker ??= new Worker(WORKER_URL));
    let latest: BracketSnapshot | null = null;
    let settle: ((v: { record: BracketSnapshot | null; stopped: boolean }) => void) | null = null;
    let fail: ((e: Error) => void) | null = null;
    const done = new Promise<{ record: BracketSnapshot | null; stopped: boolean }>((resolve, reject) => {
      settle = resolve;
      fail = reject;
    });
    const detach = (): void => {
      settle = null;
      fail = null;
      worker.off("message", onMessage);
      worker.off("error", onError);
      worker.off("exit", onExit);
    };
    const onMessage = (m: BracketWorkerMessage): void => {
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
        const s = settle;
        detach();
        s?.({ record: m.record, stopped: false });
      } else {
        const f = fail;
        detach();
        f?.(m.input ? new InputError(m.message) : new Error(`bracket worker: ${m.message}`));
      }
    };
    const onError = (e: Error): void => {
      const f = fail;
      detach();
      this.drop(worker);
      f?.(e);
    };
    const onExit = (code: number): void => {
      const f = fail;
      detach();
      this.drop(worker);
      f?.(new Error(`bracket worker exited with code ${code}`));
    };
    worker.on("message", onMessage);
    worker.on("error", onError);
    worker.on("exit", onExit);
    worker.postMessage({ parts: graphToParts(graph), options: plain } satisfies BracketWorkerRequest);
    return {
      done,
      latest: () => latest,
      stop: () => {
        const s = settle;
        detach();
        // The worker is busy with this graph: end it (a later run starts a new one).
        this.drop(worker);
        s?.({ record: latest, stopped: true });
      },
      inWorker: true,
    };
  }

  /** End the worker (if any). */
  close(): void {
    if (this.worker !== null) this.drop(this.worker);
  }

  private drop(worker: Worker): void {
    if (this.worker === worker) this.worker = null;
    void worker.terminate();
  }
}

/** One bracket in its own worker (a BracketRunner for a single graph). */
export function runBracket(graph: Graph, options: BracketOptions = {}): RunningBracket {
  const runner = new BracketRunner();
  const running = runner.run(graph, options);
  void running.done.then(
    () => runner.close(),
    () => runner.close(),
  );
  return running;
}

function inThisThread(graph: Graph, options: BracketOptions): RunningBracket {
  let last: BracketSnapshot | null = null;
  const done = import("./bracket.js").then(({ bracketSnapshot }) => {
    const record = bracketSnapshot(graph, {
      ...options,
      onProgress: (p) => {
        options.onProgress?.(p);
        last = p.snapshot();
      },
    });
    last = record;
    return { record, stopped: false };
  });
  return { done, latest: () => last, stop: () => {}, inWorker: false };
}
