// The closing cell of a notebook: how its numbers were made (package versions, runtime, the
// notebook's own parameters), as a small table.

import { halfplusVersion, plotlyBundle } from "halfplus";
import type { MimeBundle } from "./channel.js";
import { displayOutput } from "./channel.js";
import { tableBundle } from "./table.js";

/** Versions of tslab and its TypeScript as the running kernel reports them (null outside one). */
function kernelVersions(): { tslab: string; typescript: string } | null {
  const hook = (globalThis as { __tslab__?: { require(id: string): unknown } }).__tslab__;
  try {
    const v = (hook?.require("tslab") as { versions?: { tslab: string; typescript: string } } | undefined)?.versions;
    return v ? { tslab: v.tslab, typescript: v.typescript } : null;
  } catch {
    return null;
  }
}

/** Versions and runtime, then the caller's entries (seeds, specs, budgets, store path) in their order. */
export function provenanceRecord(extra: Readonly<Record<string, unknown>> = {}): Record<string, unknown> {
  const k = kernelVersions();
  return {
    halfplus: halfplusVersion(),
    node: process.version,
    ...(k ? { tslab: k.tslab, "TypeScript (kernel)": k.typescript } : {}),
    "plotly.js": plotlyBundle().version,
    platform: `${process.platform} ${process.arch}`,
    executed: new Date().toISOString().replace(/\.\d+Z$/, "Z"),
    ...extra,
  };
}

/** The bundle `provenance` shows. */
export function provenanceBundle(extra: Readonly<Record<string, unknown>> = {}): MimeBundle {
  const rec = provenanceRecord(extra);
  return tableBundle(
    Object.entries(rec).map(([what, value]) => ({ what, value })),
    { caption: "provenance", columns: ["what", "value"] },
  );
}

/** Shows the provenance table. */
export function provenance(extra: Readonly<Record<string, unknown>> = {}): void {
  displayOutput(provenanceBundle(extra));
}
