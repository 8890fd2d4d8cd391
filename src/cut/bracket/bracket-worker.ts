// Worker-thread entry of `BracketRunner` (src/cut/bracket/bracket-runner.ts): runs each bracket it is sent and posts its
// progress, a snapshot of the record whenever the bracket improves, and the final record. The main
// thread stays free to answer signals while this thread computes.

import { parentPort } from "node:worker_threads";
import { InputError } from "../../errors.js";
import { graphFromParts, type GraphParts } from "../../graph/graph.js";
import { bracketSnapshot, type BracketOptions } from "./bracket.js";
import type { BracketSnapshot } from "./record.js";

export type BracketWorkerRequest = { parts: GraphParts; options: Omit<BracketOptions, "onProgress"> };

export type BracketWorkerMessage =
  | { type: "progress"; method: string; lower: number; upper: number; elapsed: number }
  | { type: "snapshot"; record: BracketSnapshot }
  | { type: "done"; record: BracketSnapshot }
  | { type: "error"; input: boolean; message: string };

const port = parentPort;
if (port !== null) {
  // One request at a time, as many as the runner sends (one worker serves a stream of graphs).
  port.on("message", (req: BracketWorkerRequest) => {
    try {
      const graph = graphFromParts(req.parts);
      let lastKey = "";
      const record = bracketSnapshot(graph, {
        ...req.options,
        onProgress: (p) => {
          port.postMessage({ type: "progress", method: p.method, lower: p.lower, upper: p.upper, elapsed: p.elapsed } satisfies BracketWorkerMessage);
          // A snapshot costs O(n) to copy (a typed array, never a JS array): send one only when the bracket changed.
          const snap = p.snapshot();
          const key = `${snap.lower}|${snap.upper}|${snap.certificate.kind}|${snap.exact}|${snap.runs.length}`;
          if (key !== lastKey) {
            lastKey = key;
            port.postMessage({ type: "snapshot", record: snap } satisfies BracketWorkerMessage);
          }
        },
      });
      port.postMessage({ type: "done", record } satisfies BracketWorkerMessage);
    } catch (e) {
      port.postMessage({ type: "error", input: e instanceof InputError, message: e instanceof Error ? (e.stack ?? e.message) : String(e) } satisfies BracketWorkerMessage);
    }
  });
}
