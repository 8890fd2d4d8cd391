// Merging the store's other tables: the census tables (census_runs, census_cells,
// census_histogram) and the hunt frontier (hunt_frontier), beside the results that merge.ts
// unions. The rules (DEVELOPERS.md, "Merging stores"):
//
// - A census is one unit: its state row and its cells describe the first `consumed` graphs of one
//   stream, so cells are never added up across stores (two stores counting the same stream would
//   count every graph twice). A census new to the target is copied whole. The same name at the
//   same position must have the same fingerprint and the same cells: then it is kept once. At
//   different positions only two snapshots of one run (same startedAt) combine, and only when the
//   further one extends the other cell by cell; the further one is then taken whole.
// - The hunt frontier keeps the best graph per (pattern, n, objective, m) (hunt-store.ts: a row
//   replaces the stored one only when its value is strictly smaller), so a merge does the same:
//   a smaller value wins, a tie keeps the target's graph, and the report counts both. A row that
//   would enter the target (new key, or a smaller value) is verified first (verify-tables.ts:
//   H-free, n, m, hash, its bracket record, the value): a forged small value would otherwise win
//   the slot and push out a genuine graph, so a rejected row refuses the merge.
//
// Disagreements are refused (InputError, one line naming the table, the key and both stores);
// mergeInto runs everything in one transaction, so a refusal writes nothing.

import { InputError } from "../errors.js";
import type { CensusCell } from "./census/cells.js";
import type { CensusState } from "./census/census-store.js";
import type { HuntFrontierRow } from "./hunt-store.js";
import type { ResultStore } from "./store.js";
import { verifyFrontierRow } from "./verify-tables.js";

/** What merging one source's censuses found. */
export interface CensusMergeReport {
  /** Censuses in the source. */
  censuses: number;
  /** New to the target, copied whole. */
  added: number;
  /** The target already held them at the same position, cell for cell. */
  alreadyThere: number;
  /** The source's run was further along (same run, consistent cells): taken in place of the target's. */
  advanced: number;
  /** The target's run was further along and consistent with the source's: kept. */
  behind: number;
}

/** What merging one source's hunt frontier found. */
export interface FrontierMergeReport {
  /** Frontier rows in the source. */
  rows: number;
  /** New keys, copied. */
  added: number;
  /** Rows the target held identically (the time it was stored aside). */
  alreadyThere: number;
  /** Source graphs with a strictly smaller value: they replaced the target's. */
  improved: number;
  /** Source graphs no better than the target's (a larger value, or a tie): the target's were kept. */
  notBetter: number;
}

const shortHash = (h: string): string => (h.length > 16 ? `${h.slice(0, 12)}…` : h);

function refuse(src: ResultStore, target: ResultStore, table: string, key: string, what: string): never {
  throw new InputError(`${src.path}: disagrees with ${target.path}: ${table} key ${key} ${what}; nothing merged`);
}

const cellKeyText = (name: string, c: { n: number; m: number }): string => `(census ${JSON.stringify(name)}, n=${c.n}, m=${c.m})`;

/** The fields of two cells of the same stream prefix that differ, as `field (a vs b)`. */
export function cellDisagreements(a: CensusCell, b: CensusCell): string[] {
  const out: string[] = [];
  const scalar = ["graphs", "minSurplus", "attaining", "minRatio", "ratioWitness", "ratioDegeneracy", "ratioSurplus"] as const;
  for (const f of scalar) if (a[f] !== b[f]) out.push(`${f} (${String(a[f])} vs ${String(b[f])})`);
  if (JSON.stringify(a.witnesses) !== JSON.stringify(b.witnesses)) out.push(`witnesses (${a.witnesses.join(" ")} vs ${b.witnesses.join(" ")})`);
  const bars = new Set([...a.histogram.keys(), ...b.histogram.keys()]);
  for (const t of [...bars].sort((x, y) => x - y)) {
    const x = a.histogram.get(t) ?? 0;
    const y = b.histogram.get(t) ?? 0;
    if (x !== y) {
      out.push(`histogram at surplus ${t / 2} (${x} vs ${y})`);
      break;
    }
  }
  return out;
}

/**
 * Why `later` (more graphs of the same stream) cannot extend `earlier`, or null when it can: every
 * cell of `earlier` is in `later` with at least as many graphs in each histogram bar, a least
 * surplus and least ratio no larger, and where they are equal the same first witnesses (a census
 * keeps the first ones of its stream, so an earlier snapshot's witnesses begin the later list).
 */
export function extensionFailure(earlier: readonly CensusCell[], later: readonly CensusCell[]): { cell: CensusCell; why: string } | null {
  const byKey = new Map(later.map((c) => [`${c.n},${c.m}`, c]));
  for (const e of earlier) {
    const l = byKey.get(`${e.n},${e.m}`);
    if (l === undefined) return { cell: e, why: "is missing from the further run" };
    if (l.graphs < e.graphs) return { cell: e, why: `has fewer graphs in the further run (${l.graphs} vs ${e.graphs})` };
    for (const [t, count] of e.histogram) {
      const more = l.histogram.get(t) ?? 0;
      if (more < count) return { cell: e, why: `has fewer graphs at surplus ${t / 2} in the further run (${more} vs ${count})` };
    }
    if (l.minSurplus > e.minSurplus) return { cell: e, why: `has a larger least surplus in the further run (${l.minSurplus} vs ${e.minSurplus})` };
    if (l.minSurplus === e.minSurplus) {
      if (l.attaining < e.attaining) return { cell: e, why: `has fewer graphs attaining the least surplus in the further run (${l.attaining} vs ${e.attaining})` };
      if (e.witnesses.some((w, i) => l.witnesses[i] !== w)) return { cell: e, why: "has witnesses in the further run that do not begin with the earlier ones" };
    }
    if (e.minRatio !== null) {
      if (l.minRatio === null || l.minRatio > e.minRatio) return { cell: e, why: `has a larger least surplus·√d/m in the further run (${l.minRatio} vs ${e.minRatio})` };
      if (l.minRatio === e.minRatio && l.ratioWitness !== e.ratioWitness) return { cell: e, why: `keeps another first graph at the least surplus·√d/m (${l.ratioWitness} vs ${e.ratioWitness})` };
    }
  }
  return null;
}

/** Merge the censuses of `src` into `target` (inside the caller's transaction). */
export function mergeCensuses(target: ResultStore, src: ResultStore): CensusMergeReport {
  const out: CensusMergeReport = { censuses: 0, added: 0, alreadyThere: 0, advanced: 0, behind: 0 };
  const theirs = src.census();
  const ours = target.census();
  for (const s of theirs.list()) {
    out.censuses++;
    const key = JSON.stringify(s.name);
    const sCells = theirs.cells(s.name);
    const t = ours.state(s.name);
    if (t === undefined) {
      ours.replace(s, sCells);
      out.added++;
      continue;
    }
    if (t.witnessLimit !== s.witnessLimit) refuse(src, target, "census_runs", key, `differs in witnessLimit (${t.witnessLimit} vs ${s.witnessLimit})`);
    const tCells = ours.cells(s.name);
    if (t.consumed === s.consumed) {
      if (t.fingerprint !== s.fingerprint) refuse(src, target, "census_runs", key, `differs in fingerprint at ${s.consumed} graphs (${shortHash(t.fingerprint)} vs ${shortHash(s.fingerprint)}): different streams`);
      const sByKey = new Map(sCells.map((c) => [`${c.n},${c.m}`, c]));
      const tKeys = new Set(tCells.map((c) => `${c.n},${c.m}`));
      for (const c of tCells) {
        const other = sByKey.get(`${c.n},${c.m}`);
        if (other === undefined) refuse(src, target, "census_cells", cellKeyText(s.name, c), `is missing from ${src.path}`);
        const diff = cellDisagreements(c, other);
        if (diff.length > 0) refuse(src, target, "census_cells", cellKeyText(s.name, c), `differs in ${diff.join(", ")}`);
      }
      const extra = sCells.find((c) => !tKeys.has(`${c.n},${c.m}`));
      if (extra !== undefined) refuse(src, target, "census_cells", cellKeyText(s.name, extra), `is missing from ${target.path}`);
      // Same prefix, same cells: kept once. A run that saw the end of the stream says so; keep that.
      if (t.finishedAt === null && s.finishedAt !== null) ours.replace({ ...t, finishedAt: s.finishedAt }, tCells);
      out.alreadyThere++;
      continue;
    }
    // Different positions: the fingerprints hash different prefixes, so only the run's own identity
    // (its start time, kept across resumptions) and the cells can show the two belong together.
    if (t.startedAt !== s.startedAt) {
      refuse(src, target, "census_runs", key, `is at ${t.consumed} graphs in ${target.path} and ${s.consumed} in ${src.path}, from runs started at different times (${t.startedAt} vs ${s.startedAt}): nothing shows they count the same stream (finish either run on its stream, or rename one)`);
    }
    const sourceAhead = s.consumed > t.consumed;
    const fail = sourceAhead ? extensionFailure(tCells, sCells) : extensionFailure(sCells, tCells);
    if (fail !== null) {
      refuse(src, target, "census_cells", cellKeyText(s.name, fail.cell), `${fail.why} (${Math.min(s.consumed, t.consumed)} vs ${Math.max(s.consumed, t.consumed)} graphs counted)`);
    }
    if (sourceAhead) {
      ours.replace(s, sCells);
      out.advanced++;
    } else out.behind++;
  }
  return out;
}

const FRONTIER_KEY = (r: Pick<HuntFrontierRow, "pattern" | "n" | "objective" | "m">): string => JSON.stringify([r.pattern, r.n, r.objective, r.m]);

/** Rows equal in everything but the time they were stored. */
function sameFrontierRow(a: HuntFrontierRow, b: HuntFrontierRow): boolean {
  return (Object.keys(a) as (keyof HuntFrontierRow)[]).every((k) => k === "foundAt" || a[k] === b[k]);
}

/** Merge the hunt frontier of `src` into `target`: per key the smaller value wins, a tie keeps the target's. */
export function mergeFrontier(target: ResultStore, src: ResultStore): FrontierMergeReport {
  const out: FrontierMergeReport = { rows: 0, added: 0, alreadyThere: 0, improved: 0, notBetter: 0 };
  const rows = src.huntEntries();
  if (rows.length === 0) return out;
  const held = new Map(target.huntEntries().map((r) => [FRONTIER_KEY(r), r]));
  for (const r of rows) {
    out.rows++;
    const have = held.get(FRONTIER_KEY(r));
    if (have !== undefined && sameFrontierRow(have, r)) out.alreadyThere++;
    else if (have !== undefined && !(r.value < have.value)) out.notBetter++;
    else {
      const v = verifyFrontierRow(r);
      if (v.verdict === "rejected") {
        const failed = v.checks.filter((c) => !c.ok).map((c) => `${c.name}: ${c.message}`);
        throw new InputError(`${src.path}: hunt_frontier key (${r.pattern}, n=${r.n}, ${r.objective}, m=${r.m}) fails verification (${failed.join("; ")}); nothing merged`);
      }
      // putHuntEntry applies the same rule (new, or strictly smaller): it must keep the row.
      if (!target.putHuntEntry(r)) throw new Error(`merge: hunt_frontier key ${FRONTIER_KEY(r)} was not stored`);
      held.set(FRONTIER_KEY(r), r);
      if (have === undefined) out.added++;
      else out.improved++;
    }
  }
  return out;
}
