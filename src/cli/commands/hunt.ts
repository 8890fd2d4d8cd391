// `halfplus hunt --free C4 --n 31 --objective ratio --minutes 10 --store results/hunt.db`: search
// H-free graphs on n vertices for small certified surplus (src/hunt), keep the best certified graph
// per m in the results store, and optionally write the bracket records and the frontier figure.
import { writeFileSync } from "node:fs";
import { InputError } from "../../errors.js";
import { encodeGraph6 } from "../../graph/formats/graph6.js";
import type { Graph } from "../../graph/graph.js";
import { parsePatternName, patternGraph } from "../../graph/structure/patterns.js";
import { hunt, objectiveKey, objectiveLabel, OBJECTIVE_KINDS, type HuntObjective, type HuntProgress, type HuntStarts } from "../../hunt/index.js";
import { DEFAULT_STORE, openStore, type HuntFrontierRow } from "../../experiment/index.js";
import { figureHtml, huntFrontierFigure } from "../../plot/index.js";
import { openSingleGraph } from "../../sources/index.js";
import type { CommandSpec } from "../args.js";
import { huntHelp } from "./help/hunt.js";
import { formatNumber, formatTable } from "../format.js";
import { writeLine } from "../output.js";

/** H from --free: a pattern name (K3, C4, C5, K4, K2,3, any K_r, C_k, K_s,t, P_k) or a graph file / family spec. */
async function patternFrom(arg: string): Promise<{ graph: Graph; name: string; preset: string | null }> {
  let parsed: ReturnType<typeof parsePatternName> | null = null;
  try {
    parsed = parsePatternName(arg);
  } catch {
    parsed = null;
  }
  if (parsed !== null) return { graph: patternGraph(parsed.name), name: parsed.name, preset: parsed.name };
  const g = (await openSingleGraph(arg)).graph;
  if (g.weights !== null) throw new InputError(`--free ${arg}: H should be an unweighted graph`);
  if (g.m === 0) throw new InputError(`--free ${arg}: H should have at least one edge`);
  if (g.n > 16) throw new InputError(`--free ${arg}: H should have at most 16 vertices (got ${g.n})`);
  return { graph: g, name: `graph6:${encodeGraph6(g)}`, preset: null };
}

function objectiveFrom(o: Record<string, unknown>): HuntObjective {
  const kind = o["objective"] as (typeof OBJECTIVE_KINDS)[number];
  const alpha = o["alpha"] as number | undefined;
  const m = o["m"] as number | undefined;
  if (kind !== "power" && alpha !== undefined) throw new InputError("--alpha belongs to --objective power");
  if (kind !== "surplus" && m !== undefined) throw new InputError("--m belongs to --objective surplus");
  if (kind === "power") {
    if (alpha === undefined) throw new InputError("--objective power needs --alpha A (0 < A ≤ 2): the objective is surplus/m^A");
    return { kind, alpha };
  }
  if (kind === "surplus") {
    if (m === undefined) throw new InputError("--objective surplus needs --m M: the number of edges to hold fixed");
    return { kind, m };
  }
  return { kind: "ratio" };
}

function progressWriter(stderr: NodeJS.WritableStream): (p: HuntProgress) => void {
  const tty = (stderr as NodeJS.WriteStream).isTTY === true;
  let last = -Infinity;
  let shown = -1;
  return (p) => {
    const now = performance.now();
    const final = p.totalIterations !== null && p.iterations >= p.totalIterations;
    if (p.iterations === shown || (!final && now - last < (tty ? 250 : 10_000))) return;
    last = now;
    shown = p.iterations;
    const done = p.totalIterations === null ? `${p.iterations} moves` : `${p.iterations}/${p.totalIterations} moves`;
    const best = p.best === null ? "none yet" : `${formatNumber(p.best)} at m = ${p.bestM}`;
    const line = `hunt: ${done}, ${formatNumber(p.elapsedSeconds)} s, chain ${p.chains} (${p.start}), m = ${p.currentM}, frontier ${p.frontierSize} values of m, best ${best}, ${p.certified} certified`;
    stderr.write(tty ? `\r\x1b[2K${line}` : `${line}\n`);
  };
}

export const huntCommand: CommandSpec = {
  ...huntHelp,
  async run(args, io) {
    const o = args.options;
    if (o["free"] === undefined) throw new InputError("--free H is required: the forbidden graph (K3, C4, C5, K4, K2,3, or a graph file)");
    if (o["n"] === undefined) throw new InputError("--n N is required: the number of vertices");
    if (o["minutes"] !== undefined && o["seconds"] !== undefined) throw new InputError("--minutes and --seconds: give one time budget");
    const seconds = o["minutes"] !== undefined ? (o["minutes"] as number) * 60 : (o["seconds"] as number | undefined);
    if (seconds !== undefined && !(seconds > 0)) throw new InputError(`--${o["minutes"] !== undefined ? "minutes" : "seconds"} must be positive (got 0)`);
    const iterations = o["iterations"] as number | undefined;
    if (seconds === undefined && iterations === undefined) throw new InputError("a budget is required: --minutes M, --seconds S or --iterations N");
    const h = await patternFrom(o["free"] as string);
    const n = o["n"] as number;
    if (n < h.graph.n) throw new InputError(`--n ${n}: H has ${h.graph.n} vertices, so n should be at least that`);
    const objective = objectiveFrom(o);
    const storePath = (o["store"] as string | undefined) ?? DEFAULT_STORE;
    const store = openStore(storePath);
    const key = objectiveKey(objective);
    let stored = 0;
    try {
      const result = hunt({
        pattern: h.graph,
        patternName: h.preset,
        n,
        objective,
        iterations,
        seconds,
        solverSeed: o["solver-seed"] as number,
        starts: o["start"] as HuntStarts,
        processRuns: o["process-runs"] as number,
        chainLength: o["chain-length"] as number,
        onProgress: o["progress"] === false ? undefined : progressWriter(io.stderr),
        // Anytime: each frontier improvement is committed as it is found.
        onFrontier: (e) => {
          const row: HuntFrontierRow = {
            pattern: h.name, n, objective: key, m: e.m, value: e.value, surplusLower: e.record.surplusLower, surplusUpper: e.record.surplusUpper,
            degeneracy: e.degeneracy, graph6: e.graph6, graphHash: e.graphHash, start: e.start, solverSeed: o["solver-seed"] as number,
            iteration: e.iteration, foundAt: new Date().toISOString(), record: JSON.stringify(e.record),
          };
          if (store.putHuntEntry(row)) stored++;
        },
      });
      if (o["progress"] !== false && (io.stderr as NodeJS.WriteStream).isTTY === true) io.stderr.write("\n");
      if (o["records"] !== undefined) writeFileSync(o["records"] as string, result.frontier.map((e) => JSON.stringify(e.record) + "\n").join(""));
      if (o["figure"] !== undefined) {
        const fig = huntFrontierFigure(result.frontier, result.references, { objective: objectiveLabel(objective), n, pattern: h.preset ?? "H" });
        writeFileSync(o["figure"] as string, figureHtml(fig));
      }
      if (o["json"] === true) {
        for (const e of result.frontier) await writeLine(io.stdout, JSON.stringify({ kind: "halfplus/hunt-frontier", pattern: h.name, objective: key, ...e }));
      } else {
        const rows: string[][] = [["m", "d", objectiveLabel(objective), "surplus", "graph6", "start"]];
        for (const e of result.frontier) rows.push([String(e.m), String(e.degeneracy), formatNumber(e.value), `[${formatNumber(e.record.surplusLower)}, ${formatNumber(e.record.surplusUpper)}]`, e.graph6, e.start]);
        const lines = formatTable(rows);
        for (const r of result.references) lines.push(`reference ${r.label}: m = ${r.m}, d = ${r.degeneracy}, ${objectiveLabel(objective)} ≤ ${formatNumber(r.value)}`);
        const b = result.best;
        lines.push(`best: ${b === null ? "none" : `${formatNumber(b.value)} at m = ${b.m} (${b.graph6})`}; ${result.iterations} moves (${result.status}), ${result.certified} certified, ${stored} frontier improvements written to ${storePath}`);
        await writeLine(io.stdout, lines.join("\n"));
      }
    } finally {
      store.close();
    }
    return 0;
  },
};
