#!/usr/bin/env node
// `npm run demo`: the flagship sweep end to end, no Jupyter needed. Runs plans/demo.json into the
// default store (results/halfplus.db, SQLite) with live progress on stderr, fits a power law per
// family, prints the fit table, and writes results/report.html (every figure, the fit table,
// provenance), results/rows.csv (the store's rows), and results/figures/ (pgfplots .tex and the
// plotted data as .csv for each figure; .svg too when Debian's Chromium is installed).
//
//   node scripts/demo.mjs [--plan FILE] [--out DIR] [--workers N] [--no-images]
//
// `runDemo` is the whole code path; test/demo.test.ts runs it on a small plan.

import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, writeFileSync } from "node:fs";
import { availableParallelism } from "node:os";
import { dirname, join, relative, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), "..");

/** The package as built by `npm ci` / `npm run build` (dist/); a clear line when it is missing. */
async function loadHalfplus() {
  const entry = join(ROOT, "dist", "index.js");
  if (!existsSync(entry)) throw new Error(`demo: ${relative(process.cwd(), entry)} is missing: run \`npm run build\` (npm ci does it) first`);
  return import(pathToFileURL(entry).href);
}

const FIGURE_NAMES = ["surplus-scaling", "normalised-ratio", "exponents", "bound-tightness", "degrees"];

/**
 * The demo's code path. Options: plan (file, default plans/demo.json), out (folder, default
 * results; the store is out/halfplus.db), workers (default: one per core), images ("auto": SVG
 * when Chromium is installed; "off"), bootstrapSeed (default 1), stderr/stdout streams, tty.
 * Returns the paths written and the fits, so a test can look at them.
 */
export async function runDemo(options = {}) {
  const hp = await loadHalfplus();
  const plan = options.plan ?? join(ROOT, "plans", "demo.json");
  const out = options.out ?? "results";
  const store = join(out, "halfplus.db");
  const workers = options.workers ?? availableParallelism();
  const stderr = options.stderr ?? process.stderr;
  const stdout = options.stdout ?? process.stdout;
  const bootstrapSeed = options.bootstrapSeed ?? 1;
  const say = (line) => stderr.write(`${line}\n`);

  // 1. The sweep: rows already in the store are kept, so a second run only draws the figures.
  const loaded = hp.loadPlan(plan);
  say(`demo: ${loaded.total} graphs from ${relative(process.cwd(), plan) || plan} into ${store} with ${workers} worker${workers === 1 ? "" : "s"}`);
  const display = hp.progressDisplay(stderr, options.tty === undefined ? {} : { tty: options.tty });
  let summary;
  try {
    summary = await hp.runSweep(plan, { store, workers, onProgress: (p) => display.update(p) });
  } finally {
    display.done();
  }
  say(`demo: sweep done: ${summary.computed} computed, ${summary.skipped} already stored, ${summary.seconds.toFixed(1)} s`);

  // 2. Rows back from the store, one power law per family: surplus ≈ C·(m/√d)^a, d = degeneracy.
  const db = hp.openStore(store, { readonly: true });
  let fitRows, surplusRows, csv;
  try {
    fitRows = hp.fitRowsFromStore(db);
    surplusRows = hp.surplusRowsFromStore(db);
    csv = [...hp.exportLines(db, "csv")].map((line) => `${line}\n`).join("");
  } finally {
    db.close();
  }
  const fitOptions = { law: "m-over-sqrt-d", degree: "degeneracy", bootstrap: { solverSeed: bootstrapSeed } };
  const fits = hp.fitByFamily(fitRows, fitOptions);
  const fitList = [...fits.values()];
  stdout.write(`\nsurplus ≈ C·(m/√d)^a per family (d = degeneracy; the conjecture says a = 1)\n\n`);
  stdout.write(hp.formatFitTable(fits));
  // The conjectured law's constant: slope held at 1, fitted on every row at once.
  const conjecture = hp.fitConstant(fitRows, { law: "m-over-sqrt-d", degree: "degeneracy" });

  // 3. Figures as data, one family order for all of them. A row's key is its job key (graph | seed |
  // settings | version); the per-graph axis reads better with the graph part alone (unique here: one solver seed).
  const byGraph = (r) => ({ ...r, key: r.key.split("|")[0] });
  const order = [...new Set(surplusRows.map((r) => r.family))];
  const exponents = fitList.flatMap((f) => f.exponents());
  const figures = [
    { name: FIGURE_NAMES[0], caption: "Surplus against m/√d: each graph's bracket as a bar, each family's fitted power law with its 95 % band, and the conjectured slope-1 line.", figure: hp.surplusScalingFigure(surplusRows, { fits: fitList, conjecture, familyOrder: order }) },
    { name: FIGURE_NAMES[1], caption: "surplus/(m/√d) against m: does it level off, fall or grow?", figure: hp.normalisedRatioFigure(surplusRows, { familyOrder: order }) },
    { name: FIGURE_NAMES[2], caption: "Fitted exponents with 95 % intervals against the conjectured value 1.", figure: hp.exponentFigure(exponents) },
    { name: FIGURE_NAMES[3], caption: "Bound tightness per graph: best cut, SDP bound, vector-rounding guarantee, Edwards bound.", figure: hp.boundTightnessFigure(surplusRows.map(byGraph)) },
    { name: FIGURE_NAMES[4], caption: "Degree and degeneracy distributions per family.", figure: hp.degreeDistributionFigure(surplusRows, { familyOrder: order }) },
  ];

  // 4. The report page: every figure, the fit table, provenance.
  mkdirSync(out, { recursive: true });
  const commit = spawnSync("git", ["rev-parse", "HEAD"], { cwd: ROOT, encoding: "utf8", stdio: ["ignore", "pipe", "ignore"] });
  const loadedPlan = hp.loadPlan(plan);
  const tableRows = fitList.flatMap((f) => f.tableRows()).map((t) => ({
    family: t.family, term: t.term, estimate: t.estimate, "95 % from": t.lower, "95 % to": t.upper,
    "bootstrap from": t.bootstrapLower, "bootstrap to": t.bootstrapUpper, conjectured: t.conjectured, "p (vs conjectured)": t.pValue, rows: t.rows, "R²": t.rSquared,
  }));
  const skipped = fits.skipped.map((s) => ({ family: s.family, rows: s.rows, reason: s.reason }));
  const report = hp.reportHtml({
    title: "halfplus demo: the Max-Cut surplus of triangle-free and C4-free families",
    intro: "How far does the largest cut rise above half the edges, and does that surplus grow like m/√d? Each graph's max cut is bracketed between a cut found and a certified upper bound; one power law is fitted per family.",
    figures: figures.map(({ name, caption, figure }) => ({ name, caption, figure })),
    tables: [
      { title: "Fits per family: surplus ≈ C·(m/√d)^a, d = degeneracy", rows: tableRows },
      ...(skipped.length > 0 ? [{ title: "Families not fitted", rows: skipped }] : []),
    ],
    provenance: {
      plan: relative(process.cwd(), plan) || plan,
      "plan name": loadedPlan.name,
      graphs: loadedPlan.total,
      store,
      "rows in store": fitRows.length,
      "bootstrap seed": bootstrapSeed,
      "conjectured constant c": conjecture.predict(1).estimate,
      "halfplus version": hp.halfplusVersion(),
      "git commit": commit.status === 0 ? commit.stdout.trim() : "not a git checkout",
      node: process.version,
      platform: `${process.platform} ${process.arch}`,
      command: "npm run demo",
    },
  });
  const reportPath = join(out, "report.html");
  writeFileSync(reportPath, report);
  const rowsCsv = join(out, "rows.csv");
  writeFileSync(rowsCsv, csv);

  // 5. Figure files for a paper: pgfplots and CSV always, SVG when Chromium is there.
  const chromium = options.images !== "off" && existsSync(hp.CHROMIUM_PATH);
  const formats = chromium ? ["svg", "tex", "csv"] : ["tex", "csv"];
  const figureDir = join(out, "figures");
  const written = await hp.exportFigures({ figures: figures.map(({ name, figure }) => ({ name, figure })), dir: figureDir, formats });
  if (!chromium && options.images !== "off") say(`demo: no SVG figures: ${hp.chromiumMissingMessage(hp.CHROMIUM_PATH)}`);

  stdout.write(`\nwritten:\n  ${reportPath}   (open it in a browser; works offline)\n  ${rowsCsv}\n  ${figureDir}/ (${formats.join(", ")}: ${figures.length} figures)\n`);
  return { summary, store, report: reportPath, rowsCsv, figureFiles: written, fits, figures, formats };
}

function parseArgs(argv) {
  const o = {};
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const value = () => {
      const v = argv[++i];
      if (v === undefined) throw new Error(`demo: ${a} needs a value`);
      return v;
    };
    if (a === "--plan") o.plan = resolve(value());
    else if (a === "--out") o.out = value();
    else if (a === "--workers") {
      const v = value();
      if (!/^\d+$/.test(v)) throw new Error(`demo: --workers: a whole number (got ${JSON.stringify(v)})`);
      o.workers = Number(v);
    } else if (a === "--no-images") o.images = "off";
    else throw new Error(`demo: unknown option ${JSON.stringify(a)} (options: --plan FILE, --out DIR, --workers N, --no-images)`);
  }
  return o;
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  let options;
  try {
    options = parseArgs(process.argv.slice(2));
  } catch (e) {
    process.stderr.write(`${e.message}\n`);
    process.exit(2);
  }
  const started = Date.now();
  runDemo(options).then(
    () => process.stderr.write(`demo: done in ${((Date.now() - started) / 1000).toFixed(1)} s\n`),
    (e) => {
      // Bad input (a plan error, say) is one line; anything else keeps its stack for a bug report.
      process.stderr.write(`${e?.name === "InputError" ? e.message : (e?.stack ?? String(e))}\n`);
      process.exit(e?.name === "InputError" || String(e?.message).startsWith("demo:") ? 2 : 1);
    },
  );
}
