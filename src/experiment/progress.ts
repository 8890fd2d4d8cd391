// Sweep progress: the numbers (handed to `onProgress` for notebooks) and their display on
// stderr, a line rewritten in place on a terminal, or a plain line every few seconds otherwise.

export interface LowestRatio {
  /** surplusUpper·√d / m: no constant c above this has surplus ≥ c·m/√d on every graph so far. */
  ratio: number;
  /** The same with surplusLower (equal when the bracket is closed). */
  ratioLower: number;
  key: string;
  graph: string;
}

export interface SweepProgress {
  plan: string;
  /** Jobs of this shard finished or found in the store. */
  done: number;
  total: number;
  /** Rows computed in this run. */
  computed: number;
  /** Jobs whose row was already stored. */
  skipped: number;
  elapsed: number;
  /** Computed rows per second, null until the first row. */
  rate: number | null;
  /** Seconds left at the current rate, null when unknown. */
  eta: number | null;
  /** The family label and size of the latest job sent to a worker. */
  current: { family: string; n: number } | null;
  /** The degree measure d in surplus/(m/√d). */
  degree: string;
  lowest: LowestRatio | null;
  finished: boolean;
}

function clock(seconds: number): string {
  if (!Number.isFinite(seconds)) return "?";
  const s = Math.round(seconds);
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  const ss = s % 60;
  return h > 0 ? `${h}:${String(m).padStart(2, "0")}:${String(ss).padStart(2, "0")}` : `${m}:${String(ss).padStart(2, "0")}`;
}

function rateText(r: number | null): string {
  if (r === null) return "–";
  return r >= 100 ? r.toFixed(0) : r >= 10 ? r.toFixed(1) : r.toPrecision(2);
}

const short = (x: number): string => x.toPrecision(3);

/** The terminal line: counts, rate, time left, what runs now, the lowest ratio. */
export function progressLine(p: SweepProgress): string {
  const pct = p.total === 0 ? 100 : (100 * p.done) / p.total;
  const parts = [`${p.plan} ${p.done}/${p.total} ${pct.toFixed(1)}%`, `${rateText(p.rate)} graphs/s`];
  if (p.eta !== null && !p.finished) parts.push(`${clock(p.eta)} left`);
  if (p.current !== null && !p.finished) parts.push(`${p.current.family} n=${p.current.n}`);
  if (p.lowest !== null) parts.push(`c ≤ ${short(p.lowest.ratio)} (${p.lowest.graph})`);
  return parts.join("  ");
}

/** The plain line for logs: the same facts in words. */
export function progressSentence(p: SweepProgress): string {
  const pct = p.total === 0 ? 100 : (100 * p.done) / p.total;
  let s = `${p.plan}: ${p.done} of ${p.total} jobs done (${pct.toFixed(1)}%, ${p.skipped} already stored), ${rateText(p.rate)} graphs/s`;
  if (p.eta !== null && !p.finished) s += `, about ${clock(p.eta)} left`;
  if (p.current !== null && !p.finished) s += `; running ${p.current.family} n=${p.current.n}`;
  if (p.lowest !== null) s += `; lowest surplus/(m/√${p.degree === "degeneracy" ? "d" : p.degree}) so far ${short(p.lowest.ratio)} at ${p.lowest.graph}`;
  return s;
}

export interface ProgressDisplay {
  update(p: SweepProgress): void;
  /** Clear the live line (terminal) before the summary is printed. */
  done(): void;
}

/** Live line on a terminal (at most 10 redraws a second), else a plain line every `every` seconds. */
export function progressDisplay(stderr: NodeJS.WritableStream, options: { tty?: boolean; every?: number } = {}): ProgressDisplay {
  return liveProgress(stderr, progressLine, progressSentence, options);
}

/**
 * The one live-progress writer (sweeps, censuses): `line(p)` rewritten in place on a terminal at
 * most 10 times a second, else `sentence(p)` every `every` seconds (default 10).
 */
export function liveProgress<P extends { elapsed: number; finished: boolean }>(
  stderr: NodeJS.WritableStream,
  line: (p: P) => string,
  sentence: (p: P) => string,
  options: { tty?: boolean; every?: number } = {},
): { update(p: P): void; done(): void } {
  const tty = options.tty ?? (stderr as NodeJS.WriteStream).isTTY === true;
  const every = options.every ?? 10;
  let last = -Infinity;
  let shown = false;
  return {
    update(p) {
      if (p.finished) return;
      const gap = tty ? 0.1 : every;
      if (p.elapsed - last < gap) return;
      last = p.elapsed;
      if (tty) {
        const width = (stderr as NodeJS.WriteStream).columns ?? 120;
        const text = line(p);
        stderr.write(`\r\x1b[2K${text.length > width - 1 ? text.slice(0, width - 2) + "…" : text}`);
        shown = true;
      } else stderr.write(sentence(p) + "\n");
    },
    done() {
      if (tty && shown) stderr.write("\r\x1b[2K");
      shown = false;
    },
  };
}
