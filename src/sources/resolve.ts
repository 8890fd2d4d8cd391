// The way back from a record to its graph: the embedded copy when the record carries one, else the
// family spec, else the file and position. A resolver reads each file once, however many records
// point into it (a results file of a whole graph6 stream re-reads nothing).

import { statSync } from "node:fs";
import { InputError } from "../errors.js";
import type { Graph } from "../graph/graph.js";
import { readEmbeddedGraph } from "../graph/record/embed.js";
import { sourceLabel, type GraphSource } from "../graph/record/source.js";
import { loadFamilyWithInfo } from "../families/family-loaders.js";
import { openSource, type OpenSourceOptions } from "./open.js";

export class SourceResolver {
  private readonly files = new Map<string, Graph[]>();

  constructor(private readonly options: OpenSourceOptions = {}) {}

  /** The graph `source` describes; `where` names the record in messages (e.g. "r.jsonl:3"). */
  async resolve(source: GraphSource, where: string): Promise<Graph> {
    if (typeof source !== "object" || source === null) throw new InputError(`${where}: \`source\` should be an object`);
    if (source.embedded !== undefined) return readEmbeddedGraph(source.embedded, where);
    if (source.spec !== undefined) return (await loadFamilyWithInfo(source.spec)).graph;
    if (source.path === "-") throw new InputError(`${where}: the graph came from standard input and the record has no embedded copy; pass it with --graph`);
    if (source.path === undefined) throw new InputError(`${where}: \`source\` names no spec, file or embedded graph; pass the graph with --graph`);
    const graphs = await this.file(source, where);
    const position = source.position ?? 1;
    if (!(Number.isInteger(position) && position >= 1 && position <= graphs.length)) {
      throw new InputError(`${where}: ${sourceLabel(source)}: the file holds ${graphs.length} graph(s), not a graph at position ${position}`);
    }
    return graphs[position - 1];
  }

  private async file(source: GraphSource, where: string): Promise<Graph[]> {
    const path = source.path!;
    let all = this.files.get(path);
    if (all === undefined) {
      requireRegularFile(path, `${where}: source.path`);
      all = await readAllGraphs(path, { ...this.options, format: source.format ?? this.options.format });
      this.files.set(path, all);
    }
    return all;
  }
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

/** Every graph of a source argument, in order; none is an error. */
export async function readAllGraphs(arg: string, options: OpenSourceOptions = {}): Promise<Graph[]> {
  const out: Graph[] = [];
  for await (const g of openSource(arg, options)) out.push(g.graph);
  if (out.length === 0) throw new InputError(`${arg}: holds no graph`);
  return out;
}

/**
 * The graph for the k-th record (1-based) among graphs the user gave explicitly: one graph serves
 * every record; otherwise the record's own position picks it, else its order among the records.
 */
export function pickGivenGraph(given: readonly Graph[], source: GraphSource | undefined, k: number, what: string): Graph {
  if (given.length === 1) return given[0];
  const position = source?.position ?? k;
  if (!(Number.isInteger(position) && position >= 1 && position <= given.length)) {
    throw new InputError(`${what}: holds ${given.length} graphs, record ${k} needs the graph at position ${position}`);
  }
  return given[position - 1];
}
