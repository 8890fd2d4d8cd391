// The max-cut MILP solved by a Debian solver (cbc from coinor-cbc, else glpsol from glpk-utils): an
// oracle for exact values independent of src/cut.

import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll } from "vitest";
import type { Graph } from "../../src/graph/graph.js";

const has = (tool: string): boolean => spawnSync("which", [tool]).status === 0;

export const milpSolver = has("cbc") ? "cbc" : has("glpsol") ? "glpsol" : null;
const workDir = mkdtempSync(join(tmpdir(), "halfplus-milp-"));
afterAll(() => rmSync(workDir, { recursive: true, force: true }));

/**
 * The standard max-cut MILP in CPLEX LP format: binary x_i (side), y_ij ≤ x_i + x_j and
 * y_ij ≤ 2 − x_i − x_j for edges of positive weight; y_ij ≥ x_i − x_j and y_ij ≥ x_j − x_i for
 * negative weights; maximise Σ w_ij y_ij. x_0 = 0 removes the mirror symmetry.
 */
export function maxCutLp(g: Graph): string {
  const { us, vs, ws } = g.edgeArrays();
  const obj: string[] = [];
  const rows: string[] = [];
  for (let e = 0; e < g.m; e++) {
    const w = ws === null ? 1 : ws[e];
    const [i, j] = [us[e], vs[e]];
    obj.push(`${w >= 0 ? "+" : "-"} ${Math.abs(w)} y${e}`);
    if (w >= 0) {
      rows.push(` a${e}: y${e} - x${i} - x${j} <= 0`, ` b${e}: y${e} + x${i} + x${j} <= 2`);
    } else {
      rows.push(` c${e}: y${e} - x${i} + x${j} >= 0`, ` d${e}: y${e} + x${i} - x${j} >= 0`);
    }
  }
  const lines = ["Maximize", ` obj: ${obj.join(" ") || "0 x0"}`, "Subject To", ...rows, " fix: x0 = 0", "Bounds"];
  for (let e = 0; e < g.m; e++) lines.push(` 0 <= y${e} <= 1`);
  lines.push("Binary", " " + Array.from({ length: g.n }, (_, i) => `x${i}`).join(" "), "End", "");
  return lines.join("\n");
}

export function solveMilp(g: Graph, name: string): number {
  const lp = join(workDir, `${name}.lp`);
  const out = join(workDir, `${name}.out`);
  writeFileSync(lp, maxCutLp(g));
  if (milpSolver === "cbc") {
    execFileSync("cbc", [lp, "solve", "solu", out], { stdio: "ignore" });
    const first = readFileSync(out, "utf8").split("\n")[0];
    const m = /^Optimal - objective value\s+(-?[0-9.eE+-]+)/.exec(first);
    if (m === null) throw new Error(`cbc: unexpected solution header ${JSON.stringify(first)}`);
    return Number(m[1]);
  }
  execFileSync("glpsol", ["--lp", lp, "-o", out], { stdio: "ignore" });
  const m = /Objective:\s+obj = (-?[0-9.eE+-]+) \(MAXimum\)/.exec(readFileSync(out, "utf8"));
  if (m === null) throw new Error("glpsol: no objective in the report");
  return Number(m[1]);
}

