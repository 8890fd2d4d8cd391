// Breakout search on two classic benchmark graphs from ../shared/reference/gset, compared with
// the best cuts published for them (best-known.csv); skipped when the reference folder is absent.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { expect, it } from "vitest";
import { parseGset } from "../src/graph/formats/gset.js";
import { cutValue } from "../src/graph/cut-value.js";
import { breakoutSearch } from "../src/cut/heuristic/breakout.js";
import { describeNeeds, file, REFERENCE } from "./helpers/requirements.js";

const GSET = join(REFERENCE, "gset");

function bestKnown(name: string): number {
  const row = readFileSync(join(GSET, "best-known.csv"), "utf8").split("\n").find((l) => l.startsWith(`${name},`));
  if (row === undefined) throw new Error(`no ${name} in best-known.csv`);
  return Number(row.split(",")[1]);
}

describeNeeds([file(join(GSET, "best-known.csv"), "../shared/reference/gset/best-known.csv")], "breakout search on benchmark graphs (best-known.csv)", () => {
  it("G48 (toroidal grid, bipartite): cuts all 6000 edges and proves it with upperBound = m", () => {
    const g = parseGset(readFileSync(join(GSET, "G48.txt")), { file: "G48.txt" }).graph;
    // best-known.csv: 6000; the graph is bipartite (README), so the max cut is m.
    expect(bestKnown("G48")).toBe(g.m);
    const r = breakoutSearch(g, { iterations: 200000, solverSeed: 1, upperBound: g.m });
    expect(r.value).toBe(cutValue(g, r.partition));
    expect(r.value).toBe(6000);
    expect(r.status).toBe("optimal");
  });

  it("G11 (toroidal, ±1 weights): within 0.5% of the best known 564 after 60000 rounds", () => {
    const g = parseGset(readFileSync(join(GSET, "G11.txt")), { file: "G11.txt" }).graph;
    expect(g.weighted).toBe(true);
    const ref = bestKnown("G11");
    const r = breakoutSearch(g, { iterations: 60000, solverSeed: 1 });
    expect(r.value).toBe(cutValue(g, r.partition));
    expect(r.value).toBeGreaterThanOrEqual(Math.ceil(0.995 * ref));
  });
});
