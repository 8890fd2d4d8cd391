// The pgfplots export typeset for real: each figure as a complete document compiles with
// pdflatex (Debian's texlive-latex-base + texlive-pictures) to one page whose text includes the
// legend, with the band filled or dashed, and an empty figure compiles too.
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, expect, it } from "vitest";
import { pgfplotsDocument, type PgfplotsOptions } from "../src/plot/export/pgfplots.js";
import {
  boundTightnessFigure,
  degreeDistributionFigure,
  exponentFigure,
  normalisedRatioFigure,
  surplusScalingFigure,
} from "../src/plot/figures/index.js";
import type { PlotFigure } from "../src/plot/types.js";
import { sampleExponents, sampleFit, sampleRows } from "./helpers/plot-data.js";
import { check, describeNeeds, tool } from "./helpers/requirements.js";

const pgfplotsInstalled = check("pgfplots.sty (Debian's texlive-pictures)", () => spawnSync("kpsewhich", ["pgfplots.sty"]).status === 0);

describeNeeds([tool("pdflatex"), pgfplotsInstalled, tool("pdfinfo"), tool("pdftotext")], "pgfplots export compiled by pdflatex", () => {
  const work = mkdtempSync(join(tmpdir(), "halfplus-pgfplots-"));
  afterAll(() => rmSync(work, { recursive: true, force: true }));

  function compile(name: string, figure: PlotFigure, options?: PgfplotsOptions): { pages: string; text: string } {
    writeFileSync(join(work, `${name}.tex`), pgfplotsDocument(figure, options));
    const r = spawnSync("pdflatex", ["-interaction=nonstopmode", "-halt-on-error", "-no-shell-escape", `${name}.tex`], { cwd: work, encoding: "utf8" });
    const firstError = r.stdout.split("\n").find((l) => l.startsWith("!")) ?? "";
    expect(r.status, `${name}: ${firstError}`).toBe(0);
    expect(existsSync(join(work, `${name}.pdf`))).toBe(true);
    const pages = /^Pages:\s+(\d+)$/m.exec(spawnSync("pdfinfo", [join(work, `${name}.pdf`)], { encoding: "utf8" }).stdout)?.[1] ?? "";
    const text = spawnSync("pdftotext", [join(work, `${name}.pdf`), "-"], { encoding: "utf8" }).stdout;
    return { pages, text };
  }

  const rows = sampleRows();
  const cases: [string, () => PlotFigure, PgfplotsOptions?][] = [
    ["surplus", () => surplusScalingFigure(rows, { fits: sampleFit(), conjecture: { constant: 0.3, lower: 0.28, upper: 0.32 } })],
    ["surplus-dashed", () => surplusScalingFigure(rows, { fits: sampleFit() }), { band: "dashed", legend: "inside" }],
    ["ratio", () => normalisedRatioFigure(rows, { conjecture: { constant: 0.3 } })],
    ["exponents", () => exponentFigure(sampleExponents())],
    ["bounds", () => boundTightnessFigure(rows.slice(0, 10))],
    ["degrees", () => degreeDistributionFigure(rows, { family: ["kneser", "gnp"] })],
  ];
  for (const [name, build, options] of cases)
    it(`${name}: compiles to one page with the legend typeset`, () => {
      const { pages, text } = compile(name, build(), options);
      expect(pages).toBe("1");
      expect(text).toContain(name === "bounds" ? "Edwards bound" : "kneser");
    });

  it("an empty figure compiles", () => {
    const { pages, text } = compile("empty", surplusScalingFigure([]));
    expect(pages).toBe("1");
    expect(text).toContain("No graphs to plot");
  });

  it("a family name with TeX's special characters compiles", () => {
    const odd = rows.map((r) => ({ ...r, family: r.family === "gnp" ? "g_n&p #2 {50%} ~x^y \\z" : r.family }));
    const { text } = compile("special", surplusScalingFigure(odd, { fits: sampleFit() }));
    // OT1 fonts draw \_ as a rule, which pdftotext reads as a space; the rest comes through as typed.
    expect(text).toContain("n&p #2 {50%}");
  });
});
