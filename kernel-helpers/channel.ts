// Where notebook output goes: the running tslab kernel (a Jupyter display_data message carrying a
// whole mime bundle, or update_display_data for an output shown earlier), or plain text on stdout
// when the helpers run outside a kernel (a script, a test).
//
// Why not only tslab's public `display` API: its calls send one mime type per message, so a figure
// could not carry its interactive HTML and its static SVG in one output (front-ends pick the richest
// type of a bundle; two messages would show the figure twice). tslab 1.0.22 (pinned in package.json)
// sends every display message through one function, `lastWriteDisplayData(content, update)` of its
// jupyter module, which takes a whole bundle and a display id; we call that, found through the
// kernel's own `require("tslab")` hook so it is the instance that is running (not another copy on
// disk). If a future tslab moved it, we fall back to the public API with the bundle's richest type,
// still updating in place by id (`newDisplay()`), and `channelKind()` says "tslab-public".

import { randomBytes } from "node:crypto";
import { createRequire } from "node:module";
import { dirname, join } from "node:path";

/** One output in several representations; text/plain is always there. */
export interface MimeBundle {
  "text/plain": string;
  "text/html"?: string;
  "image/svg+xml"?: string;
  "text/markdown"?: string;
  [mime: string]: string | undefined;
}

/** How output reaches the reader. */
export type ChannelKind = "tslab" | "tslab-public" | "text";

interface DisplayContent {
  data: Record<string, string>;
  metadata: Record<string, unknown>;
  transient: { display_id?: string };
}
type WriteDisplay = (content: DisplayContent, update: boolean) => void;

interface TslabPublic {
  newDisplay(): { raw(contentType: string, body: string): void };
}

interface TslabHook {
  require(id: string): unknown;
}

const nodeRequire = createRequire(import.meta.url);

/** The running kernel's tslab module, as cells see it (null outside a tslab kernel). */
function kernelTslab(): TslabPublic | null {
  const hook = (globalThis as { __tslab__?: TslabHook }).__tslab__;
  if (hook === undefined || typeof hook.require !== "function") return null;
  try {
    const mod = hook.require("tslab") as TslabPublic;
    return typeof mod?.newDisplay === "function" ? mod : null;
  } catch {
    return null;
  }
}

/** tslab's display writer for the cell now running: the jupyter module beside the public one. */
function kernelWriter(pub: TslabPublic): WriteDisplay | null {
  const cache = nodeRequire.cache;
  for (const entry of Object.values(cache)) {
    if (entry?.exports !== pub) continue;
    const jupyter = cache[join(dirname(entry.filename), "jupyter.js")]?.exports as { lastWriteDisplayData?: unknown } | undefined;
    const write = jupyter?.lastWriteDisplayData;
    return typeof write === "function" ? (write as WriteDisplay) : null;
  }
  return null;
}

/** Which way output goes from here. */
export function channelKind(): ChannelKind {
  const pub = kernelTslab();
  if (pub === null) return "text";
  return kernelWriter(pub) === null ? "tslab-public" : "tslab";
}

/** A fresh display id (Jupyter keeps it transient: it is not saved in the notebook file). */
export function newDisplayId(): string {
  return `halfplus-${randomBytes(6).toString("hex")}`;
}

const PREFERENCE = ["text/html", "image/svg+xml", "text/markdown", "text/plain"];

// Public-API fallback: one Display per id, so later sends update the same output.
const publicDisplays = new Map<string, { raw(contentType: string, body: string): void }>();

function plainData(bundle: MimeBundle): Record<string, string> {
  const data: Record<string, string> = {};
  for (const [k, v] of Object.entries(bundle)) if (typeof v === "string") data[k] = v;
  return data;
}

/**
 * Shows a bundle as a new output. With `displayId`, later `updateOutput` calls with the same id
 * replace it in place. Outside a kernel the text/plain form goes to stdout.
 */
export function displayOutput(bundle: MimeBundle, displayId?: string): void {
  send(bundle, displayId, false);
}

/** Replaces the output shown earlier with `displayId` (Jupyter's update_display_data). */
export function updateOutput(bundle: MimeBundle, displayId: string): void {
  send(bundle, displayId, true);
}

function send(bundle: MimeBundle, displayId: string | undefined, update: boolean): void {
  const pub = kernelTslab();
  if (pub === null) {
    process.stdout.write(bundle["text/plain"].endsWith("\n") ? bundle["text/plain"] : `${bundle["text/plain"]}\n`);
    return;
  }
  const write = kernelWriter(pub);
  if (write !== null) {
    write({ data: plainData(bundle), metadata: {}, transient: displayId === undefined ? {} : { display_id: displayId } }, update);
    return;
  }
  const mime = PREFERENCE.find((m) => typeof bundle[m] === "string") ?? "text/plain";
  const key = displayId ?? newDisplayId();
  let d = publicDisplays.get(key);
  if (d === undefined) {
    d = pub.newDisplay();
    publicDisplays.set(key, d);
  }
  d.raw(mime, bundle[mime]!);
}
