// The shortcuts the sweep's speed work added give the same values as the plain paths they stand
// in for: induced subgraphs written as CSR directly (against buildGraph on the edge list), the
// exact search's popcount table for unweighted blocks (against the cut of every pattern counted
// edge by edge), the decomposition cut's memo of tiny stage graphs (memo on against memo off, on
// every labelled graph of up to 5 vertices and a sample of 6–8 and larger ones), the vector
// choice shared per graph (against a fresh optimisation), the shared triangle count, and the
// store's background log checkpoints (every committed row still there), the vector rounding's
// trial loop (against the same trials counted by cutValue), the decomposition's lighter rounding
// call (against vectorMethodRound's record), a file graph's hash handed to the worker (against
// hashing the rebuilt graph), sweep rows bound without conversion (read back equal), the
// messages packed per batch between the sweep's threads (against runJob's rows), and the
// searches that reuse scratch arrays between calls (the same answers whatever ran before, and
// the brute-force triangle count and max cut). The
// reference values are definitions (common practice, no source): a subgraph's edges, a cut's
// crossing weight, and the same function run twice.
import { existsSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { COLUMNS } from "../src/experiment/columns.js";
import { openStore } from "../src/experiment/sqlite-store.js";
import { decompositionCut, setDecompositionMemo } from "../src/cut/decomposition/decomposition-cut.js";
import { CutBlock } from "../src/cut/exact/cut-block.js";
import { optimiseVectorChoice, sharedVectorChoice, vectorChoiceOptions, vectorOptimisedBound } from "../src/bounds/vector-choice.js";
import { buildGraph, graphFromEdges } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import { componentSubgraph, inducedSubgraph } from "../src/graph/induced.js";
import { countTriangles, sharedTriangleCount } from "../src/graph/structure/triangles.js";
import { describeGraph } from "../src/graph/structure/describe.js";
import { degeneracy, sharedDegeneracy } from "../src/graph/structure/degeneracy.js";
import { findClique } from "../src/graph/structure/cliques.js";
import { Rng } from "../src/random/prng.js";
import { resolveVectorSets } from "../src/bounds/vector-sets.js";
import { randomGraph } from "./helpers/graphs.js";
import { vectorMethodExpectedCut, vectorMethodRound, vectorMethodRoundCut } from "../src/cut/heuristic/vector-rounding.js";
import { FlipState } from "../src/cut/heuristic/flip-state.js";
import { cutValue, surplusOf } from "../src/graph/cut-value.js";
import { graphFromParts, graphToParts } from "../src/graph/graph.js";
import { graphFromPartsWithHash, graphHash } from "../src/graph/hash.js";
import { EVALUATOR_NAMES, runJob, type JobInput } from "../src/experiment/job.js";
import { decodeRows, encodeJobs, runJobsMessage } from "../src/experiment/wire.js";
import { girth } from "../src/graph/structure/girth.js";
import { countFourCycles } from "../src/graph/structure/four-cycles.js";
import { findCycle } from "../src/graph/structure/cycles.js";
import { grayCodeMaxCut } from "../src/cut/exact/gray-code.js";
import { branchAndBoundMaxCut } from "../src/cut/exact/branch-and-bound.js";

/** The k-th labelled graph on n vertices: bit i of k says whether the i-th pair (u < v, v outer) is an edge. */
function labelled(n: number, k: number): Graph {
  const e: [number, number][] = [];
  let i = 0;
  for (let v = 1; v < n; v++) for (let u = 0; u < v; u++) if (Math.floor(k / 2 ** i++) % 2 === 1) e.push([u, v]);
  return graphFromEdges(n, e);
}

/** The induced subgraph by definition: keep the edges with both ends listed, relabel by list position, build. */
function inducedByDefinition(g: Graph, vertices: number[]): Graph {
  const at = new Map(vertices.map((v, i) => [v, i]));
  const us: number[] = [], vs: number[] = [], ws: number[] = [];
  g.forEachEdge((u, v, w) => {
    if (at.has(u) && at.has(v)) {
      us.push(at.get(u)!);
      vs.push(at.get(v)!);
      ws.push(w);
    }
  });
  return buildGraph(vertices.length, us, vs, g.weighted ? ws : null).graph;
}

function sameGraph(a: Graph, b: Graph): void {
  expect(a.n).toBe(b.n);
  expect(Array.from(a.offsets)).toEqual(Array.from(b.offsets));
  expect(Array.from(a.neighbors)).toEqual(Array.from(b.neighbors));
  expect(a.weights === null ? null : Array.from(a.weights)).toEqual(b.weights === null ? null : Array.from(b.weights));
  expect(a.totalWeight).toBe(b.totalWeight);
}

describe("induced subgraphs written as CSR", () => {
  it("equal buildGraph on the edge list, for sorted and shuffled vertex lists, weighted and not", () => {
    const rng = new Rng(7);
    for (let t = 0; t < 200; t++) {
      const n = 1 + rng.nextInt(30);
      const weighted = t % 3 === 0;
      const g = randomGraph(n, rng.nextFloat(), rng, weighted ? { weight: (r) => Math.round(100 * (r.nextFloat() - 0.3)) / 8 } : {});
      const all = Array.from({ length: n }, (_, i) => i);
      const k = rng.nextInt(n + 1);
      for (let i = n - 1; i > 0; i--) {
        const j = rng.nextInt(i + 1);
        [all[i], all[j]] = [all[j], all[i]];
      }
      const shuffled = all.slice(0, k);
      const sorted = shuffled.slice().sort((a, b) => a - b);
      sameGraph(inducedSubgraph(g, shuffled), inducedByDefinition(g, shuffled));
      sameGraph(inducedSubgraph(g, sorted), inducedByDefinition(g, sorted));
    }
  });

  it("componentSubgraph reads only the members' positions", () => {
    // Two components; the shared position array holds stale values for the other one.
    const g = graphFromEdges(7, [[0, 2], [2, 4], [4, 0], [1, 3], [3, 5], [5, 6]]);
    const position = [0, 9, 1, 9, 2, 9, 9];
    sameGraph(componentSubgraph(g, [0, 2, 4], position), inducedByDefinition(g, [0, 2, 4]));
  });
});

describe("exact search blocks", () => {
  /** Cut of pattern c by definition: the weight of the block pairs on different sides. */
  function cutOf(size: number, w: (i: number, j: number) => number, c: number): number {
    let s = 0;
    for (let i = 0; i < size; i++) for (let j = i + 1; j < size; j++) if (((c >>> i) & 1) !== ((c >>> j) & 1)) s += w(i, j);
    return s;
  }

  it("tabulate every pattern's cut, unweighted (popcount path) and with integer weights (general path)", () => {
    const rng = new Rng(11);
    for (let t = 0; t < 60; t++) {
      const size = rng.nextInt(13);
      const unit = t % 2 === 0;
      const w = new Float64Array(size * size);
      for (let i = 0; i < size; i++) {
        for (let j = i + 1; j < size; j++) {
          const x = rng.nextFloat() < 0.5 ? 0 : unit ? 1 : 1 + rng.nextInt(5);
          w[i * size + j] = w[j * size + i] = x;
        }
      }
      const weight = (i: number, j: number) => w[i * size + j];
      const block = new CutBlock(size, weight);
      let best = 0;
      for (let c = 0; c < 1 << size; c++) {
        expect(block.table[c]).toBe(cutOf(size, weight, c));
        best = Math.max(best, block.table[c]);
      }
      expect(block.tableMax).toBe(best);
    }
  });
});

describe("decomposition cut memo of tiny stage graphs", () => {
  afterEach(() => setDecompositionMemo(true));

  const graphs: Graph[] = [];
  for (let n = 1; n <= 5; n++) for (let k = 0; k < 2 ** ((n * (n - 1)) / 2); k++) graphs.push(labelled(n, k));
  const rng = new Rng(3);
  for (const n of [6, 7, 8]) for (let t = 0; t < 150; t++) graphs.push(labelled(n, rng.nextInt(2 ** ((n * (n - 1)) / 2))));
  for (let t = 0; t < 20; t++) graphs.push(randomGraph(9 + rng.nextInt(12), 0.2 + 0.6 * rng.nextFloat(), rng));

  it("gives the same records as the plain path (twice over, so the second pass reads the memo)", () => {
    const strip = (g: Graph, seed: number) => {
      const { seconds: _s, ...rest } = decompositionCut(g, { solverSeed: seed });
      return rest;
    };
    setDecompositionMemo(false);
    const plain = graphs.map((g, i) => strip(g, i % 3));
    setDecompositionMemo(true);
    for (let pass = 0; pass < 2; pass++) graphs.forEach((g, i) => expect(strip(g, i % 3)).toEqual(plain[i]));
  });
});

/** Is there a K_r? Every r-subset tried (small graphs only). */
function hasClique(g: Graph, r: number): boolean {
  const pick: number[] = [];
  const grow = (from: number): boolean => {
    if (pick.length === r) return true;
    for (let v = from; v < g.n; v++) {
      if (pick.every((u) => g.hasEdge(u, v))) {
        pick.push(v);
        if (grow(v + 1)) return true;
        pick.pop();
      }
    }
    return false;
  };
  return grow(0);
}

describe("results shared per graph object", () => {
  it("the shared vector choice and triangle count equal fresh ones", () => {
    const rng = new Rng(5);
    for (let t = 0; t < 40; t++) {
      const g = randomGraph(2 + rng.nextInt(16), rng.nextFloat(), rng);
      const fresh = optimiseVectorChoice(g);
      expect(sharedVectorChoice(g)).toEqual(fresh);
      expect(vectorOptimisedBound(g).surplus).toBe(fresh.guarantee.surplus);
      expect(sharedTriangleCount(g)).toEqual(countTriangles(g));
      expect(sharedDegeneracy(g)).toEqual(degeneracy(g));
      // Clique searches on the shared ordering: the same answers as the clique number by definition would give.
      for (let r = 3; r <= 5; r++) expect(findClique(g, r).found).toBe(hasClique(g, r));
      // describeGraph hands out its own copy of the shared witness.
      const s = describeGraph(g);
      if (s.witnesses.K3 !== null) {
        s.witnesses.K3.reverse();
        expect(sharedTriangleCount(g).witness).toEqual(countTriangles(g).witness);
      }
    }
  });
});

describe("vector sets given in ascending order", () => {
  it("resolve to the same sets as shuffled lists, and bad lists fail with the same message either way", () => {
    const rng = new Rng(9);
    for (let t = 0; t < 40; t++) {
      const g = randomGraph(3 + rng.nextInt(20), 0.2 + 0.6 * rng.nextFloat(), rng);
      const sorted = Array.from({ length: g.n }, (_, i) => Array.from(g.neighborsOf(i)).filter(() => rng.nextFloat() < 0.7));
      const shuffled = sorted.map((s) => rng.shuffle(s.slice()));
      const a = resolveVectorSets(g, { sets: sorted });
      const b = resolveVectorSets(g, { sets: shuffled });
      expect(Array.from(a.offsets)).toEqual(Array.from(b.offsets));
      expect(Array.from(a.members)).toEqual(Array.from(b.members));
      expect(Array.from(a.eps)).toEqual(Array.from(b.eps));
    }
    // Vertex 0 of a path 0–1–2: 2 is not a neighbour; [1, 1] repeats.
    const path = graphFromEdges(3, [[0, 1], [1, 2]]);
    expect(() => resolveVectorSets(path, { sets: [[1, 2], [], []] })).toThrow("vector method: invalid `sets[0]`: should contain only neighbours of vertex 0; 2 is not one (got [1,2])");
    expect(() => resolveVectorSets(path, { sets: [[1, 1], [], []] })).toThrow(/should not repeat vertex 1/);
  });
});

describe("log checkpoints on a background thread", () => {
  it("every row committed meanwhile is in the file after stop and close, and the log is copied in", async () => {
    const dir = mkdtempSync(join(tmpdir(), "halfplus-checkpoint-"));
    try {
      const path = join(dir, "s.db");
      const store = openStore(path);
      const stop = store.backgroundMaintenance!();
      const blank = (k: number) => COLUMNS.map((c) => (c.name === "key" ? `k${k}` : c.name === "runs" ? "x".repeat(900) : null));
      let k = 0;
      for (let batch = 0; batch < 40; batch++) {
        store.insertValues(Array.from({ length: 50 }, () => blank(k++)));
        await new Promise((r) => setTimeout(r, 5));
      }
      await stop();
      await stop(); // a second call waits for the same stop
      store.close();
      // The last connection's close folds the log into the file and removes it (SQLite's WAL rules).
      expect(existsSync(`${path}-wal`)).toBe(false);
      const again = openStore(path, { readonly: true });
      expect(again.count()).toBe(2000);
      again.close();
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it("a checkpointer that cannot open the file leaves the writer working", async () => {
    const dir = mkdtempSync(join(tmpdir(), "halfplus-checkpoint-"));
    try {
      const store = openStore(join(dir, "s.db"));
      // Point the checkpointer at a folder: its open fails and the thread ends.
      Object.defineProperty(store, "path", { value: dir });
      const stop = store.backgroundMaintenance!();
      await new Promise((r) => setTimeout(r, 200));
      expect(store.insertValues([COLUMNS.map((c) => (c.name === "key" ? "only" : null))])).toBe(1);
      await stop();
      expect(store.count()).toBe(1);
      store.close();
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

/** vectorMethodRound's trials written the plain way: the same Gaussian draws, every cut counted by cutValue. */
function plainRounding(g: Graph, trials: number, seed: number, polish: boolean): { mean: number; bestRaw: number; best: number; side: number[] } {
  const sets = resolveVectorSets(g);
  const rng = new Rng(seed);
  const x = new Float64Array(g.n);
  const side = new Uint8Array(g.n);
  const state = polish ? new FlipState(g) : null;
  let mean = 0;
  let bestRaw = -Infinity;
  let best = -Infinity;
  let bestSide: number[] = [];
  for (let t = 0; t < trials; t++) {
    for (let v = 0; v < g.n; v++) x[v] = rng.nextNormal();
    for (let v = 0; v < g.n; v++) {
      let s = 0;
      for (let a = sets.offsets[v]; a < sets.offsets[v + 1]; a++) s += x[sets.members[a]];
      side[v] = x[v] - sets.eps[v] * s > 0 ? 1 : 0;
    }
    const raw = cutValue(g, side);
    mean += (surplusOf(g, raw) - mean) / (t + 1);
    if (raw > bestRaw) bestRaw = raw;
    const value = state === null ? raw : state.polishInPlace(side);
    if (value > best) {
      best = value;
      bestSide = Array.from(side);
    }
  }
  return { mean, bestRaw, best, side: bestSide };
}

describe("vector rounding trials", () => {
  it("count each cut as cutValue does, weighted (non-integer weights) and not, polished and raw", () => {
    const rng = new Rng(41);
    let checked = 0;
    for (const n of [2, 5, 7, 12, 30]) {
      for (const weighted of [false, true]) {
        for (const polish of [false, true]) {
          const g = randomGraph(n, 0.45, rng, weighted ? { weight: (r) => 0.1 + r.nextFloat() * 3 } : {});
          if (g.m === 0) continue;
          const seed = rng.nextInt(1000);
          const rec = vectorMethodRound(g, { trials: 25, solverSeed: seed, polish });
          const plain = plainRounding(g, 25, seed, polish);
          // Welford's update of the record and the running mean here are the same arithmetic.
          expect(rec.details!.meanSurplus).toBe(plain.mean);
          expect(rec.details!.bestRoundedSurplus).toBe(surplusOf(g, plain.bestRaw));
          expect(rec.value).toBe(cutValue(g, plain.side));
          expect(Array.from(rec.partition)).toEqual(plain.side);
          checked++;
        }
      }
    }
    expect(checked).toBeGreaterThan(15);
  });

  it("vectorMethodRoundCut and vectorMethodExpectedCut give the record's cut, mean and expectation", () => {
    const rng = new Rng(43);
    for (let k = 0; k < 30; k++) {
      const g = randomGraph(4 + (k % 9), 0.5, rng);
      if (g.m === 0) continue;
      const choice = vectorChoiceOptions(optimiseVectorChoice(g).choice);
      const options = { ...choice, trials: 1 + (k % 7), solverSeed: k * 17, polish: k % 2 === 0 };
      const rec = vectorMethodRound(g, options);
      const cut = vectorMethodRoundCut(g, options);
      expect(Array.from(cut.partition)).toEqual(Array.from(rec.partition));
      expect(cut.value).toBe(rec.value);
      expect(cut.meanSurplus).toBe(rec.details!.meanSurplus);
      expect(surplusOf(g, vectorMethodExpectedCut(g, choice))).toBe(rec.details!.expectedSurplus);
    }
  });
});

describe("a file graph's hash handed to the worker", () => {
  it("is the hash of the graph rebuilt from its parts, and the job's row carries it", () => {
    const rng = new Rng(47);
    for (const n of [1, 7, 40]) {
      const g = randomGraph(n, 0.3, rng, n === 40 ? { weight: (r) => 1 + r.nextInt(4) } : {});
      const hash = graphHash(g);
      const rebuilt = graphFromPartsWithHash(graphToParts(g), hash);
      expect(graphHash(rebuilt)).toBe(hash);
      // A fresh copy (no remembered hash) hashes to the same text: what is remembered is what would be computed.
      expect(graphHash(graphFromParts(graphToParts(rebuilt)))).toBe(hash);
    }
    const g = randomGraph(7, 0.5, rng);
    const job: JobInput = {
      key: "k",
      family: "f",
      graph: { kind: "parts", parts: graphToParts(g), hash: graphHash(g), source: { path: "x.g6", position: 1, format: "graph6" } },
      params: null,
      graphSeed: null,
      solverSeed: 0,
      settings: { effort: "exact", seconds: null, work: 1e9 },
    };
    const out = runJob(job, { evaluators: [], degrees: [], version: "0", shared: {} });
    expect(out.values[COLUMNS.findIndex((c) => c.name === "graphHash")]).toBe(graphHash(graphFromParts(graphToParts(g))));
  });
});

describe("sweep rows bound without conversion", () => {
  it("read back equal: byte arrays (views into a larger buffer too) as blobs, numbers and text as given", () => {
    const dir = mkdtempSync(join(tmpdir(), "halfplus-bind-"));
    try {
      const store = openStore(join(dir, "s.db"));
      const at = (name: string) => COLUMNS.findIndex((c) => c.name === name);
      const big = new Uint8Array([9, 8, 7, 6, 5, 4, 3]);
      const row = (key: string, witness: Uint8Array) => COLUMNS.map((c, i) => (i === at("key") ? key : i === at("witness") ? witness : i === at("n") ? 7 : i === at("averageDegree") ? 2.5 : i === at("notes") ? "[]" : null));
      expect(store.insertValues([row("a", new Uint8Array([0, 22])), row("b", big.subarray(2, 5))])).toBe(2);
      // A StoredRow with a boolean goes through the converting path.
      expect(store.insert([{ key: "c", exact: true, n: 3 } as never])).toBe(1);
      const a = store.get("a")!;
      expect(Array.from(a.witness as Uint8Array)).toEqual([0, 22]);
      expect(a.n).toBe(7);
      expect(a.averageDegree).toBe(2.5);
      expect(a.notes).toBe("[]");
      expect(a.spec).toBe(null);
      expect(Array.from(store.get("b")!.witness as Uint8Array)).toEqual([7, 6, 5]);
      expect(store.get("c")!.exact).toBe(1);
      store.close();
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe("searches reusing scratch arrays", () => {
  // Everything the pooled searches answer about one graph, as plain data.
  const answers = (g: Graph): unknown => {
    const t = countTriangles(g);
    const out: unknown[] = [t.total, Array.from(t.perVertex), t.witness, girth(g), countFourCycles(g)];
    for (let k = 3; k <= Math.min(g.n, 7); k++) out.push(findCycle(g, k));
    for (let r = 3; r <= Math.min(g.n, 6); r++) out.push(findClique(g, r));
    for (const rec of [grayCodeMaxCut(g), branchAndBoundMaxCut(g)]) out.push([rec.value, rec.upper, Array.from(rec.partition)]);
    return out;
  };
  // The brute-force triangle count and max cut (definitions; common practice, no source).
  const bruteTriangles = (g: Graph): number => {
    let c = 0;
    for (let a = 0; a < g.n; a++) for (let b = a + 1; b < g.n; b++) for (let d = b + 1; d < g.n; d++) if (g.hasEdge(a, b) && g.hasEdge(b, d) && g.hasEdge(a, d)) c++;
    return c;
  };
  const bruteMaxCut = (g: Graph): number => {
    let best = 0;
    for (let mask = 0; mask < 2 ** (g.n - 1); mask++) best = Math.max(best, cutValue(g, Uint8Array.from({ length: g.n }, (_, v) => (mask >>> v) & 1)));
    return best;
  };

  it("give the same answers whatever ran before (a complete graph of the same order in between), and the brute-force ones", () => {
    const rng = new Rng(808);
    const graphs: Graph[] = [];
    for (const n of [1, 2, 3, 5, 6, 7, 8]) for (let k = 0; k < 12; k++) graphs.push(labelled(n, Math.floor(rng.nextFloat() * 2 ** ((n * (n - 1)) / 2))));
    for (const n of [9, 12, 16]) for (const p of [0.2, 0.5, 0.8]) graphs.push(randomGraph(n, p, rng));
    const forward = graphs.map(answers);
    const complete = (n: number): Graph => labelled(n, 2 ** ((n * (n - 1)) / 2) - 1);
    for (let i = graphs.length - 1; i >= 0; i--) {
      const g = graphs[i];
      answers(complete(g.n));
      answers(complete(g.n + 1));
      expect(answers(g)).toEqual(forward[i]);
      expect(countTriangles(g).total).toBe(bruteTriangles(g));
      if (g.n <= 12) expect(grayCodeMaxCut(g).value).toBe(bruteMaxCut(g));
    }
  });
});

describe("sweep messages packed per batch (wire.ts)", () => {
  it("give the rows runJob gives (the plain path), for family specs, file graphs (weighted too) and a failing job", () => {
    const rng = new Rng(91);
    const settings = { effort: "exact" as const, seconds: null, work: 1e9 };
    const context = { evaluators: EVALUATOR_NAMES, degrees: ["degeneracy", "maxDegree"], version: "0", shared: { gitCommit: null, nodeVersion: "v", platform: "p" } };
    const jobs: JobInput[] = [];
    const fileJob = (g: Graph, position: number, solverSeed: number): JobInput => ({
      key: `h${position}|${solverSeed}`,
      family: "f",
      graph: { kind: "parts", parts: graphToParts(g), hash: graphHash(g), source: { path: "x.g6", position, format: "graph6" } },
      params: null,
      graphSeed: null,
      solverSeed,
      settings,
    });
    for (let k = 0; k < 6; k++) jobs.push(fileJob(randomGraph(7, 0.5, rng), k + 1, k % 2));
    jobs.push(fileJob(randomGraph(9, 0.4, rng, { weight: (r) => 1 + r.nextInt(5) }), 7, 0));
    jobs.push({ key: "spec", family: "gnp", graph: { kind: "spec", spec: "gnp:n=10,p=0.3,seed=4" }, params: '{"n":10,"p":0.3}', graphSeed: 4, solverSeed: 3, settings: { effort: "auto", seconds: null, work: 2e6 } });
    const plain = jobs.map((j) => runJob(j, context).values);
    // Wall-clock cells differ run to run (common practice, no source): left out of the comparison.
    const timing = new Set(["seconds", "startedAt", "runs", "budgetStages"].map((c) => COLUMNS.findIndex((x) => x.name === c)));
    const steady = (v: readonly unknown[]) => v.map((x, i) => (timing.has(i) ? null : x instanceof Uint8Array ? Array.from(x) : x));
    // structuredClone stands in for the thread boundary (the same serialiser as postMessage).
    const sent = structuredClone(encodeJobs(5, [...jobs, { ...jobs[0], key: "bad", graph: { kind: "spec", spec: "no-such-family:n=3" } }, jobs[1]], context));
    const back = structuredClone(runJobsMessage(sent, context));
    expect(back.rows).toBe(jobs.length);
    expect(back.failure?.inputError).toBe(true);
    const decoded = decodeRows(back, [...jobs, { ...jobs[0], key: "bad" }], context);
    expect(decoded.length).toBe(jobs.length + 1);
    expect(decoded[jobs.length]).toMatchObject({ key: "bad", inputError: true });
    for (let k = 0; k < jobs.length; k++) {
      const d = decoded[k];
      expect(d.error).toBeUndefined();
      if (d.error !== undefined) continue;
      expect(d.key).toBe(jobs[k].key);
      expect(steady(d.values)).toEqual(steady(plain[k]));
    }
  });
});

describe("per-graph results kept on the graph (src/graph/per-graph.ts)", () => {
  it("are computed once per graph object, equal a fresh computation, and leave the graph's value alone", () => {
    const rng = new Rng(5150);
    for (const n of [1, 7, 20]) {
      const g = randomGraph(n, 0.4, rng);
      const copy = graphFromParts(graphToParts(g));
      const first = sharedTriangleCount(g);
      expect(sharedTriangleCount(g)).toBe(first);
      expect(sharedDegeneracy(g)).toBe(sharedDegeneracy(g));
      // The definitions (common practice, no source): the plain functions on a graph that kept nothing.
      expect(first).toEqual(countTriangles(copy));
      expect(sharedDegeneracy(g)).toEqual(degeneracy(copy));
      // What is kept is not part of the graph: equal to its copy, left out of keys, clones and JSON.
      expect(g).toEqual(copy);
      expect(Object.keys(g)).toEqual(Object.keys(copy));
      expect(JSON.stringify(structuredClone(g))).toBe(JSON.stringify(copy));
      expect(sharedTriangleCount(copy)).not.toBe(first);
    }
  });
});
