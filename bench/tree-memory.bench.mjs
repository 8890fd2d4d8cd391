// Memory of a long tree search: resident set and JS heap against nodes evaluated, on ER_8
// (polarity q = 8, 73 vertices; plain node bound, most-decided branching, as bench/exact-hundred
// runs it), sampled from the progress callback. The search keeps its open nodes in memory; their
// warm-start data is held under `warmMemory` (bytes; the tree's default when unset).
// Environment: TREE_MEMORY_SECONDS (wall clock, default 180), TREE_MEMORY_SPEC (default
// polarity:q=8,loops=drop), TREE_MEMORY_WARM (bytes for warm data, default: the tree's default),
// TREE_MEMORY_MAX_OPEN (open nodes before depth-first dives, default: the tree's default), TREE_MEMORY_DIST (the build to load, default ../dist: lets one compare an older build).
import { loadavg } from "node:os";
import { resolve } from "node:path";
import { pathToFileURL } from "node:url";

const dist = resolve(process.env.TREE_MEMORY_DIST ?? new URL("../dist", import.meta.url).pathname);
const { breakoutSearch, relaxationTreeSearch } = await import(pathToFileURL(`${dist}/cut/index.js`).href);
const { family } = await import(pathToFileURL(`${dist}/families/index.js`).href);
const seconds = Number(process.env.TREE_MEMORY_SECONDS ?? 180);
const spec = process.env.TREE_MEMORY_SPEC ?? "polarity:q=8,loops=drop";
const warmMemory = process.env.TREE_MEMORY_WARM === undefined ? undefined : Number(process.env.TREE_MEMORY_WARM);
const maxOpen = process.env.TREE_MEMORY_MAX_OPEN === undefined ? undefined : Number(process.env.TREE_MEMORY_MAX_OPEN);
const mb = (x) => Math.round(x / 2 ** 20);
const g = family(spec);
console.log(`${spec}: n=${g.n}, m=${g.m}, ${seconds} s, build ${dist}, load ${loadavg().map((x) => x.toFixed(2)).join(" ")}`);
const cut = breakoutSearch(g, { seconds: 2, solverSeed: 1 });
const c0 = process.cpuUsage();
let next = 0;
const r = relaxationTreeSearch(g, {
  seconds, relaxation: "plain", branching: "most-decided", initial: cut.partition, solverSeed: 1, warmMemory, maxOpen,
  onProgress: (p) => {
    if (p.seconds < next) return;
    next += 15;
    const m = process.memoryUsage();
    const c = process.cpuUsage(c0);
    console.log(`t=${Math.round(p.seconds)} s cpu=${((c.user + c.system) / 1e6).toFixed(0)} s nodes=${p.nodes} open=${p.open} rss=${mb(m.rss)} MB heap=${mb(m.heapUsed)} MB arrays=${mb(m.arrayBuffers)} MB` +
      (p.warmBytes !== undefined ? ` warm=${mb(p.warmBytes)} MB` : "") + ` bracket=[${p.lower}, ${p.upper}] load=${loadavg()[0].toFixed(2)}`);
  },
});
const m = process.memoryUsage();
console.log(`end: ${r.status} [${r.value}, ${r.upper}] nodes=${r.nodes} regions=${r.certificate.regions.length} details=${JSON.stringify({ ...r.details, workUsed: undefined })} rss=${mb(m.rss)} MB heap=${mb(m.heapUsed)} MB load ${loadavg()[0].toFixed(2)}`);
