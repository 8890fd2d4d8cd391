// Live progress of a sweep in one notebook output, updated in place. `progressDisplay()` returns
// an `onProgress` callback: pass it to `runSweep(plan, { onProgress })` (or call it from any loop).
// It reads the progress object structurally (every field optional), so it follows the sweep's
// progress records as they grow.
//
// In place: the first frame is a display_data message with a display id, later frames are
// update_display_data messages with that id (tslab's `newDisplay()` mechanism, which nbconvert and
// both Jupyter front-ends honour). Frames are throttled (default: at most one per 250 ms, and
// always the final one), so a fast sweep does not flood the kernel's message socket.

import { INK, InputError } from "halfplus";
import { channelKind, displayOutput, newDisplayId, updateOutput, type MimeBundle } from "./channel.js";
import { ACCENT, caption, frame, htmlEscape, style } from "./style.js";

/**
 * What a progress frame may carry. Both the sweep's own records (`SweepProgress`: `elapsed`, `eta`,
 * `current` as { family, n }, `lowest`, `finished`) and hand-written ones (`elapsedSeconds`,
 * `etaSeconds`, `current` as text, `bestRatio`) fit; the sweep's names win when both are given.
 */
export interface SweepProgressLike {
  done?: number;
  total?: number;
  /** Graphs per second (null: not known yet). */
  rate?: number | null;
  etaSeconds?: number | null;
  elapsedSeconds?: number;
  /** The sweep's names for the same two. */
  eta?: number | null;
  elapsed?: number;
  family?: string;
  /** What is being worked on now: a spec or key, or the sweep's { family, n }. */
  current?: string | { family: string; n: number } | null;
  /** The lowest surplus/(m/√d) seen so far (the constant the conjecture could still have). */
  bestRatio?: number | null;
  /** The sweep's lowest surplus/(m/√d) so far and the graph it was seen on. */
  lowest?: { ratio: number; graph: string } | null;
  /** True on the sweep's last frame. */
  finished?: boolean;
  failed?: number;
  message?: string;
  /** The sweep's other fields (not shown): its plan's name, rows computed and skipped, the d of m/√d. */
  plan?: string;
  computed?: number;
  skipped?: number;
  degree?: string;
}

/** One vocabulary for the frame: the sweep's field names mapped onto the hand-written ones. */
function normalised(p: SweepProgressLike): SweepProgressLike {
  const q: SweepProgressLike = { ...p };
  if (finite(p.elapsed)) q.elapsedSeconds = p.elapsed;
  if (p.eta !== undefined) q.etaSeconds = p.eta;
  if (p.rate === null) delete q.rate;
  if (p.current !== null && typeof p.current === "object") {
    q.current = `${p.current.family} n=${p.current.n}`;
    if (q.family === undefined) q.family = p.current.family;
  }
  if (p.lowest !== null && typeof p.lowest === "object" && finite(p.lowest.ratio) && !finite(p.bestRatio)) {
    q.bestRatio = p.lowest.ratio;
    if (typeof p.lowest.graph === "string") q.message = [p.message, `lowest at ${p.lowest.graph}`].filter((s) => s).join(" · ");
  }
  return q;
}

export interface ProgressDisplayOptions {
  /** Heading of the output (default "sweep"). */
  title?: string;
  /** Least time between two frames in milliseconds (default 250). */
  minIntervalMs?: number;
  /** What is counted (default "graphs"). */
  unit?: string;
  /** Clock in milliseconds (tests pass their own). */
  now?: () => number;
}

/** The callback, plus a way to draw the final frame. */
export interface ProgressCallback {
  (progress: SweepProgressLike): void;
  /** Draws the last progress seen as finished, with an optional closing note. */
  finish(note?: string): void;
  /** Frames actually sent (throttled calls are not). */
  readonly frames: number;
}

function duration(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds < 0) return "?";
  if (seconds < 60) return `${Math.round(seconds)} s`;
  const m = Math.floor(seconds / 60);
  return m < 60 ? `${m} min ${Math.round(seconds - 60 * m)} s` : `${Math.floor(m / 60)} h ${m % 60} min`;
}

function finite(v: unknown): v is number {
  return typeof v === "number" && Number.isFinite(v);
}

/** One frame as a bundle (exported for tests). */
export function progressBundle(progress: SweepProgressLike, options: { title?: string; unit?: string; finished?: boolean; note?: string } = {}): MimeBundle {
  const p = normalised(progress);
  const title = options.title ?? "sweep";
  const unit = options.unit ?? "graphs";
  const done = finite(p.done) ? p.done : 0;
  const total = finite(p.total) && p.total > 0 ? p.total : null;
  const fraction = total === null ? null : Math.min(1, Math.max(0, done / total));
  const finished = options.finished === true || p.finished === true || (total !== null && done >= total);
  const counts = total === null ? `${done} ${unit}` : `${done} / ${total} ${unit}`;
  const speed = finite(p.rate) ? `${p.rate < 10 ? p.rate.toFixed(2) : p.rate.toFixed(1)} ${unit}/s` : "";
  const left = finished ? (finite(p.elapsedSeconds) ? `took ${duration(p.elapsedSeconds)}` : "done") : finite(p.etaSeconds) ? `about ${duration(p.etaSeconds)} left` : "";
  const line1 = [counts, speed, left].filter((s) => s !== "").join(" · ");
  const line2 = [
    p.family ? `family ${p.family}` : "",
    !finished && typeof p.current === "string" && p.current !== "" ? `now ${p.current}` : "",
    finite(p.bestRatio) ? `lowest surplus/(m/√d) ${p.bestRatio.toPrecision(4)}` : "",
    finite(p.failed) && p.failed > 0 ? `${p.failed} failed` : "",
    p.message ?? "",
    options.note ?? "",
  ]
    .filter((s) => s !== "")
    .join(" · ");

  const pct = fraction === null ? null : Math.round(fraction * 1000) / 10;
  const track = style({ position: "relative", height: "8px", background: INK.grid, "border-radius": "4px", margin: "6px 0", overflow: "hidden", "max-width": "520px" });
  const fill = style({ width: `${pct ?? (finished ? 100 : 0)}%`, height: "100%", background: finished ? ACCENT.proven : ACCENT.bar });
  const bar = `<div role="progressbar" aria-valuemin="0" aria-valuemax="${total ?? ""}" aria-valuenow="${done}" style="${track}"><div class="hp-nb-progress-fill" style="${fill}"></div></div>`;
  const html = frame(
    `${caption(`${title}${finished ? " — finished" : ""}`)}${bar}<div style="font-variant-numeric:tabular-nums">${htmlEscape(line1)}</div>${line2 ? `<div style="color:${INK.muted};font-size:12px">${htmlEscape(line2)}</div>` : ""}`,
    "progress",
  );
  const width = 30;
  const filled = fraction === null ? (finished ? width : 0) : Math.round(fraction * width);
  const text = `${title}: [${"#".repeat(filled)}${".".repeat(width - filled)}] ${line1}${line2 ? ` · ${line2}` : ""}`;
  return { "text/plain": text, "text/html": html };
}

/**
 * A live progress output. Call it with progress objects; it redraws one output in place.
 * Outside a notebook it writes a line to stderr per frame (at most one a second).
 */
export function progressDisplay(options: ProgressDisplayOptions = {}): ProgressCallback {
  const minInterval = options.minIntervalMs ?? 250;
  if (!(typeof minInterval === "number" && minInterval >= 0 && Number.isFinite(minInterval)))
    throw new InputError(`progressDisplay: invalid \`minIntervalMs\`: a number of milliseconds, 0 or more (got ${JSON.stringify(options.minIntervalMs)})`);
  const now = options.now ?? (() => performance.now());
  const text = channelKind() === "text";
  const interval = text ? Math.max(minInterval, 1000) : minInterval;
  const id = newDisplayId();
  const look = { title: options.title, unit: options.unit };
  let last: SweepProgressLike = {};
  let start: number | null = null;
  // A hand-written loop may pass only done/total: rate, time left and elapsed come from our clock.
  const complete = (p: SweepProgressLike): SweepProgressLike => {
    const t = now();
    if (start === null) start = t;
    const elapsed = (t - start) / 1000;
    const q = normalised(p);
    if (!finite(q.elapsedSeconds)) q.elapsedSeconds = elapsed;
    if (!finite(q.rate) && finite(q.done) && q.done > 0 && elapsed > 0) q.rate = q.done / elapsed;
    if (q.etaSeconds === undefined && finite(q.rate) && q.rate > 0 && finite(q.total) && finite(q.done)) q.etaSeconds = Math.max(0, q.total - q.done) / q.rate;
    return q;
  };
  let lastFrame = -Infinity;
  let frames = 0;
  let closed = false;

  const draw = (bundle: MimeBundle) => {
    if (text) process.stderr.write(`${bundle["text/plain"]}\n`);
    else if (frames === 0) displayOutput(bundle, id);
    else updateOutput(bundle, id);
    frames++;
    lastFrame = now();
  };
  // The output appears as soon as the display is made, before the first graph finishes.
  if (!text) draw(progressBundle({}, { ...look, note: "starting" }));

  const callback = ((p: SweepProgressLike) => {
    if (closed) return;
    last = complete(p);
    const final = p.finished === true || (finite(p.total) && finite(p.done) && p.done >= p.total);
    if (final || now() - lastFrame >= interval) draw(progressBundle(last, look));
  }) as ProgressCallback;
  callback.finish = (note?: string) => {
    if (closed) return;
    closed = true;
    draw(progressBundle(last, { ...look, finished: true, note }));
  };
  Object.defineProperty(callback, "frames", { get: () => frames });
  return callback;
}
