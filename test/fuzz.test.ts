// Fuzz suite over every graph reader, the family spec parser and `verify` (common practice, no
// source): seeded hostile inputs (test/helpers/fuzz.ts) must give a correct graph or a one-line
// InputError naming the input, never an internal error, and stay inside the memory budget.
// The normal run is a few thousand cases; `node bench/run.mjs fuzz` runs it at a larger scale
// (HALFPLUS_FUZZ_SCALE) and also reports the slowest case.
import { writeFileSync } from "node:fs";
import { Readable } from "node:stream";
import { afterAll, describe, expect, it } from "vitest";
import { InputError } from "../src/errors.js";
import type { Graph } from "../src/graph/graph.js";
import { readGraphs } from "../src/graph/formats/read.js";
import { writeGraph } from "../src/graph/formats/write.js";
import { familyWithInfo } from "../src/families/registry.js";
import { SourceResolver } from "../src/sources/index.js";
import { bracket } from "../src/cut/bracket/bracket.js";
import { parseBracketRecord, verifyBracket } from "../src/cut/bracket/verify.js";
import { graphHash } from "../src/graph/hash.js";
import { parseJsonSequence } from "../src/limits/strict-json.js";
import { MEMORY_LIMIT_ENV, parseByteSize } from "../src/limits/memory.js";
import { Rng } from "../src/random/prng.js";
import { bruteForceMaxCut, cutOfPartition } from "./helpers/maxcut.js";
import { duplicateKey, mutateBytes, mutateRecordValue, mutateSpec, randomSpec, readerCase } from "./helpers/fuzz.js";

// A tight budget makes every "declares 10^8 vertices" input a refusal rather than a slow build, and
// bounds the legitimate graphs a random spec may denote (norm-graph:q=11,t=4 has 8.8·10^6 edges).
process.env[MEMORY_LIMIT_ENV] = process.env[MEMORY_LIMIT_ENV] ?? "512M";
const CAP = parseByteSize(process.env[MEMORY_LIMIT_ENV]!, MEMORY_LIMIT_ENV);
const SCALE = Math.max(1, Number(process.env.HALFPLUS_FUZZ_SCALE ?? "1"));
const SEED = Number(process.env.HALFPLUS_FUZZ_SEED ?? "20250301");
/** Vitest's per-test limit grows with the scale (the bench runs 10–20×); it is not a timing assertion. */
const LIMIT_MS = 120_000 * SCALE;

interface TargetStats {
  cases: number;
  accepted: number;
  refused: number;
  slowestMs: number;
  slowestCase: string;
  findings: string[];
}
const stats: Record<string, TargetStats> = {};
let maxRss = 0;

function target(name: string): TargetStats {
  return (stats[name] ??= { cases: 0, accepted: 0, refused: 0, slowestMs: 0, slowestCase: "", findings: [] });
}

/** Time one case (for the report only: no assertion reads the clock) and watch the memory. */
async function runCase(t: TargetStats, label: string, f: () => Promise<void> | void): Promise<void> {
  const t0 = performance.now();
  await f();
  const ms = performance.now() - t0;
  t.cases++;
  if (ms > t.slowestMs) {
    t.slowestMs = ms;
    t.slowestCase = label.slice(0, 200);
  }
  maxRss = Math.max(maxRss, process.memoryUsage.rss());
}

/** An input error must be one line naming the input; anything else is a finding. */
function judgeError(t: TargetStats, e: unknown, label: string, mustName: string | null): void {
  if (!(e instanceof InputError)) {
    t.findings.push(`internal error on ${label}: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`.slice(0, 600));
    return;
  }
  t.refused++;
  if (/[\n\r]/.test(e.message)) t.findings.push(`multi-line message on ${label}: ${JSON.stringify(e.message).slice(0, 300)}`);
  if (e.message.length > 4000) t.findings.push(`message of ${e.message.length} characters on ${label}`);
  if (mustName !== null && !e.message.includes(mustName)) t.findings.push(`message does not name ${mustName} on ${label}: ${e.message.slice(0, 300)}`);
}

/** CSR invariants every Graph must satisfy, however it was read. */
function graphProblem(g: Graph): string | null {
  const { n, offsets, neighbors, weights } = g;
  if (offsets.length !== n + 1 || offsets[0] !== 0 || offsets[n] !== neighbors.length) return "bad offsets";
  for (let u = 0; u < n; u++) {
    for (let i = offsets[u]; i < offsets[u + 1]; i++) {
      const v = neighbors[i];
      if (v < 0 || v >= n || v === u) return `bad neighbour ${v} of ${u}`;
      if (i > offsets[u] && neighbors[i - 1] >= v) return `unsorted list of ${u}`;
      if (g.edgeWeight(v, u) !== (weights === null ? 1 : weights[i])) return `asymmetric edge ${u}-${v}`;
      if (weights !== null && !Number.isFinite(weights[i])) return "non-finite weight";
    }
  }
  return null;
}

afterAll(() => {
  const report = process.env.HALFPLUS_FUZZ_REPORT;
  if (report !== undefined) writeFileSync(report, JSON.stringify({ seed: SEED, scale: SCALE, maxRssMB: Math.round(maxRss / 2 ** 20), capMB: Math.round(CAP / 2 ** 20), stats }, null, 2));
});

describe("fuzz: hostile input gives a graph or one line, never a crash", () => {
  it("graph readers: valid, mutated, lying and random inputs in every format", async () => {
    const t = target("readers");
    const rng = new Rng(SEED);
    const cases = 1800 * SCALE;
    for (let k = 0; k < cases; k++) {
      const c = readerCase(rng);
      const label = `reader case ${k} (${c.format ?? "detect"}, ${JSON.stringify(Buffer.from(c.bytes).toString("latin1").slice(0, 60))})`;
      await runCase(t, label, async () => {
        const graphs: Graph[] = [];
        try {
          for await (const g of readGraphs({ stream: Readable.from([Buffer.from(c.bytes)]), name: "fuzz-input" }, { format: c.format })) {
            graphs.push(g.graph);
            if (graphs.length > 64) break;
          }
        } catch (e) {
          judgeError(t, e, label, "fuzz-input");
          if (c.expected !== null) t.findings.push(`valid encoding refused: ${label}: ${(e as Error).message}`);
          return;
        }
        t.accepted++;
        for (const g of graphs) {
          const p = graphProblem(g);
          if (p !== null) t.findings.push(`${p}: ${label}`);
        }
        if (c.expected !== null) {
          // An unmutated encoding must decode to exactly the graph written.
          if (graphs.length !== 1 || graphHash(graphs[0]) !== graphHash(c.expected)) t.findings.push(`wrong decode: ${label}`);
        } else if (graphs.length === 1 && c.format !== undefined && graphs[0].n <= 1000) {
          // A mutated input that still reads must read the same after a round trip through its format.
          const g = graphs[0];
          const fmt = c.format === "gset" || c.format === "edgelist" || !g.weighted ? c.format : null;
          if (fmt !== null) {
            const back: Graph[] = [];
            for await (const x of readGraphs({ stream: Readable.from([Buffer.from(writeGraph(g, fmt))]), name: "round-trip" }, { format: fmt })) back.push(x.graph);
            if (back.length !== 1 || graphHash(back[0]) !== graphHash(g)) t.findings.push(`round trip changes the graph: ${label}`);
          }
        }
      });
    }
    expect(t.findings).toEqual([]);
    // Both outcomes must occur, or the generator has stopped exercising one side.
    expect(t.accepted).toBeGreaterThan(cases / 10);
    expect(t.refused).toBeGreaterThan(cases / 10);
    expect(maxRss).toBeLessThan(CAP + 512 * 2 ** 20);
  }, LIMIT_MS);

  it("family specs: random, hostile and deeply nested specs", async () => {
    const t = target("specs");
    const rng = new Rng(SEED + 1);
    const cases = 900 * SCALE;
    for (let k = 0; k < cases; k++) {
      let spec = randomSpec(rng);
      if (rng.nextInt(3) === 0) spec = mutateSpec(spec, rng);
      const label = `spec case ${k}: ${JSON.stringify(spec.slice(0, 150))}`;
      await runCase(t, label, () => {
        try {
          const f = familyWithInfo(spec);
          t.accepted++;
          const p = graphProblem(f.graph);
          if (p !== null) t.findings.push(`${p}: ${label}`);
        } catch (e) {
          judgeError(t, e, label, null);
        }
      });
    }
    expect(t.findings).toEqual([]);
    expect(t.accepted).toBeGreaterThan(cases / 20);
    expect(t.refused).toBeGreaterThan(cases / 10);
    expect(maxRss).toBeLessThan(CAP + 512 * 2 ** 20);
  }, LIMIT_MS);

  it("verify: mutated record text and fields are bad input or a verdict, and no false bound is accepted", async () => {
    const t = target("verify");
    const rng = new Rng(SEED + 2);
    const specs = ["petersen", "cycle:n=7", "gnp:n=11,p=0.5,seed=3", "complete:n=6", "kneser:n=6,k=2", "path:n=1"];
    const bases = specs.map((spec) => {
      const f = familyWithInfo(spec);
      return { spec, graph: f.graph, opt: bruteForceMaxCut(f.graph), text: JSON.stringify(bracket(f.graph, { seconds: 1, source: { spec: f.spec } })) };
    });
    const cases = 700 * SCALE;
    const resolver = new SourceResolver();
    for (let k = 0; k < cases; k++) {
      const base = bases[rng.nextInt(bases.length)];
      const how = rng.nextInt(3);
      const text =
        how === 0
          ? Buffer.from(mutateBytes(Buffer.from(base.text), rng)).toString("utf8")
          : how === 1
            ? duplicateKey(base.text, rng)
            : JSON.stringify(mutateRecordValue(JSON.parse(base.text) as Record<string, unknown>, rng));
      const label = `verify case ${k} on ${base.spec} (${["bytes", "duplicate key", "field"][how]})`;
      await runCase(t, label, async () => {
        try {
          for (const v of parseJsonSequence(text, "fuzz.json")) {
            const rec = parseBracketRecord(v.value, `fuzz.json:${v.line}`);
            const graph = await resolver.resolve(rec.source, `fuzz.json:${v.line}`);
            const verdict = verifyBracket(graph, rec, { seconds: 0.5 });
            t.accepted++;
            if (verdict.ok && graphHash(graph) === graphHash(base.graph)) {
              // Accepted: every claim must be true (brute force and an independent cut evaluator).
              const opt = base.opt;
              if (rec.lower !== cutOfPartition(graph, rec.partition) || rec.lower > opt) t.findings.push(`false lower end accepted: ${label}`);
              if (verdict.upperKind === "proven" && rec.upper < opt) t.findings.push(`false upper end accepted: ${label}`);
              if (verdict.upperKind !== "proven" && (rec.upperKind === "proven" || rec.exact)) t.findings.push(`estimate accepted as proof: ${label}`);
            }
          }
        } catch (e) {
          judgeError(t, e, label, null);
        }
      });
    }
    expect(t.findings).toEqual([]);
    expect(t.accepted).toBeGreaterThan(cases / 10);
    expect(t.refused).toBeGreaterThan(cases / 3);
  }, LIMIT_MS);
});
