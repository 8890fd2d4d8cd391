// The memory budget: large allocations are sized before they are made and refused, with the file
// or parameter named, when they would not fit, instead of dying with "Array buffer allocation failed".
// The cap is HALFPLUS_MEMORY_LIMIT (bytes, or with a K/M/G/T suffix) for the whole process, else 80%
// of the memory the system reports available at the moment of the check (a cgroup limit included).

import { freemem, totalmem } from "node:os";
import { InputError } from "../errors.js";

/** Environment variable holding the process-wide memory cap, e.g. `HALFPLUS_MEMORY_LIMIT=4G`. */
export const MEMORY_LIMIT_ENV = "HALFPLUS_MEMORY_LIMIT";

/** Share of the available memory one allocation may take when no cap is set. */
const AVAILABLE_SHARE = 0.8;

const UNITS: Readonly<Record<string, number>> = Object.freeze({ "": 1, K: 2 ** 10, M: 2 ** 20, G: 2 ** 30, T: 2 ** 40 });

/** "512M", "2G", "1.5G", "1073741824" (binary units, an optional trailing B), or throws naming `where`. */
export function parseByteSize(text: string, where: string): number {
  const m = /^([0-9]+(?:\.[0-9]+)?)\s*([KMGT]?)i?B?$/i.exec(text.trim());
  const bytes = m === null ? NaN : Number(m[1]) * UNITS[m[2].toUpperCase()];
  if (!(bytes >= 1 << 20) || !Number.isFinite(bytes)) {
    throw new InputError(`${where}: expected a memory size of at least 1M such as 512M or 4G (got ${JSON.stringify(text.slice(0, 40))})`);
  }
  return Math.floor(bytes);
}

/** "1.5 GB"-style text for messages. */
export function formatBytes(bytes: number): string {
  if (bytes >= 2 ** 30) return `${(bytes / 2 ** 30).toFixed(1)} GB`;
  if (bytes >= 2 ** 20) return `${(bytes / 2 ** 20).toFixed(1)} MB`;
  return `${Math.ceil(bytes / 1024)} KB`;
}

export interface MemoryRoom {
  /** Bytes one more allocation may take now. */
  bytes: number;
  /** Where the figure comes from, for the message. */
  basis: string;
}

/** How much memory a new allocation may take now (see the module header). */
export function memoryRoom(): MemoryRoom {
  const env = process.env[MEMORY_LIMIT_ENV];
  const used = process.memoryUsage.rss();
  if (env !== undefined && env.trim() !== "") {
    const cap = parseByteSize(env, MEMORY_LIMIT_ENV);
    return { bytes: Math.max(0, cap - used), basis: `${MEMORY_LIMIT_ENV}=${env.trim()}` };
  }
  let available = freemem();
  // Under a cgroup limit (containers, Slurm jobs) the machine's free memory overstates ours.
  const constrained = typeof process.constrainedMemory === "function" ? process.constrainedMemory() : 0;
  if (constrained !== undefined && constrained > 0 && constrained < totalmem()) available = Math.min(available, constrained - used);
  return { bytes: Math.max(0, Math.floor(AVAILABLE_SHARE * available)), basis: `${Math.round(AVAILABLE_SHARE * 100)}% of the memory available; set ${MEMORY_LIMIT_ENV} to change the cap` };
}

/**
 * Refuse, before allocating, something that needs about `bytes` of memory when it would not fit.
 * `what` names the file, line or parameter responsible, e.g. "G1.txt:1" or "complete:n=30000".
 */
export function checkMemory(bytes: number, what: string): void {
  if (!(bytes >= 0)) bytes = Infinity;
  // Small requests are never worth a system call.
  if (bytes < 64 * 2 ** 20) return;
  const room = memoryRoom();
  if (bytes > room.bytes) {
    throw new InputError(`${what}: needs about ${formatBytes(bytes)} of memory, more than the ${formatBytes(room.bytes)} it may use (${room.basis})`);
  }
}

/** Peak bytes of building a CSR graph with n vertices and m edges (input arrays, degree counts, CSR, sort scratch). */
export function graphBuildBytes(n: number, m: number, weighted: boolean): number {
  return 16 * (n + 1) + 32 * m + (weighted ? 40 * m : 0);
}

/** Bytes of a built CSR graph (offsets, neighbours, weights). */
export function graphBytes(n: number, m: number, weighted: boolean): number {
  return 4 * (n + 1) + 8 * m + (weighted ? 16 * m : 0);
}
