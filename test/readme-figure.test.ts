// The README's picture (docs/figures/surplus-scaling.svg) is what `npm run figure:readme` makes:
// the script is run into a temporary folder; its CSV (the plotted data) must equal the committed
// file byte for byte and its SVG must hold the same marks (exact brackets and a seeded bootstrap
// give the same data). After a change to the figures run `npm run figure:readme` and
// commit the result. xmllint (libxml2-utils) checks the SVG is well-formed XML.
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, expect } from "vitest";
import { ROOT, ensureBuilt } from "./helpers/cli.js";
import { describeNeeds, itNeeds, tool } from "./helpers/requirements.js";

const COMMITTED = join(ROOT, "docs", "figures");

describeNeeds([tool("chromium")], "the README figure", () => {
  const work = mkdtempSync(join(tmpdir(), "halfplus-readme-figure-"));
  afterAll(() => rmSync(work, { recursive: true, force: true }));

  itNeeds([tool("xmllint")], "npm run figure:readme makes exactly the committed SVG and CSV, and the SVG is well-formed with both axis titles", async () => {
    ensureBuilt();
    const { writeReadmeFigure, README_FAMILIES } = (await import(join(ROOT, "scripts", "readme-figure.mjs"))) as {
      writeReadmeFigure: (out: string) => Promise<string[]>;
      README_FAMILIES: { specs: string[] }[];
    };
    const paths = await writeReadmeFigure(work);
    expect(paths.map((p) => p.slice(work.length + 1))).toEqual(["surplus-scaling.svg", "surplus-scaling.csv"]);
    // The plotted data must match to the byte; the SVG's drawing may differ between Chromium versions
    // (font metrics move labels by fractions of a pixel), so it must hold the same marks instead.
    const csv = readFileSync(join(work, "surplus-scaling.csv"), "utf8");
    expect(csv === readFileSync(join(COMMITTED, "surplus-scaling.csv"), "utf8"), "docs/figures/surplus-scaling.csv differs from what the script makes: run npm run figure:readme and commit it").toBe(true);
    const marks = (svg: string): Record<string, number> => {
      const out: Record<string, number> = {};
      for (const c of ["point plotly-customdata", "errorbar", "js-line", "traces", "xtitle", "ytitle"]) out[c] = svg.split(`class="${c}"`).length - 1;
      return out;
    };
    const made = marks(readFileSync(join(work, "surplus-scaling.svg"), "utf8"));
    expect(made, "docs/figures/surplus-scaling.svg has other marks than the script makes: run npm run figure:readme and commit it").toEqual(marks(readFileSync(join(COMMITTED, "surplus-scaling.svg"), "utf8")));
    expect(made["point plotly-customdata"]).toBe(README_FAMILIES.reduce((s, f) => s + f.specs.length, 0));
    const lint = spawnSync("xmllint", ["--noout", join(COMMITTED, "surplus-scaling.svg")], { encoding: "utf8" });
    expect(lint.status, lint.stderr).toBe(0);
    const svg = readFileSync(join(COMMITTED, "surplus-scaling.svg"), "utf8");
    expect(svg).toMatch(/class="xtitle"[^>]*>[^<]*m \/ √d/);
    expect(svg).toMatch(/class="ytitle"[^>]*>[^<]*surplus/);
    // One plotted point per graph, with the graph's spec as its label (the CSV is the plotted data).
    const points = readFileSync(join(COMMITTED, "surplus-scaling.csv"), "utf8").split("\n").filter((l) => l.split(",")[1] === "points");
    expect(points).toHaveLength(README_FAMILIES.reduce((s, f) => s + f.specs.length, 0));
    // And(2) is C5: m = 5, degeneracy 2, max cut 4, so x = 5/√2 and surplus 1.5 (an odd cycle loses one edge).
    expect(points[0].split(",").slice(2)).toEqual(["andrasfai:k=2", String(5 / Math.sqrt(2)), "1.5", "1.5", "1.5"]);
  }, 300_000);
});
