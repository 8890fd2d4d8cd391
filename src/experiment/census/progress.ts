// Census progress on stderr: a line rewritten in place on a terminal (at most 10 a second), or a
// plain sentence every few seconds when stderr is a file or a pipe.

import { liveProgress } from "../progress.js";
import type { CensusProgress } from "./run.js";

function rate(r: number | null): string {
  return r === null ? "–" : r >= 100 ? r.toFixed(0) : r.toPrecision(2);
}

/** The terminal line. */
export function censusProgressLine(p: CensusProgress): string {
  if (p.phase === "skipping") return `census ${p.name}: skipping ${p.consumed} graphs counted before`;
  const parts = [`census ${p.name}: ${p.consumed} graphs`, `${rate(p.rate)} graphs/s`, `${p.cells} (n, m) cells`];
  if (p.lowest !== null) parts.push(`min surplus/(m/√d) ${p.lowest.ratio.toPrecision(4)} (n=${p.lowest.n} m=${p.lowest.m} ${p.lowest.graph})`);
  return parts.join("  ");
}

/** The plain line for logs. */
export function censusProgressSentence(p: CensusProgress): string {
  if (p.phase === "skipping") return `census ${p.name}: skipped ${p.consumed} graphs an earlier run counted`;
  let s = `census ${p.name}: ${p.consumed} graphs counted (${p.counted} in this run, ${rate(p.rate)} graphs/s), ${p.cells} (n, m) cells`;
  if (p.lowest !== null) s += `; least surplus/(m/√d) so far ${p.lowest.ratio.toPrecision(4)} at n=${p.lowest.n} m=${p.lowest.m} (${p.lowest.graph})`;
  return s;
}

export interface CensusProgressDisplay {
  update(p: CensusProgress): void;
  done(): void;
}

/** Live line on a terminal, else a plain line every `every` seconds (the sweep's writer, `liveProgress`). */
export function censusProgressDisplay(stderr: NodeJS.WritableStream, options: { tty?: boolean; every?: number } = {}): CensusProgressDisplay {
  return liveProgress(stderr, censusProgressLine, censusProgressSentence, options);
}
