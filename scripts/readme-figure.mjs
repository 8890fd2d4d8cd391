#!/usr/bin/env node
// `npm run figure:readme`: the README's picture, made by our own exporter. Small triangle-free and
// C4-free graphs are bracketed by exact search (so every number is the true max cut, the same on
// any machine), one power law is fitted per family (seeded bootstrap), and the surplus figure is
// written as SVG through Debian's Chromium, with the plotted data beside it as CSV:
//
//   docs/figures/surplus-scaling.svg   docs/figures/surplus-scaling.csv
//
//   node scripts/readme-figure.mjs [--out DIR]
//
// test/readme-figure.test.ts runs it into a temporary folder and compares with the committed files.

import { existsSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), "..");

/** Graphs small enough for exact search in well under a second each. */
export const README_FAMILIES = [
  { family: "andrasfai", specs: [2, 3, 4, 5, 6, 7, 8, 9, 10].map((k) => `andrasfai:k=${k}`) },
  { family: "polarity", specs: [2, 3, 4, 5].map((q) => `polarity:q=${q}`) },
  { family: "triangle-free-process", specs: [12, 16, 20, 24, 28].flatMap((n) => [0, 1].map((s) => `hfree-process:n=${n},h=K3,seed=${s}`)) },
];

/** Builds the figure from exact brackets; returns the figure and its rows. */
export async function readmeFigure() {
  const entry = join(ROOT, "dist", "index.js");
  if (!existsSync(entry)) throw new Error("readme-figure: dist/index.js is missing: run `npm run build` first");
  const hp = await import(pathToFileURL(entry).href);
  const rows = [];
  for (const { family, specs } of README_FAMILIES) {
    for (const spec of specs) {
      const g = hp.family(spec);
      const r = hp.bracket(g, { effort: "exact", seconds: 600, solverSeed: 0, source: { spec } });
      if (!r.exact) throw new Error(`readme-figure: ${spec} did not close by exact search`);
      let maxDegree = 0;
      for (let v = 0; v < g.n; v++) maxDegree = Math.max(maxDegree, g.degree(v));
      rows.push({
        key: spec, family, n: g.n, m: g.m, degeneracy: hp.degeneracy(g).degeneracy, maxDegree, averageDegree: (2 * g.m) / g.n,
        surplusLower: r.surplusLower, surplusUpper: r.surplusUpper, exact: r.exact,
      });
    }
  }
  const fits = [...hp.fitByFamily(rows, { law: "m-over-sqrt-d", degree: "degeneracy", bootstrap: { solverSeed: 1 } }).values()];
  const conjecture = hp.fitConstant(rows, { law: "m-over-sqrt-d", degree: "degeneracy" });
  const figure = hp.surplusScalingFigure(rows, { fits, conjecture, title: "Max-Cut surplus of small triangle-free and C4-free graphs (exact)" });
  return { hp, figure, rows };
}

/** Writes the SVG and CSV into `out` (default docs/figures); returns the paths. */
export async function writeReadmeFigure(out = join(ROOT, "docs", "figures")) {
  const { hp, figure } = await readmeFigure();
  return hp.exportFigures({ figures: [{ name: "surplus-scaling", figure }], dir: out, formats: ["svg", "csv"], size: { width: 900, height: 500 } });
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const args = process.argv.slice(2);
  let out;
  if (args.length === 2 && args[0] === "--out") out = resolve(args[1]);
  else if (args.length > 0) {
    process.stderr.write("readme-figure: usage: node scripts/readme-figure.mjs [--out DIR]\n");
    process.exit(2);
  }
  writeReadmeFigure(out).then(
    (paths) => process.stderr.write(`readme-figure: wrote ${paths.join(", ")}\n`),
    (e) => {
      process.stderr.write(`${e?.name === "InputError" || String(e?.message).startsWith("readme-figure:") ? e.message : (e?.stack ?? String(e))}\n`);
      process.exit(1);
    },
  );
}
