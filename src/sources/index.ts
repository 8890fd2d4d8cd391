// What the CLI, sweeps and stored results accept as "a graph": a file (any supported
// format, or "-" for standard input, possibly a stream of many graphs) or a family spec
// such as `polarity:q=13`. Resolution order: "-" → stdin; an existing path → file;
// a known family name → family; anything else is an error naming the argument.

import { existsSync, fstatSync, statSync } from "node:fs";
import { InputError, echo } from "../errors.js";
import type { BuildOptions } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { readGraphs, type GraphFormat } from "../graph/formats/index.js";
import { familyWithInfo, isFamilyName } from "../families/registry.js";
import { looksLikeSpec, parseRawSpec } from "../families/spec.js";

/** Where a graph came from, precisely enough to rebuild it (stored in result records). */
export interface SourceRef {
  /** Canonical family spec (seed written out), when the graph is a family member. */
  spec?: string;
  /** File path ("-" for standard input) and 0-based position in the file's stream. */
  path?: string;
  index?: number;
  format?: GraphFormat;
}

export interface SourcedGraph {
  graph: Graph;
  /** Short human label: the canonical spec, or `file` / `file#index` for streams. */
  label: string;
  ref: SourceRef;
  /** Things the user should know (e.g. "no seed given: using seed 0"). */
  notes: string[];
}

export interface OpenSourceOptions {
  format?: GraphFormat;
  base?: 0 | 1;
  build?: BuildOptions;
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
    throw new InputError(`${echo(arg)}: no such file, and no family called ${echo(name)} (run halfplus families)`);
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

/** Every graph the argument denotes, lazily (a graph6 stream is read one line at a time). */
export async function* openSource(arg: string, options: OpenSourceOptions = {}): AsyncGenerator<SourcedGraph> {
  const kind = classify(arg);
  if (kind === "family") {
    if (options.format !== undefined) throw new InputError(`${arg}: --format applies to files, not to family specs`);
    const f = familyWithInfo(arg);
    yield { graph: f.graph, label: f.spec, ref: { spec: f.spec }, notes: f.notes };
    return;
  }
  const readOptions = { format: options.format, base: options.base, build: options.build };
  const stdin = options.stdin ?? process.stdin;
  // Node reads a directory on fd 0 (`halfplus graph - < dir`) as an empty stream, which would
  // pass for "no graphs"; refuse it like a directory path.
  if (kind === "stdin" && stdin === process.stdin && stdinIsDirectory()) {
    throw new InputError("stdin: is a directory, expected graph data");
  }
  const input = kind === "stdin" ? { stream: stdin, name: "stdin" } : { path: arg };
  let count = 0;
  for await (const loaded of readGraphs(input, readOptions)) {
    const notes: string[] = [];
    const { mergedDuplicates, droppedLoops } = loaded.report;
    if (mergedDuplicates > 0) notes.push(`merged ${mergedDuplicates} duplicate edge(s)`);
    if (droppedLoops > 0) notes.push(`dropped ${droppedLoops} self-loop(s)`);
    const path = kind === "stdin" ? "-" : arg;
    yield {
      graph: loaded.graph,
      label: count === 0 && loaded.index === 0 ? loaded.source : `${loaded.source}#${loaded.index}`,
      ref: { path, index: loaded.index, format: loaded.format },
      notes,
    };
    count++;
  }
}

/** Exactly one graph from the argument; a stream with more than one is an error. */
export async function openSingleGraph(arg: string, options: OpenSourceOptions = {}): Promise<SourcedGraph> {
  let first: SourcedGraph | undefined;
  for await (const g of openSource(arg, options)) {
    if (first !== undefined) throw new InputError(`${arg}: holds more than one graph; pick one with a single-graph file`);
    first = g;
  }
  if (first === undefined) throw new InputError(`${arg}: holds no graph`);
  return first;
}

/**
 * Refuse anything but a regular file as the graph behind a stored record: a record naming
 * /dev/zero or a pipe must not make `verify` read forever. `what` names the record field.
 */
export function requireRegularFile(path: string, what: string): void {
  let ok = false;
  try {
    ok = statSync(path).isFile();
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new InputError(`${what} ${JSON.stringify(path)}: ${code === "ENOENT" ? "no such file" : `cannot read (${code ?? String(e)})`}`);
  }
  if (!ok) throw new InputError(`${what} ${JSON.stringify(path)}: is not a regular file`);
}

/** Rebuild the graph a stored record points to (used by `verify` and the results store). */
export async function resolveSourceRef(ref: SourceRef, options: OpenSourceOptions = {}): Promise<Graph> {
  if (ref.spec !== undefined) return familyWithInfo(ref.spec).graph;
  if (ref.path === undefined) throw new InputError("source reference has neither a spec nor a path");
  if (ref.path === "-") throw new InputError("the graph came from standard input; pass it again with --graph FILE");
  requireRegularFile(ref.path, "source.path");
  const want = ref.index ?? 0;
  for await (const g of openSource(ref.path, { ...options, format: ref.format ?? options.format })) {
    if (g.ref.index === want) return g.graph;
  }
  throw new InputError(`${ref.path}: has no graph #${want}`);
}
