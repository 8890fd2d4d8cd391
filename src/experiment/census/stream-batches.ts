// A graph6/sparse6 stream cut into batches of whole lines holding a given number of graphs, with
// a running sha256 of every byte handed out: the census's resume position is a graph count,
// and the hash of the prefix up to it tells whether a stream fed again starts the same way.

import { createHash, type Hash } from "node:crypto";
import { createReadStream } from "node:fs";
import { inputErrorAt } from "../../errors.js";
import { nautyLineHoldsGraph } from "../../graph/formats/nauty-line.js";
import { Chunks } from "../../graph/formats/read.js";
import { MAX_LINE_BYTES } from "../../limits/input.js";
import { formatBytes } from "../../limits/memory.js";

export interface LineBatch {
  /** Whole lines, each ending in "\n" (one is added to a last line without it). */
  bytes: Buffer;
  /** Line number (from 1) of the first line in `bytes`. */
  firstLine: number;
  /** Lines holding a graph; the batch ends right after the last of them. */
  graphs: number;
  /** sha256 (hex) of every byte handed out so far, this batch included. */
  fingerprint: string;
}

const EMPTY = Buffer.alloc(0);
const NEWLINE = Buffer.from("\n");

/** Batches of a stream (`-` = standard input, else a file path). */
export class StreamBatcher {
  private readonly chunks: Chunks;
  private readonly hash: Hash = createHash("sha256");
  private buf: Buffer = EMPTY;
  private pos = 0;
  private line = 0; // lines before `pos`
  private eof = false;
  /** Bytes handed out so far. */
  bytesRead = 0;
  /** The stream's name in messages. */
  readonly source: string;

  constructor(path: string, stdin: NodeJS.ReadableStream = process.stdin) {
    this.source = path === "-" ? "stdin" : path;
    const owned = path !== "-";
    this.chunks = new Chunks(owned ? createReadStream(path) : stdin, owned, this.source);
  }

  private async more(): Promise<boolean> {
    if (this.eof) return false;
    const chunk = await this.chunks.next();
    const rest = this.buf.subarray(this.pos);
    if (chunk === null) {
      this.eof = true;
      // A last line without "\n" gets one, so its bytes hash the same when more lines follow later.
      if (rest.length === 0) return false;
      this.buf = Buffer.concat([rest, NEWLINE]);
    } else {
      this.buf = rest.length === 0 ? chunk : Buffer.concat([rest, chunk]);
      if (this.buf.length > MAX_LINE_BYTES && this.buf.indexOf(10) < 0) throw inputErrorAt(this.source, this.line + 1, `line longer than ${formatBytes(MAX_LINE_BYTES)}: not a graph6/sparse6 line halfplus can hold`);
    }
    this.pos = 0;
    return true;
  }

  /**
   * The next batch of up to `maxGraphs` graphs (fewer only at the end of the stream), or null
   * when no graph is left. Blank and header lines after the last graph of a batch stay for the next.
   */
  async next(maxGraphs: number): Promise<LineBatch | null> {
    const parts: Buffer[] = [];
    let graphs = 0;
    let start = this.pos; // first byte not yet put in `parts`
    const firstLine = this.line + 1; // of the batch
    let startLine = firstLine; // of the byte at `start`
    let lastEnd = -1; // end (after "\n") of the last graph line in `buf`
    let lineAtLastEnd = this.line;
    while (graphs < maxGraphs) {
      const nl = this.buf.indexOf(10, this.pos);
      if (nl < 0) {
        // Keep the complete lines seen so far; the partial line moves to the next buffer.
        if (lastEnd >= 0) {
          parts.push(this.buf.subarray(start, lastEnd));
          start = lastEnd;
          startLine = lineAtLastEnd + 1;
          lastEnd = -1;
        }
        // more() keeps buf[pos..]: rewind to the lines not yet in `parts` so they are kept too.
        this.pos = start;
        this.line = startLine - 1;
        if (!(await this.more())) break;
        start = 0;
        continue;
      }
      const holds = nautyLineHoldsGraph(this.buf, this.pos, nl);
      this.pos = nl + 1;
      this.line++;
      if (holds) {
        graphs++;
        lastEnd = this.pos;
        lineAtLastEnd = this.line;
      }
    }
    if (lastEnd >= 0) {
      parts.push(this.buf.subarray(start, lastEnd));
      // Lines after the last graph (blank or headers) belong to the next batch.
      this.pos = lastEnd;
      this.line = lineAtLastEnd;
    }
    if (graphs === 0) return null;
    const bytes = parts.length === 1 ? Buffer.from(parts[0]) : Buffer.concat(parts);
    this.hash.update(bytes);
    this.bytesRead += bytes.length;
    return { bytes, firstLine, graphs, fingerprint: this.hash.copy().digest("hex") };
  }

  /** Stop reading (standard input is left open; a file stream is closed). */
  async close(): Promise<void> {
    await this.chunks.close();
  }
}
