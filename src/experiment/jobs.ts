// A checked plan's jobs in their fixed order, with their keys: family members are enumerated
// from the plan, graphs of a file are read one at a time (and hashed, since a file graph's key is
// its hash). `--shard i/N` keeps the jobs of slice i of N, slices of about equal predicted cost
// (shards.ts), the same on every machine.

import { InputError } from "../errors.js";
import { graphToParts } from "../graph/graph.js";
import { readGraphs } from "../graph/formats/read.js";
import { hashGraph, settingsKey, type BracketSettings, type JobInput } from "./job.js";
import type { Plan } from "./plan.js";
import { planSlices, type PlanSlices } from "./shards.js";

/** A deterministic slice of a plan: slice `index` of `count` (0 ≤ index < count), see shards.ts. */
export interface Shard {
  index: number;
  count: number;
}

/** `i/N` with 0 ≤ i < N, as Slurm array task ids count (`--array=0-(N-1)`). */
export function parseShard(text: string, what = "--shard"): Shard {
  const m = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(text);
  if (m === null) throw new InputError(`${what}: expected i/N, e.g. 0/4 (got ${JSON.stringify(text)})`);
  const index = Number(m[1]);
  const count = Number(m[2]);
  if (count < 1) throw new InputError(`${what}: N should be at least 1 (got ${text})`);
  if (index >= count) throw new InputError(`${what}: i counts from 0 and should be below N (got ${text}; the shards of ${count} are 0/${count} … ${count - 1}/${count})`);
  return { index, count };
}

/** The row key: graph | solverSeed | bracket settings | halfplus version. */
export function jobKey(graph: string, solverSeed: number, settings: BracketSettings, version: string): string {
  return `${graph}|solverSeed=${solverSeed}|${settingsKey(settings)}|halfplus@${version}`;
}

export interface PlannedJob {
  /** Position in the whole plan's order, from 0. */
  index: number;
  /** Where in the plan it comes from, e.g. `families[2]`. */
  where: string;
  /** Vertices (predicted for family members), for the progress line. */
  n: number;
  input: JobInput;
}

/** Jobs in this shard after sharding (before skipping stored rows). */
export function shardSize(slices: PlanSlices | null, shard: Shard | null, total: number): number {
  if (shard === null || slices === null) return total;
  return slices.sizes[shard.index];
}

/**
 * Every job of the plan in this shard, in plan order. `slices` (from `planSlices(plan, shard.count)`)
 * saves computing the slicing again when the caller has it.
 */
export async function* planJobs(plan: Plan, version: string, shard: Shard | null = null, slices?: PlanSlices): AsyncGenerator<PlannedJob> {
  let sliced: PlanSlices | null = null;
  if (shard !== null) {
    sliced = slices ?? (await planSlices(plan, shard.count));
    if (sliced.count !== shard.count || sliced.shardOf.length !== plan.total) throw new RangeError(`planJobs: slices of ${sliced.count} do not fit the shard ${shard.index}/${shard.count}`);
  }
  const inShard = (i: number, s: Shard | null): boolean => s === null || sliced!.shardOf[i] === s.index;
  let index = 0;
  for (const e of plan.entries) {
    if (e.kind === "specs") {
      for (const item of e.items) {
        for (const solverSeed of e.solverSeeds) {
          const i = index++;
          if (!inShard(i, shard)) continue;
          yield {
            index: i,
            where: e.where,
            n: item.n,
            input: {
              key: jobKey(item.spec, solverSeed, e.settings, version),
              family: item.label,
              graph: { kind: "spec", spec: item.spec },
              params: item.paramsJson,
              graphSeed: item.graphSeed,
              solverSeed,
              settings: e.settings,
            },
          };
        }
      }
    } else {
      const first = index;
      const seeds = e.solverSeeds.length;
      let position = 0;
      // Graphs outside the shard are still read (a stream has no index), but not hashed or sent.
      for await (const loaded of readGraphs({ path: e.path }, { format: e.format })) {
        if (e.limit !== null && position >= e.limit) break;
        position++;
        const base = first + (position - 1) * seeds;
        let wanted = false;
        for (let k = 0; k < seeds && !wanted; k++) wanted = inShard(base + k, shard);
        if (!wanted) continue;
        const hash = hashGraph(loaded.graph);
        const parts = graphToParts(loaded.graph);
        for (let k = 0; k < seeds; k++) {
          if (!inShard(base + k, shard)) continue;
          yield {
            index: base + k,
            where: e.where,
            n: loaded.graph.n,
            input: {
              key: jobKey(hash, e.solverSeeds[k], e.settings, version),
              family: e.label,
              graph: { kind: "parts", parts, hash, source: { path: e.source, position, format: loaded.format } },
              params: null,
              graphSeed: null,
              solverSeed: e.solverSeeds[k],
              settings: e.settings,
            },
          };
        }
      }
      if (position !== e.count) {
        throw new InputError(`${e.source}: held ${e.count} graphs when the plan was loaded, now ${position}; was it changed during the sweep?`);
      }
      index = first + e.count * seeds;
    }
  }
}
