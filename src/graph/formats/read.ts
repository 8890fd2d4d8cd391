// Reading graphs from files and streams. graph6/sparse6 input is decoded line by line as it
// arrives, in memory bounded by the longest line, so a pipe of millions of graphs never
// accumulates; the whole-file formats (edge list, gset, DIMACS) are gathered into one Buffer
// and scanned once. Format: `options.format`, else the extension, else the content (detect.ts).

import { createReadStream } from "node:fs";
import type { Readable } from "node:stream";
import { InputError, inputErrorAt, invalidParameter } from "../../errors.js";
import { MAX_LINE_BYTES, MAX_WHOLE_FILE_BYTES } from "../../limits/input.js";
import { checkMemory, formatBytes } from "../../limits/memory.js";
import type { BuildOptions } from "../builder.js";
import { detectFromContent, formatFromExtension } from "./detect.js";
import { parseDimacs } from "./dimacs.js";
import { parseEdgeList } from "./edgelist.js";
import { parseGset } from "./gset.js";
import { decodeNautyLine } from "./nauty-line.js";
import { isBlank } from "./scan.js";
import { GRAPH_FORMATS, type GraphFormat, type LoadedGraph, type ReadOptions } from "./types.js";

export type GraphInput = { path: string } | { stream: NodeJS.ReadableStream; name: string };

/** Enough of the input to detect its format: two complete non-blank lines, or this many bytes. */
const HEAD_BYTES = 1 << 16;

/** Pulls Buffers from a stream; turns file-system errors into one-line InputErrors. (Also the census's reader.) */
export class Chunks {
  private readonly it: AsyncIterator<unknown>;
  private readonly pending: Buffer[] = [];

  constructor(
    private readonly stream: NodeJS.ReadableStream,
    private readonly owned: boolean,
    private readonly source: string,
  ) {
    const r = stream as Readable;
    // A caller's stream (stdin) is left open when we stop early; our own file stream is closed.
    this.it = !owned && typeof r.iterator === "function" ? r.iterator({ destroyOnReturn: false }) : stream[Symbol.asyncIterator]();
  }

  /** Give back chunks read ahead (format detection), to be served first. */
  unshift(chunks: Buffer[]): void {
    this.pending.unshift(...chunks);
  }

  async next(): Promise<Buffer | null> {
    if (this.pending.length > 0) return this.pending.shift()!;
    let r: IteratorResult<unknown>;
    try {
      r = await this.it.next();
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      if (typeof code === "string" && /^E[A-Z]+$/.test(code)) {
        const why = code === "ENOENT" ? "no such file" : code === "EISDIR" ? "is a directory" : code === "EACCES" ? "permission denied" : code;
        throw new InputError(`${this.source}: cannot read (${why})`);
      }
      throw e;
    }
    if (r.done) return null;
    const v = r.value;
    return typeof v === "string" ? Buffer.from(v, "utf8") : Buffer.isBuffer(v) ? v : Buffer.from(v as Uint8Array);
  }

  async close(): Promise<void> {
    await this.it.return?.();
    if (this.owned) (this.stream as Readable).destroy();
  }
}

/** Non-blank lines ending in "\n" within buf, up to `want`; returns the end (after "\n") of the last one, or -1. */
function endOfLines(buf: Buffer, want: number): number {
  let p = 0;
  let got = 0;
  for (;;) {
    const nl = buf.indexOf(10, p);
    if (nl < 0) return -1;
    let blank = true;
    for (let i = p; i < nl; i++) {
      if (!isBlank(buf[i])) {
        blank = false;
        break;
      }
    }
    if (!blank && ++got === want) return nl + 1;
    p = nl + 1;
  }
}

/** Read ahead for detection; the chunks read are handed back to `chunks`. Returns the head, or null for blank input. */
async function readHead(chunks: Chunks): Promise<Buffer | null> {
  const taken: Buffer[] = [];
  let size = 0;
  let head: Buffer = Buffer.alloc(0);
  let eof = false;
  for (;;) {
    const c = await chunks.next();
    if (c === null) {
      eof = true;
      break;
    }
    taken.push(c);
    size += c.length;
    head = taken.length === 1 ? c : Buffer.concat(taken, size);
    if (size >= HEAD_BYTES || endOfLines(head, 2) >= 0) break;
  }
  chunks.unshift(taken);
  let blank = true;
  for (let i = 0; i < head.length && blank; i++) if (!isBlank(head[i]) && head[i] !== 10) blank = false;
  if (blank && eof) return null;
  const cut = endOfLines(head, 2);
  return cut >= 0 ? head.subarray(0, cut) : head;
}

async function* nautyStream(chunks: Chunks, source: string, build: BuildOptions | undefined): AsyncGenerator<LoadedGraph> {
  let carry: Buffer[] = []; // pieces of a line split across chunks
  let carried = 0;
  let line = 0;
  let position = 0; // graphs yielded so far
  for (;;) {
    const chunk = await chunks.next();
    if (chunk === null) break;
    let p = 0;
    for (;;) {
      const nl = chunk.indexOf(10, p);
      if (nl < 0) {
        if (p < chunk.length) {
          carry.push(chunk.subarray(p));
          carried += chunk.length - p;
          // A line without end (/dev/zero, a runaway pipe) must not grow without bound.
          if (carried > MAX_LINE_BYTES) throw inputErrorAt(source, line + 1, `line longer than ${formatBytes(MAX_LINE_BYTES)}: not a graph6/sparse6 line halfplus can hold`);
        }
        break;
      }
      let buf = chunk;
      let s = p;
      let e = nl;
      if (carry.length > 0) {
        carry.push(chunk.subarray(p, nl));
        buf = Buffer.concat(carry);
        s = 0;
        e = buf.length;
        carry = [];
        carried = 0;
        if (e > MAX_LINE_BYTES) throw inputErrorAt(source, line + 1, `line longer than ${formatBytes(MAX_LINE_BYTES)}: not a graph6/sparse6 line halfplus can hold`);
      }
      p = nl + 1;
      line++;
      const r = decodeNautyLine(buf, s, e, { file: source, line }, build);
      if (r !== null) yield { graph: r.graph, file: source, position: ++position, line, format: r.format, report: r.report };
    }
  }
  if (carry.length > 0) {
    // Last line without a final newline.
    const buf = Buffer.concat(carry);
    line++;
    const r = decodeNautyLine(buf, 0, buf.length, { file: source, line }, build);
    if (r !== null) yield { graph: r.graph, file: source, position: position + 1, line, format: r.format, report: r.report };
  }
}

async function wholeFile(chunks: Chunks, source: string, format: GraphFormat, options: ReadOptions): Promise<LoadedGraph> {
  const explicit = options.format !== undefined;
  const parts: Buffer[] = [];
  let size = 0;
  let nextCheck = 2 ** 26;
  for (let c = await chunks.next(); c !== null; c = await chunks.next()) {
    size += c.length;
    if (size > MAX_WHOLE_FILE_BYTES) throw new InputError(`${source}: ${format} input larger than ${formatBytes(MAX_WHOLE_FILE_BYTES)}; halfplus reads whole-file formats into one buffer`);
    if (size >= nextCheck) {
      // Parsing and building take several times the text: size that before reading on.
      checkMemory(6 * size, `${source}: ${format} input of ${formatBytes(size)} and more`);
      nextCheck *= 2;
    }
    parts.push(c);
  }
  const buf = parts.length === 1 ? parts[0] : Buffer.concat(parts, size);
  const opts = { file: source, build: options.build };
  const r =
    format === "edgelist"
      ? parseEdgeList(buf, { ...opts, base: options.base, refuseCountHeader: !explicit })
      : format === "gset"
        ? parseGset(buf, opts)
        : parseDimacs(buf, opts);
  return { graph: r.graph, file: source, position: 1, line: 1, format, report: r.report };
}

function checkOptions(options: ReadOptions): void {
  if (options.format !== undefined && !GRAPH_FORMATS.includes(options.format)) {
    throw invalidParameter("readGraphs", "format", `one of ${GRAPH_FORMATS.join(", ")}`, options.format);
  }
  if (options.base !== undefined && options.base !== 0 && options.base !== 1) {
    throw invalidParameter("readGraphs", "base", "0 or 1", options.base);
  }
}

/**
 * Every graph in a file or stream, lazily. `{ path: "-" }` reads standard input. A nauty
 * stream may hold any number of graphs (zero included); whole-file formats hold one.
 */
export async function* readGraphs(input: GraphInput, options: ReadOptions = {}): AsyncGenerator<LoadedGraph> {
  checkOptions(options);
  let source: string;
  let stream: NodeJS.ReadableStream;
  let owned = false;
  if ("path" in input) {
    if (input.path === "-") {
      source = "stdin";
      stream = process.stdin;
    } else {
      source = input.path;
      stream = createReadStream(input.path);
      owned = true;
    }
  } else {
    source = input.name;
    stream = input.stream;
  }
  const chunks = new Chunks(stream, owned, source);
  try {
    let format = options.format ?? formatFromExtension(source);
    if (format === undefined) {
      const head = await readHead(chunks);
      if (head === null) return; // blank input: no graphs (e.g. a filter that kept none)
      format = detectFromContent(source, head);
    }
    if (format === "graph6" || format === "sparse6") yield* nautyStream(chunks, source, options.build);
    else yield await wholeFile(chunks, source, format, options);
  } finally {
    await chunks.close();
  }
}

/**
 * The only item of a stream of graphs: none or several is bad input, naming `where` and, for a
 * second item, where it is (`describe`, e.g. "starts on line 3"). Shared by every "exactly one graph" reader.
 */
export async function exactlyOneGraph<T>(items: AsyncIterable<T>, where: string, describe: (second: T) => string): Promise<T> {
  let first: T | undefined;
  let seen = false;
  for await (const item of items) {
    if (seen) throw new InputError(`${where}: holds more than one graph (the second ${describe(item)}); expected exactly one`);
    first = item;
    seen = true;
  }
  if (!seen) throw new InputError(`${where}: holds no graph`);
  return first as T;
}

/** The one graph in a file ("-": standard input); none or several is an error. */
export async function readGraphFile(path: string, options: ReadOptions = {}): Promise<LoadedGraph> {
  return exactlyOneGraph(readGraphs({ path }, options), path === "-" ? "stdin" : path, (g) => `starts on line ${g.line}`);
}
