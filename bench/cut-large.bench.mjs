// Cuts on large sparse graphs: the memetic search (src/cut/heuristic/memetic.ts) against the
// breakout search alone, old and new run side by side in two worker threads (one core each) so
// both see the same machine load. Part 1: the G-set graphs with 800–3000 vertices at 10 s,
// percent of the best known (../shared/reference/gset/best-known.csv; target ≥ 99.9 %).
// Part 2: random G(n, m) graphs (family gnm, graph seed 1) at the sizes of the benchmark set's
// large random and toroidal graphs (G55: 5000/12498, G60: 7000/17148, G70: 10000/9999,
// G81: 20000/40000) at 60 s: cut values, their difference, and the moves each search made.
// The large G-set files themselves (G55–G81) are compared with their best-known values when
// present in the reference folder.
//
// usage: node bench/cut-large.bench.mjs [--part gset|random|both] [--seeds 1,2,3] [--seconds-gset 10] [--seconds-random 60] [--work W]
// (the default run takes about 15 minutes: 18 pairs of 10 s and 12 pairs of 60 s)
// The machine these figures come from is shared and loaded: wall-clock budgets buy different
// amounts of work from run to run, which is why each row also gives the moves made. With
// `--work W` both searches get W moves instead of a time (breakout in slices of 100 rounds until
// it has made W moves), a comparison the machine's load cannot bias.
import { existsSync, mkdirSync, readFileSync } from "node:fs";
import { loadavg } from "node:os";
import { join } from "node:path";
import { Worker, isMainThread, parentPort, workerData } from "node:worker_threads";
import { fileURLToPath } from "node:url";
import { SHARED_REFERENCE, hasShared, readGsetTable, report } from "./util.mjs";

const here = fileURLToPath(import.meta.url);

async function loadGraph(spec) {
  if (spec.file !== undefined) {
    const { parseGset } = await import("../dist/graph/formats/gset.js");
    return parseGset(readFileSync(spec.file), { source: spec.file }).graph;
  }
  const { gnm } = await import("../dist/families/gnm.js");
  return gnm(spec.n, spec.m, spec.graphSeed);
}

if (!isMainThread) {
  const { spec, method, seed, seconds, work } = workerData;
  const g = await loadGraph(spec);
  let value, moves;
  if (method === "breakout") {
    const { BreakoutSearcher } = await import("../dist/cut/heuristic/breakout.js");
    const s = new BreakoutSearcher(g, { solverSeed: seed });
    if (work === undefined) s.run({ seconds });
    else while (s.best().details.moves < work) s.run({ seconds: Infinity, iterations: 100 });
    const r = s.best();
    value = r.value;
    moves = r.details.moves;
  } else {
    const { memeticSearch } = await import("../dist/cut/heuristic/memetic.js");
    const r = memeticSearch(g, work === undefined ? { solverSeed: seed, seconds } : { solverSeed: seed, work });
    value = r.value;
    moves = r.work;
  }
  parentPort.postMessage({ value, moves, n: g.n, m: g.m });
} else {
  const argv = process.argv.slice(2);
  const option = (name, dflt) => {
    const i = argv.indexOf(name);
    return i >= 0 ? argv[i + 1] : dflt;
  };
  const part = option("--part", "both");
  const seeds = option("--seeds", "1,2,3").split(",").map(Number);
  const secondsGset = Number(option("--seconds-gset", "10"));
  const secondsRandom = Number(option("--seconds-random", "60"));
  const work = option("--work", undefined) === undefined ? undefined : Number(option("--work"));

  const runOne = (spec, method, seed, seconds) =>
    new Promise((resolve, reject) => {
      const w = new Worker(here, { workerData: { spec, method, seed, seconds, work } });
      w.once("message", resolve);
      w.once("error", reject);
    });
  const pair = async (spec, seed, seconds) => {
    const load = loadavg()[0];
    const [old, neu] = await Promise.all([runOne(spec, "breakout", seed, seconds), runOne(spec, "memetic", seed, seconds)]);
    return { old, neu, load: Number(((load + loadavg()[0]) / 2).toFixed(1)) };
  };

  mkdirSync(new URL("./out/", import.meta.url), { recursive: true });
  const known = hasShared() ? readGsetTable("best-known.csv") : new Map();
  const pct = (v, ref) => (ref === undefined ? null : Number(((100 * v) / ref).toFixed(3)));

  if (part !== "random") {
    const rows = [];
    if (!hasShared()) console.log(`skip gset: ${SHARED_REFERENCE} is absent`);
    for (const name of hasShared() ? ["G1", "G11", "G14", "G22", "G43", "G48"] : []) {
      const file = join(SHARED_REFERENCE, "gset", `${name}.txt`);
      if (!existsSync(file)) continue;
      for (const seed of seeds) {
        const { old, neu, load } = await pair({ file }, seed, secondsGset);
        const ref = known.get(name);
        const row = { graph: name, n: old.n, seed, bestKnown: ref, breakout: old.value, "breakout%": pct(old.value, ref), memetic: neu.value, "memetic%": pct(neu.value, ref), breakoutMoves: old.moves, memeticMoves: neu.moves, load };
        row.target = row["memetic%"] >= 99.9 ? "met" : "missed";
        rows.push(row);
        console.log(JSON.stringify(row));
      }
    }
    if (rows.length > 0) report(work === undefined ? "cut-large-gset" : "cut-large-gset-work", rows);
  }

  if (part !== "gset") {
    const rows = [];
    const specs = [
      { label: "gnm like G55", n: 5000, m: 12498, graphSeed: 1 },
      { label: "gnm like G60", n: 7000, m: 17148, graphSeed: 1 },
      { label: "gnm like G70", n: 10000, m: 9999, graphSeed: 1 },
      { label: "gnm like G81", n: 20000, m: 40000, graphSeed: 1 },
    ];
    // The large benchmark graphs themselves, where the reference folder has them.
    for (const name of ["G55", "G60", "G63", "G70", "G72", "G77", "G81"]) {
      const file = join(SHARED_REFERENCE, "gset", `${name}.txt`);
      if (existsSync(file)) specs.push({ label: name, file });
      else console.log(`no ${name} in the reference folder: compared on G(n, m) at its size only`);
    }
    for (const spec of specs) {
      for (const seed of seeds) {
        const { old, neu, load } = await pair(spec, seed, secondsRandom);
        const ref = spec.file === undefined ? undefined : known.get(spec.label);
        const row = { graph: spec.label, n: old.n, m: old.m, seed, ...(work === undefined ? { seconds: secondsRandom } : { work }), breakout: old.value, memetic: neu.value, gain: neu.value - old.value, breakoutMoves: old.moves, memeticMoves: neu.moves, load };
        if (ref !== undefined) Object.assign(row, { bestKnown: ref, "breakout%": pct(old.value, ref), "memetic%": pct(neu.value, ref) });
        rows.push(row);
        console.log(JSON.stringify(row));
      }
    }
    report(work === undefined ? "cut-large-random" : "cut-large-random-work", rows);
  }
}
