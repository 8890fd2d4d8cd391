// halfplus/notebook's helpers as data: the mime bundles they build (tables, graph summaries,
// bracket cards, progress frames, figures with their static pictures), the throttled in-place
// progress, and the way output reaches a tslab kernel (tried against the pinned tslab package's
// own jupyter module, with its display writer captured).
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { afterEach, describe, expect, it, vi } from "vitest";
import { ensureBuilt } from "./helpers/cli.js";
import { itNeeds, tool } from "./helpers/requirements.js";
import { sampleFit, sampleRows } from "./helpers/plot-data.js";

ensureBuilt();
const nb = await import("../kernel-helpers/index.js");
const hp = await import("halfplus");

describe("table", () => {
  it("columns in first-seen order, HTML escaped, numbers right-aligned in the text form", () => {
    const b = nb.tableBundle([{ name: "<K3>", m: 3 }, { name: "C5", m: 5, girth: 5 }], { caption: "two graphs" });
    expect(b["text/html"]).toContain("&lt;K3&gt;");
    expect(b["text/html"]).not.toContain("<K3>");
    const heads = [...b["text/html"]!.matchAll(/<th[^>]*>([^<]*)<\/th>/g)].map((m) => m[1]);
    expect(heads).toEqual(["name", "m", "girth"]);
    // Common practice, no source: text tables align numbers on the right.
    expect(b["text/plain"].split("\n")).toEqual(["two graphs", "name  m  girth", "----  -  -----", "<K3>  3", "C5    5      5"]);
  });

  it("takes interface-typed rows and summarises rows past maxRows", () => {
    const rows = Array.from({ length: 5 }, (_, i) => ({ i, list: [i, i + 1], ok: i % 2 === 0, nested: { a: i } }));
    const b = nb.tableBundle(rows, { maxRows: 2 });
    expect(b["text/plain"]).toContain("… 3 more rows not shown");
    expect(b["text/plain"]).toContain("0, 1");
    expect(b["text/plain"]).toContain('{"a":0}');
    expect(b["text/plain"]).toContain("yes");
  });

  it("bad input is one line naming the row or option", () => {
    expect(() => nb.tableBundle([{ a: 1 }, 3 as unknown as object])).toThrow(/^table: row 2 should be an object/);
    expect(() => nb.tableBundle([{ a: 1 }], { maxRows: 0 })).toThrow(/invalid `maxRows`/);
  });
});

describe("describe", () => {
  it("the Petersen graph: 10 vertices, 15 edges, 3-regular, girth 5, free of K3 and C4, contains C5", () => {
    // Holton & Sheehan, The Petersen Graph (Cambridge 1993), ch. 1: cubic, 10 vertices, 15 edges, girth 5.
    const b = nb.describeBundle(hp.family("petersen"), { label: "petersen" });
    const rows = Object.fromEntries(b["text/plain"].split("\n").slice(1).map((l) => [l.slice(0, 22).trim(), l.slice(22).trim()]));
    expect(rows["vertices"]).toBe("10");
    expect(rows["edges"]).toBe("15");
    expect(rows["degree min / avg / max"]).toBe("3 / 3 / 3");
    expect(rows["girth"]).toBe("5");
    expect(rows["triangles"]).toBe("0");
    expect(rows["4-cycles"]).toBe("0");
    expect(rows["free of"]).toBe("K3, K4, C4");
    expect(rows["contains"]).toBe("C5");
    expect(b["text/html"]).toContain("petersen");
  });
});

describe("bracketCard", () => {
  it("an exact bracket of the Petersen graph: max cut 12, surplus 4.5", () => {
    // The Petersen graph's largest bipartite subgraph has 12 of its 15 edges (from memory; the
    // bracket proves it here by exhaustive search, and test/cut-exact.test.ts checks exact search against cbc).
    const r = hp.bracket(hp.family("petersen"), { seconds: 2, solverSeed: 1, effort: "auto", source: { spec: "petersen" } });
    const b = nb.bracketCardBundle(r);
    expect(b["text/plain"]).toContain("petersen (n = 10, m = 15): exact: both ends meet");
    expect(b["text/plain"]).toContain("12 ≤ max cut ≤ 12");
    expect(b["text/plain"]).toContain("surplus ∈ [4.5, 4.5]");
    expect(b["text/html"]).toContain("exact: both ends meet");
  });

  it("reads how sure the upper end is from upperKind (a record without one is an estimate); records written by cut show as written", () => {
    // Record plumbing, common practice, no source.
    const base = { lower: 10, upper: 12, surplusLower: 1, surplusUpper: 3 };
    expect(nb.bracketStatus({ ...base, upperKind: "proven" })).toBe("proven");
    expect(nb.bracketStatus({ ...base, upperKind: "estimate" })).toBe("estimate");
    expect(nb.bracketStatus({ ...base, upperKind: "probable" })).toBe("probable");
    expect(nb.bracketStatus(base)).toBe("estimate");
    // Old field names are not read: a pre-vocabulary record claiming `upperProven` is not taken as proven.
    expect(nb.bracketStatus({ ...base, upperProven: true } as never)).toBe("estimate");
    expect(nb.bracketStatus({ ...base, exact: true, upperKind: "estimate" })).toBe("exact");
    const interrupted = nb.bracketCardBundle({ ...base, upperKind: "proven", interrupted: true, effort: "auto", solverSeed: 0 });
    expect(interrupted["text/plain"]).toContain("interrupted, effort auto, solver seed 0");
    const card = nb.bracketCardBundle({ ...base, upperKind: "estimate", solverSeed: 4, effort: "quick", source: { path: "g.g6", position: 2 } });
    expect(card["text/plain"]).toContain("g.g6#2: upper end estimated");
    expect(card["text/plain"]).toContain("effort quick, solver seed 4");
  });
});

describe("progress outside a kernel", () => {
  afterEach(() => vi.restoreAllMocks());

  it("frames are throttled to one a second on stderr; the final frame always shows; rate and time left come from the clock", () => {
    let t = 0;
    const lines: string[] = [];
    vi.spyOn(process.stderr, "write").mockImplementation((s: string | Uint8Array) => (lines.push(String(s)), true));
    const p = nb.progressDisplay({ title: "sweep", now: () => t });
    p({ done: 0, total: 4 });
    t = 400;
    p({ done: 1, total: 4 });
    t = 2000;
    p({ done: 2, total: 4, family: "kneser", current: "kneser:n=9,k=4" });
    t = 2100;
    p({ done: 4, total: 4 });
    expect(p.frames).toBe(3);
    expect(lines[1]).toContain("2 / 4 graphs · 1.00 graphs/s · about 2 s left · family kneser · now kneser:n=9,k=4");
    expect(lines[2]).toMatch(/^sweep: \[#{30}\] 4 \/ 4 graphs/);
  });
});

describe("progress of a real sweep", () => {
  afterEach(() => vi.restoreAllMocks());

  it("runSweep's own progress records plug in as they are (types and fields: elapsed, eta, current, lowest, finished)", async () => {
    // Type-level: the callback is accepted where runSweep wants its onProgress (tslab type-checks cells).
    const onProgress: NonNullable<import("../src/experiment/sweep.js").SweepOptions["onProgress"]> = nb.progressDisplay({ title: "tiny" });
    const lines: string[] = [];
    vi.spyOn(process.stderr, "write").mockImplementation((s: string | Uint8Array) => (lines.push(String(s)), true));
    const dir = mkdtempSync(join(tmpdir(), "halfplus-nb-progress-"));
    try {
      const frames: import("../src/experiment/progress.js").SweepProgress[] = [];
      // The Petersen graph: max cut 12 of 15 edges (surplus 4.5), degeneracy 3 (3-regular) — from memory.
      await hp.runSweep({ families: [{ specs: ["petersen"] }], bracket: { effort: "exact", seconds: 60 }, evaluators: [] }, {
        store: join(dir, "s.db"), workers: 0, onProgress: (p) => (frames.push(p), onProgress(p)),
      });
      const last = frames[frames.length - 1];
      expect(last.finished).toBe(true);
      expect(last.lowest?.graph).toBe("petersen");
      const final = lines[lines.length - 1];
      expect(final).toMatch(/^tiny: \[#{30}\] 1 \/ 1 graphs/);
      // 4.5 / (15/√3) = 0.5196…
      expect(final).toContain(`lowest surplus/(m/√d) ${(4.5 / (15 / Math.sqrt(3))).toPrecision(4)}`);
      expect(final).toContain("lowest at petersen");
      expect(final).not.toContain("[object Object]");
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it("a sweep frame in the middle: its { family, n } as text, its eta and elapsed used, not the display's clock", () => {
    const b = nb.progressBundle({ done: 3, total: 10, rate: 2, eta: 3.5, elapsed: 1.5, current: { family: "kneser", n: 56 }, lowest: null, finished: false });
    expect(b["text/plain"]).toContain("3 / 10 graphs · 2.00 graphs/s · about 4 s left · family kneser · now kneser n=56");
    const done = nb.progressBundle({ done: 10, total: 10, rate: null, eta: 0, elapsed: 75, current: null, lowest: null, finished: true });
    expect(done["text/plain"]).toContain("10 / 10 graphs · took 1 min 15 s");
  });
});

describe("output through a tslab kernel", () => {
  // The pinned tslab package's own modules, with the display writer its kernel installs per cell
  // replaced by a recorder: what halfplus/notebook sends is what tslab would publish.
  const req = createRequire(join(process.cwd(), "package.json"));
  const tslabPublic = req("tslab") as object;
  const jupyter = req(join(dirname(req.resolve("tslab")), "jupyter.js")) as { lastWriteDisplayData: unknown };
  const sent: { content: { data: Record<string, string>; transient: { display_id?: string } }; update: boolean }[] = [];

  afterEach(() => {
    delete (globalThis as { __tslab__?: unknown }).__tslab__;
    jupyter.lastWriteDisplayData = null;
    sent.length = 0;
  });

  function attach() {
    (globalThis as { __tslab__?: unknown }).__tslab__ = { require: (id: string) => (id === "tslab" ? tslabPublic : req(id)) };
    jupyter.lastWriteDisplayData = (content: (typeof sent)[number]["content"], update: boolean) => sent.push({ content, update });
  }

  it("a table goes out as one display_data with text/html and text/plain", () => {
    attach();
    expect(nb.channelKind()).toBe("tslab");
    nb.table([{ a: 1 }]);
    expect(sent).toHaveLength(1);
    expect(sent[0].update).toBe(false);
    expect(Object.keys(sent[0].content.data).sort()).toEqual(["text/html", "text/plain"]);
  });

  it("progress: one display with an id, then updates to that id", () => {
    attach();
    let t = 0;
    const p = nb.progressDisplay({ now: () => t });
    for (let i = 0; i <= 10; i++) {
      t = i * 100;
      p({ done: i, total: 10 });
    }
    const ids = new Set(sent.map((s) => s.content.transient.display_id));
    expect(ids.size).toBe(1);
    expect([...ids][0]).toMatch(/^halfplus-[0-9a-f]{12}$/);
    expect(sent[0].update).toBe(false);
    expect(sent.slice(1).every((s) => s.update)).toBe(true);
    // The starting frame at t = 0, then t = 300, 600, 900 (each ≥ 250 ms after the last), then the final one at t = 1000.
    expect(sent).toHaveLength(5);
    expect(sent[4].content.data["text/plain"]).toContain("10 / 10 graphs");
  });

  it("outside a kernel the text form goes to stdout", () => {
    const out: string[] = [];
    const spy = vi.spyOn(process.stdout, "write").mockImplementation((s: string | Uint8Array) => (out.push(String(s)), true));
    try {
      expect(nb.channelKind()).toBe("text");
      nb.table([{ a: 1 }]);
    } finally {
      spy.mockRestore();
    }
    expect(out.join("")).toBe("a\n-\n1\n");
  });
});

describe("figures", () => {
  const figure = () => hp.surplusScalingFigure(sampleRows(), { fits: sampleFit() });

  it("the bundle: interactive HTML over a static picture, the same picture as SVG, and a text summary", async () => {
    const fig = figure();
    const b = await nb.figureBundle(fig, { static: "sketch" });
    expect(b["image/svg+xml"]).toMatch(/^<svg /);
    const spec = JSON.parse(/<script type="application\/json" id="[^"]+-spec">(.*?)<\/script>/s.exec(b["text/html"])![1]);
    expect(spec.data).toHaveLength(fig.data.length);
    expect(b["text/html"]).toContain('data-hp-static="sketch"');
    expect(b["text/html"]).toContain("data:image/svg+xml;base64,");
    expect(b["text/html"]).not.toContain("plotly.js v");
    expect(b["text/plain"]).toContain(`${fig.data.length} traces`);
    const embedded = await nb.figureBundle(fig, { static: "none", embedPlotly: true });
    expect(embedded["text/html"]).toContain(`plotly.js ${hp.plotlyBundle().version}, MIT licence`);
    expect(embedded["image/svg+xml"]).toBeUndefined();
  });

  it("bad options are one line naming the option", async () => {
    await expect(nb.figureBundle(figure(), { static: "png" as never })).rejects.toThrow(/^show: invalid `static`/);
    await expect(nb.figureBundle(figure(), { width: 5 })).rejects.toThrow(/^show: invalid `width`/);
    await expect(nb.figureBundle({} as never)).rejects.toThrow(/^show: `figure` should be/);
  });

  it("the sketch is deterministic and draws one marker per plotted point", () => {
    const fig = figure();
    const a = nb.sketchSvg(fig);
    expect(nb.sketchSvg(figure())).toBe(a);
    const points = fig.data.filter((t) => t.mode === "markers").reduce((s, t) => s + t.x.length, 0);
    const legendMarkers = fig.data.filter((t) => t.mode === "markers" && t.showlegend !== false).length;
    const marks = (a.match(/<(circle|rect|path) [^>]*stroke-width="1"\/>/g) ?? []).length;
    expect(marks).toBe(points + legendMarkers);
    expect(a).toContain(fig.layout.xaxis.title.text.replace(/&/g, "&amp;"));
  });

  itNeeds([tool("xmllint")], "every figure's sketch is well-formed XML (xmllint, libxml2)", () => {
    const rows = sampleRows();
    const figs = [
      hp.surplusScalingFigure(rows, { fits: sampleFit() }),
      hp.normalisedRatioFigure(rows, {}),
      hp.boundTightnessFigure(rows.slice(0, 10)),
      hp.degreeDistributionFigure(rows, { family: ["kneser", "gnp"] }),
    ];
    const dir = mkdtempSync(join(tmpdir(), "halfplus-sketch-"));
    try {
      figs.forEach((f, i) => {
        const file = join(dir, `f${i}.svg`);
        writeFileSync(file, nb.sketchSvg(f));
        const lint = spawnSync("xmllint", ["--noout", file], { encoding: "utf8" });
        expect(lint.status, lint.stderr).toBe(0);
      });
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
