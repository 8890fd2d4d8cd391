// The census tables in merge and verify: a triangle-free census (nauty-geng -t, n = 1..N, default
// 11) counted into two stores (one whole, one stopped part-way and copied: a snapshot of the same
// run), then (1) merging the whole one into a new store, (2) merging the snapshot and the whole run
// (the extension check), (3) merging the same again (every cell compared), (4) verifying every census
// row (witnesses re-solved exactly). CPU seconds of this process, so other load counts less.
// Usage: node bench/store-tables.bench.mjs [--n 11]
import { execFileSync } from "node:child_process";
import { copyFileSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Readable } from "node:stream";
import { mergeStores, openStore, runCensus, verifyCensusTables } from "../dist/experiment/index.js";
import { report } from "./util.mjs";

const args = process.argv.slice(2);
const at = args.indexOf("--n");
const N = at < 0 ? 11 : Number(args[at + 1]);
const dir = mkdtempSync(join(tmpdir(), "halfplus-bench-tables-"));
const cpuSeconds = () => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
};
const rows = [];
function measure(name, fn) {
  const t0 = performance.now();
  const c0 = cpuSeconds();
  const out = fn();
  rows.push({ measure: name, seconds: +((performance.now() - t0) / 1000).toFixed(3), "CPU-s": +(cpuSeconds() - c0).toFixed(3) });
  return out;
}

try {
  let text = "";
  for (let n = 1; n <= N; n++) text += execFileSync("nauty-geng", ["-q", "-t", String(n)], { maxBuffer: 1 << 30 }).toString();
  const graphs = text.split("\n").filter((l) => l !== "").length;
  const feed = (store, atMost) => runCensus({ input: "-", stdin: Readable.from([Buffer.from(text)]), store, name: "tf", workers: 2, atMost });
  const run = join(dir, "run.db");
  await feed(run, Math.floor(graphs / 2));
  copyFileSync(run, join(dir, "early.db"));
  await feed(run);
  const s = openStore(run, { readonly: true });
  const cells = s.census().cells("tf").length;
  s.close();
  console.log(`census of ${graphs} triangle-free graphs (n ≤ ${N}): ${cells} cells`);
  measure("merge one census into a new store", () => mergeStores([run], join(dir, "one.db")));
  measure("merge a snapshot and its further run (extension check)", () => mergeStores([join(dir, "early.db"), run], join(dir, "two.db")));
  measure("merge both again (every cell compared, nothing written)", () => mergeStores([join(dir, "early.db"), run], join(dir, "two.db")));
  const v = openStore(join(dir, "two.db"), { readonly: true });
  const verdicts = measure("verify every census row (witnesses re-solved)", () => [...verifyCensusTables(v)]);
  v.close();
  console.log(`${verdicts.filter((x) => x.ok).length} of ${verdicts.length} census rows verified`);
  report("store-tables", rows);
} finally {
  rmSync(dir, { recursive: true, force: true });
}
