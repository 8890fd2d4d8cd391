// `halfplus bounds <source>`: for each graph, the bracket's surplus interval and every surplus
// argument beside it: its surplus, its share of the bracket's lower end, and the step of its proof
// that gives most away. With --json, one halfplus/bounds-account record per graph.
import { boundsAccount, type AccountEvaluator, type AccountRow, type AccountStepName, type BoundsAccountRecord } from "../../cut/account/bounds-account.js";
import { InputError } from "../../errors.js";
import { DEFAULT_BRACKET_SECONDS } from "../../cut/bracket/bracket.js";
import { type BracketEffort } from "../../cut/bracket/record.js";
import { openSource } from "../../sources/index.js";
import type { CommandSpec } from "../args.js";
import { boundsHelp } from "./help/bounds.js";
import { formatNumber as num, formatRows, formatTable } from "../format.js";
import { writeLine } from "../output.js";
import { sourceOptionsFrom } from "./source-options.js";
import { progressWriter, words } from "./cut.js";
import { progressWanted, writeStage } from "./solver-options.js";

/** Each argument in a few words (records keep the ids). */
const EVALUATOR_WORDS: Readonly<Record<AccountEvaluator, string>> = {
  "edwards-edges": "Edwards, from m",
  "edwards-vertices": "Edwards, from n and components",
  "triangle-free": "triangle-free, (1/2π)Σ√d_i",
  "vector-method": "vector method, V_i = N(i), ε_i = 1/√d_i",
  "vector-optimised": "vector method, best (V, ε) found",
  "few-triangles": "few triangles, one ε for all",
  "decomposition-cut": "decomposition, its cut",
  "decomposition-guarantee": "decomposition, its guarantee",
};

const STEP_WORDS: Readonly<Record<AccountStepName, string>> = {
  "reads-m-only": "reads only m",
  "reads-n-and-components-only": "reads only n and the components",
  "hyperplane-vs-best-cut": "a random hyperplane, not the best cut",
  "arcsine-linearised": "arcsine replaced by lines",
  "norms-bounded": "norms replaced by 1 and 2",
  "best-cut-vs-decomposition": "decomposition cut below the best cut",
  "remainder-above-guarantee": "remainder cut above its guarantee",
  "pieces-above-guarantee": "pieces cut above their guarantees",
  "between-parts-counted-as-half": "edges between parts counted half cut",
};

function evaluatorLine(r: AccountRow): string[] {
  if (!r.applies || r.surplus === null) return [EVALUATOR_WORDS[r.name], "·", "·", `does not apply: ${r.reason}`];
  const worst = r.largestLoss;
  return [
    EVALUATOR_WORDS[r.name],
    num(r.surplus),
    r.fractionOfLower === null ? "·" : num(r.fractionOfLower),
    worst === null ? "" : `${STEP_WORDS[worst.step]} (${num(worst.loss)})`,
  ];
}

/** Our own layout: the bracket, the table of arguments, then the vector choices and the decomposition in brief. */
export function formatAccount(label: string, a: BoundsAccountRecord): string {
  const b = a.bracket;
  const head: [string, string][] = [];
  head.push(
    b.exact
      ? ["surplus", `${num(b.surplusLower)}  (exact; max cut ${num(b.lower)}, W/2 = ${num(a.totalWeight / 2)})`]
      : ["surplus in", `[${num(b.surplusLower)}, ${num(b.surplusUpper)}]  (max cut in [${num(b.lower)}, ${num(b.upper)}], W/2 = ${num(a.totalWeight / 2)})`],
  );
  head.push(["graph", `n = ${a.n}, m = ${a.m}`]);
  head.push(["best cut by", `${words(b.lowerMethod)}; effort ${b.effort}, ${num(b.seconds)} s, solver seed ${b.solverSeed}`]);
  if (b.upperKind !== "proven") head.push(["caution", `the upper end is ${b.upperKind === "estimate" ? "an estimate" : "probable"}, not a proof`]);
  const out = [label, ...formatRows(head), ""];
  out.push(...formatTable([["argument", "surplus", "÷ lower end", "gives most away at"], ...a.evaluators.map(evaluatorLine)]));
  const v = a.vector;
  if (v !== null) {
    out.push("");
    out.push(
      ...formatTable([
        [`vector rounding, ${v.default.trials} trials`, "guarantee", "expected", "mean", "best"],
        ["V_i = N(i), ε_i = 1/√d_i", num(v.default.guarantee), num(v.default.expectedSurplus), num(v.default.meanSurplus), num(v.default.bestSurplus)],
        ["best (V, ε) found", num(v.optimised.guarantee), num(v.optimised.expectedSurplus), num(v.optimised.meanSurplus), num(v.optimised.bestSurplus)],
        [`one ε = ${num(v.uniform.eps)} (${v.uniform.regime})`, num(v.uniform.guarantee), num(v.uniform.expectedSurplus), "·", "·"],
      ]),
    );
    const o = v.optimised;
    out.push(
      `  best (V, ε): from the ${o.start} choice, ${o.sweeps} sweep${o.sweeps === 1 ? "" : "s"} (${o.status}); ${o.switchedOff} vertices switched off (ε_i = 0), ${o.droppedMembers} neighbours left out of their V_i${o.optimiseSets ? "" : " (sets fixed to N(i))"}`,
    );
    out.push(`  few triangles: T = ${v.uniform.triangles}, Δ = ${v.uniform.maxDegree}`);
  }
  const d = a.decomposition;
  if (d !== null) {
    const t = d.thresholds;
    const top = d.stages.find((s) => s.kind === "remainder" && s.within === null);
    const h = d.pattern === null ? "H unknown" : `H = ${d.pattern}${d.patternFrom === "clique-number" ? " (from the clique number)" : ""}`;
    const levels = Math.max(0, ...d.pieces.map((p) => p.level));
    out.push(
      `  decomposition: ${h}; ${d.pieces.length} piece${d.pieces.length === 1 ? "" : "s"} set aside${levels > 1 ? ` over ${levels} levels` : ""}, remainder ${top?.n ?? 0} vertices / ${top?.m ?? 0} edges`,
      `    set aside while T > ${num(t.triangleFactor)}·m·√Δ; pieces decomposed again up to level ${t.maxDepth}, cut exactly up to ${t.exactVertices} vertices`,
    );
    if (!d.reached) out.push("  caution: a rounded stage did not reach its guarantee; raise --max-trials");
  }
  for (const n of a.notes) out.push(`  note: ${n}`);
  return out.join("\n");
}

export const boundsCommand: CommandSpec = {
  ...boundsHelp,
  async run(args, io) {
    const o = args.options;
    const json = o["json"] === true;
    const wantProgress = progressWanted(args, io.stderr);
    const decomposition = {
      pattern: o["pattern"] as string | undefined,
      triangleFactor: o["triangle-factor"] as number | undefined,
      maxDepth: o["max-depth"] as number | undefined,
      exactVertices: o["exact-vertices"] as number,
      maxTrials: o["max-trials"] as number,
    };
    const seconds = o["seconds"] as number | undefined;
    const work = o["work"] as number | undefined;
    if (seconds !== undefined && work !== undefined) throw new InputError("--seconds and --work: give one budget, not both");
    let first = true;
    for await (const item of openSource(args.positionals[0], sourceOptionsFrom(args, io.stdin))) {
      const progress = wantProgress ? progressWriter(io.stderr, item.label) : null;
      const record = boundsAccount(item.graph, {
        ...(work !== undefined ? { work } : { seconds: seconds ?? DEFAULT_BRACKET_SECONDS }),
        effort: o["effort"] as BracketEffort,
        solverSeed: o["solver-seed"] as number,
        trials: o["trials"] as number,
        optimiseSets: o["fixed-sets"] !== true,
        decomposition,
        source: item.source,
        notes: item.notes,
        onProgress: progress?.update,
        onStage: progress === null ? undefined : (text) => writeStage(io.stderr, item.label, text),
      });
      progress?.done();
      if (json) await writeLine(io.stdout, JSON.stringify(record));
      else await writeLine(io.stdout, (first ? "" : "\n") + formatAccount(item.label, record));
      first = false;
    }
    return 0;
  },
};
