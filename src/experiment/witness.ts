// Compact evidence for stored rows: a partition as packed bits behind a one-byte codec tag
// (0: as is, 1: raw deflate); JSON as text, or as a tagged blob of UTF-8 when it is 1 KB or more.
// Short payloads stay as they are: zlib would barely shrink them and its set-up costs more than
// the rest of a tiny job's row. Deflate at a fixed level is deterministic: equal inputs, equal blobs.

import { deflateRawSync, inflateRawSync } from "node:zlib";
import { InputError } from "../errors.js";

const PLAIN = 0;
const DEFLATE = 1;
const COMPRESS_FROM = 1024;

function wrap(payload: Uint8Array): Uint8Array {
  const packed = payload.length >= COMPRESS_FROM ? deflateRawSync(payload, { level: 6 }) : null;
  const useDeflate = packed !== null && packed.length < payload.length;
  const body = useDeflate ? packed : payload;
  const out = new Uint8Array(body.length + 1);
  out[0] = useDeflate ? DEFLATE : PLAIN;
  out.set(body, 1);
  return out;
}

function unwrap(blob: Uint8Array, what: string): Uint8Array {
  if (blob.length === 0) throw new InputError(`${what}: empty blob`);
  const body = blob.subarray(1);
  if (blob[0] === PLAIN) return body;
  if (blob[0] === DEFLATE) {
    try {
      return inflateRawSync(body);
    } catch {
      throw new InputError(`${what}: corrupt compressed data`);
    }
  }
  throw new InputError(`${what}: unknown codec ${blob[0]}`);
}

/** Partition (0/1 per vertex) → bit i of byte ⌊i/8⌋ is vertex i's side, then compressed. */
export function packPartition(partition: ArrayLike<number>): Uint8Array {
  const n = partition.length;
  const bits = new Uint8Array((n + 7) >> 3);
  for (let i = 0; i < n; i++) if (partition[i] === 1) bits[i >> 3] |= 1 << (i & 7);
  return wrap(bits);
}

/** The partition of n vertices stored by packPartition. */
export function unpackPartition(blob: Uint8Array, n: number, what = "witness"): number[] {
  const bits = unwrap(blob, what);
  if (bits.length !== (n + 7) >> 3) throw new InputError(`${what}: holds ${bits.length * 8} bits, expected ${n} vertices`);
  const out = new Array<number>(n);
  for (let i = 0; i < n; i++) out[i] = (bits[i >> 3] >> (i & 7)) & 1;
  return out;
}

/** Any JSON value: as JSON text when short, compressed (a blob) from 1 KB on. */
export function packJson(value: unknown): string | Uint8Array {
  const text = JSON.stringify(value);
  // Short text stays text: readable in the store, and no byte copies for the many tiny rows.
  if (text.length < COMPRESS_FROM) return text;
  return wrap(Buffer.from(text, "utf8"));
}

export function unpackJson(stored: Uint8Array | string, what: string): unknown {
  const text = typeof stored === "string" ? stored : Buffer.from(unwrap(stored, what)).toString("utf8");
  try {
    return JSON.parse(text);
  } catch {
    throw new InputError(`${what}: not valid JSON`);
  }
}
