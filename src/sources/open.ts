// What the CLI, sweeps and stored results accept as "a graph": a file (any supported format, or
// "-" for standard input, possibly a stream of many graphs) or a family spec such as
// `polarity:q=13`. Resolution order: "-" → stdin; an existing path → file; a known family name →
// family; anything else is an error naming the argument. Each graph comes with its GraphSource.

import { existsSync, fstatSync, statSync } from "node:fs";
import { InputError, echo } from "../errors.js";
import type { BuildOptions } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { exactlyOneGraph, readGraphs, type GraphFormat } from "../graph/formats/index.js";
import { sourceLabel, type GraphSource } from "../graph/record/source.js";
// Only the families a spec names are loaded (families/family-loaders.ts), not the whole registry.
import { isFamilyName, loadFamilyDefinition, loadFamilyWithInfo } from "../families/family-loaders.js";
import { renamedFamily } from "../families/resolver.js";
import { looksLikeSpec, parseRawSpec } from "../families/spec.js";
import { checkSeed } from "../random/seed.js";

export interface SourcedGraph {
  graph: Graph;
  /** Short human label (`sourceLabel(source)`): the canonical spec, or `file` / `file#k` for the k-th graph of a stream. */
  label: string;
  source: GraphSource;
  /** Things the user should know (e.g. "no seed given: using seed 0"). */
  notes: string[];
}

export interface OpenSourceOptions {
  /** Read files in this format instead of detecting it. */
  format?: GraphFormat;
  /** Vertex numbering of edge lists. */
  base?: 0 | 1;
  build?: BuildOptions;
  /** Seed for a random family whose spec has no `seed=` (a spec's own seed must agree with it). */
  graphSeed?: number;
  stdin?: NodeJS.ReadableStream;
}

type Kind = "stdin" | "file" | "family";

function classify(arg: string): Kind {
  if (arg === "-") return "stdin";
  if (existsSync(arg)) {
    if (statSync(arg).isDirectory()) throw new InputError(`${arg}: is a directory, expected a graph file or a family spec`);
    return "file";
  }
  if (looksLikeSpec(arg)) {
    const { name } = parseRawSpec(arg);
    if (isFamilyName(name)) return "family";
    const now = renamedFamily(name);
    throw new InputError(`${echo(arg)}: no such file, and no family called ${echo(name)} (${now === undefined ? "run halfplus families" : `it is now called ${now}`})`);
  }
  throw new InputError(`${arg}: no such file`);
}

function stdinIsDirectory(): boolean {
  try {
    return fstatSync(0).isDirectory();
  } catch {
    return false; // no usable fd 0 (e.g. closed): the reader reports what it finds
  }
}

/** The spec with the graph seed filled in; a seed that is not wanted or disagrees is bad input. */
async function seededSpec(spec: string, graphSeed: number | undefined): Promise<string> {
  if (graphSeed === undefined) return spec;
  checkSeed("--graph-seed", "seed", graphSeed);
  const raw = parseRawSpec(spec);
  if ((await loadFamilyDefinition(raw.name)).random !== true) {
    throw new InputError(`${spec}: --graph-seed applies to random families, and ${raw.name} is not one`);
  }
  const given = raw.values.get("seed");
  if (given !== undefined) {
    if (Number(given) !== graphSeed) throw new InputError(`${spec}: the spec says seed=${given} but --graph-seed says ${graphSeed}; give one`);
    return spec;
  }
  return spec.includes(":") ? `${spec},seed=${graphSeed}` : `${spec}:seed=${graphSeed}`;
}

/** Every graph the argument denotes, lazily (a graph6 stream is read one line at a time). */
export async function* openSource(arg: string, options: OpenSourceOptions = {}): AsyncGenerator<SourcedGraph> {
  const kind = classify(arg);
  if (kind === "family") {
    if (options.format !== undefined) throw new InputError(`${arg}: --format applies to files, not to family specs`);
    const f = await loadFamilyWithInfo(await seededSpec(arg, options.graphSeed));
    const source: GraphSource = { spec: f.spec, graphSeed: f.graphSeed };
    yield { graph: f.graph, label: sourceLabel(source), source, notes: f.notes };
    return;
  }
  if (options.graphSeed !== undefined) throw new InputError(`${arg}: --graph-seed applies to random family specs, not to files`);
  const readOptions = { format: options.format, base: options.base, build: options.build };
  const stdin = options.stdin ?? process.stdin;
  // Node reads a directory on fd 0 (`halfplus graph - < dir`) as an empty stream, which would
  // pass for "no graphs"; refuse it like a directory path.
  if (kind === "stdin" && stdin === process.stdin && stdinIsDirectory()) {
    throw new InputError("stdin: is a directory, expected graph data");
  }
  const input = kind === "stdin" ? { stream: stdin, name: "stdin" } : { path: arg };
  for await (const loaded of readGraphs(input, readOptions)) {
    const notes: string[] = [];
    const { mergedDuplicates, droppedLoops } = loaded.report;
    if (mergedDuplicates > 0) notes.push(`merged ${mergedDuplicates} duplicate edge(s)`);
    if (droppedLoops > 0) notes.push(`dropped ${droppedLoops} self-loop(s)`);
    const source: GraphSource = { path: kind === "stdin" ? "-" : arg, position: loaded.position, format: loaded.format, graphSeed: null };
    yield { graph: loaded.graph, label: sourceLabel(source), source, notes };
  }
}

/** Exactly one graph from the argument; a stream with none or more than one is an error. */
export async function openSingleGraph(arg: string, options: OpenSourceOptions = {}): Promise<SourcedGraph> {
  return exactlyOneGraph(openSource(arg, options), arg, (g) => `is ${g.label}`);
}
