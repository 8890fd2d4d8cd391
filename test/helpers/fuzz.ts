// Seeded generators of hostile input for the fuzz suite (test/fuzz.test.ts; larger runs through
// bench/fuzz.bench.mjs): valid encodings of random graphs, byte-level and token-level mutations of
// them, lying headers, random family specs, and mutated bracket records. Common practice, no source.
import { Rng } from "../../src/random/prng.js";
import type { Graph } from "../../src/graph/graph.js";
import { writeGraph } from "../../src/graph/formats/write.js";
import type { GraphFormat } from "../../src/graph/formats/types.js";
import { encodeGraphSize } from "../../src/graph/formats/graph-size.js";
import { listFamilies } from "../../src/families/registry.js";
import { randomGraph } from "./graphs.js";

export const FORMATS: readonly GraphFormat[] = ["graph6", "sparse6", "edgelist", "gset", "dimacs"];

/** Tokens that break number parsers: signs, prefixes, overflow, words, blanks. */
const NASTY_NUMBERS = ["-1", "0", "0x10", "0b101", "0o7", "1e400", "-1e400", "NaN", "Infinity", "1.5", "4294967296", "2147483648", "99999999999999999999", "100000000", "", " ", "1e-400", "+3", ".5", "5.", "٣"];

function pick<T>(rng: Rng, xs: readonly T[]): T {
  return xs[rng.nextInt(xs.length)];
}

/** A small random graph in a form every format can hold (unweighted for graph6/sparse6/DIMACS). */
export function smallGraph(rng: Rng, weighted: boolean): Graph {
  const n = rng.nextInt(12);
  const weight = weighted ? (r: Rng) => pick(r, [1, 2, -1, 0.5, 1e-9, 123456789.25, -3.75]) : undefined;
  return randomGraph(n, rng.nextFloat(), rng, { weight });
}

/** One random edit of the bytes: the faults of a damaged file or a hostile writer. */
export function mutateBytes(bytes: Uint8Array, rng: Rng): Uint8Array {
  const b = Array.from(bytes);
  const at = () => (b.length === 0 ? 0 : rng.nextInt(b.length + 1));
  switch (rng.nextInt(10)) {
    case 0: // flip one bit
      if (b.length > 0) b[rng.nextInt(b.length)] ^= 1 << rng.nextInt(8);
      break;
    case 1: // a random byte anywhere (NUL, controls, high bytes included)
      b.splice(at(), 0, rng.nextInt(256));
      break;
    case 2: // delete a range
      b.splice(at(), 1 + rng.nextInt(4));
      break;
    case 3: // truncate
      b.length = rng.nextInt(b.length + 1);
      break;
    case 4: // duplicate a range
    {
      const s = at();
      b.splice(s, 0, ...b.slice(s, s + 1 + rng.nextInt(8)));
      break;
    }
    case 5: // a nasty number token
      b.splice(at(), 0, ...Buffer.from(` ${pick(rng, NASTY_NUMBERS)} `));
      break;
    case 6: // line breaks of other systems
      b.splice(at(), 0, ...pick(rng, [[13], [13, 10], [10, 10], [0]]));
      break;
    case 7: // replace a byte with a printable one
      if (b.length > 0) b[rng.nextInt(b.length)] = 32 + rng.nextInt(95);
      break;
    case 8: // a header word of another format
      b.splice(at(), 0, ...Buffer.from(pick(rng, [">>graph6<<", ">>sparse6<<", ":", "p edge ", "e ", "# edgelist n=", "c ", "&", ";"])));
      break;
    default: // a whole random line
      b.splice(at(), 0, ...Array.from({ length: rng.nextInt(20) }, () => rng.nextInt(256)), 10);
  }
  return Uint8Array.from(b);
}

/** Inputs that declare far more than they hold: sizes a reader must refuse before allocating. */
export function lyingInput(rng: Rng): { bytes: Uint8Array; format: GraphFormat } {
  const huge = pick(rng, [1e8, 2 ** 30, 2 ** 31 - 1, 2 ** 36 - 1, 5e7, 3e7]);
  switch (rng.nextInt(4)) {
    case 0:
      return { bytes: Buffer.from(`:${encodeGraphSize(Math.min(huge, 2 ** 36 - 1))}\n`), format: "sparse6" };
    case 1:
      return { bytes: Buffer.from(`${huge} ${rng.nextInt(3)}\n1 2 1\n`), format: "gset" };
    case 2:
      return { bytes: Buffer.from(`p edge ${huge} 1\ne 1 2\n`), format: "dimacs" };
    default:
      return { bytes: Buffer.from(`# edgelist n=${huge}\n0 1\n`), format: "edgelist" };
  }
}

export interface ReaderCase {
  bytes: Uint8Array;
  /** Format to force, or undefined for detection. */
  format: GraphFormat | undefined;
  /** When the bytes are an unmutated encoding: the graph they must decode to. */
  expected: Graph | null;
}

/** A reader case: a valid encoding, a mutated one, a lying header, or random bytes. */
export function readerCase(rng: Rng): ReaderCase {
  const kind = rng.nextInt(20);
  if (kind === 0) {
    const { bytes, format } = lyingInput(rng);
    return { bytes, format: rng.nextInt(2) === 0 ? format : undefined, expected: null };
  }
  if (kind === 1) return { bytes: Uint8Array.from({ length: rng.nextInt(64) }, () => rng.nextInt(256)), format: rng.nextInt(2) === 0 ? pick(rng, FORMATS) : undefined, expected: null };
  const format = pick(rng, FORMATS);
  const g = smallGraph(rng, format === "edgelist" || format === "gset");
  let bytes: Uint8Array = Buffer.from(writeGraph(g, format));
  if (kind <= 4) return { bytes, format, expected: g };
  const edits = 1 + rng.nextInt(3);
  for (let i = 0; i < edits; i++) bytes = mutateBytes(bytes, rng);
  return { bytes, format: rng.nextInt(3) === 0 ? undefined : format, expected: null };
}

/** A random value for a family parameter: mostly small and valid, sometimes hostile. */
function paramValue(rng: Rng, type: string, depth: number): string {
  const r = rng.nextInt(10);
  if (type === "spec") return `[${randomSpec(rng, depth + 1)}]`;
  if (type === "spec-list") return Array.from({ length: 1 + rng.nextInt(3) }, () => `[${randomSpec(rng, depth + 1)}]`).join("+");
  if (type === "integer-list") return Array.from({ length: 1 + rng.nextInt(4) }, () => (r === 0 ? pick(rng, NASTY_NUMBERS) : String(rng.nextInt(8)))).join("+");
  if (type === "number") return r === 0 ? pick(rng, NASTY_NUMBERS) : (rng.nextFloat() * 1.2).toFixed(3);
  if (type === "string") return pick(rng, ["K3", "C4", "K2,3", "C5", "bad", "", "pairing", "steger-wormald", "true"]);
  if (type === "boolean") return pick(rng, ["true", "false", "1", "yes"]);
  // integer: hostile values are out of range, non-decimal or big enough for the memory budget to refuse
  return r === 0 ? pick(rng, NASTY_NUMBERS) : r === 1 ? pick(rng, ["1000000000", "50000000", "2147483647", "30000"]) : String(rng.nextInt(13));
}

/** A random family spec: a registered family with random parameters, nested up to a few levels. */
export function randomSpec(rng: Rng, depth = 0): string {
  const defs = listFamilies();
  const def = depth > 2 ? pick(rng, defs.filter((d) => d.params.every((p) => p.type !== "spec" && p.type !== "spec-list"))) : pick(rng, defs);
  const parts: string[] = [];
  for (const p of def.params) if (rng.nextInt(8) !== 0) parts.push(`${p.name}=${paramValue(rng, p.type, depth)}`);
  if (def.random && rng.nextInt(2) === 0) parts.push(`seed=${rng.nextInt(4) === 0 ? pick(rng, NASTY_NUMBERS) : rng.nextInt(1000)}`);
  if (rng.nextInt(20) === 0) parts.push(`${pick(rng, ["x", "n", "seed"])}=1`);
  return parts.length === 0 ? def.name : `${def.name}:${parts.join(",")}`;
}

/** A spec string mutated at the character level (brackets, separators, deep nesting, junk). */
export function mutateSpec(spec: string, rng: Rng): string {
  switch (rng.nextInt(6)) {
    case 0:
      return spec.slice(0, rng.nextInt(spec.length + 1));
    case 1: {
      const i = rng.nextInt(spec.length + 1);
      return spec.slice(0, i) + pick(rng, ["[", "]", ",", "=", ":", "+", "\n", "\u0000", "é", "[[", "]]"]) + spec.slice(i);
    }
    case 2: {
      // Nesting deeper than the limit, with the same family all the way down.
      let s = "petersen";
      const levels = 30 + rng.nextInt(40);
      for (let k = 0; k < levels; k++) s = pick(rng, [`complement:of=[${s}]`, `blow-up:of=[${s}],t=1`, `disjoint-union:of=[${s}]`]);
      return s;
    }
    case 3:
      return `${spec},${spec}`;
    case 4:
      return spec.replace(/\d+/, pick(rng, NASTY_NUMBERS));
    default:
      return spec.repeat(1 + rng.nextInt(3));
  }
}

/** One structural edit of a parsed JSON record: wrong types, out-of-range numbers, missing or extra fields. */
export function mutateRecordValue(record: Record<string, unknown>, rng: Rng): Record<string, unknown> {
  const r = JSON.parse(JSON.stringify(record)) as Record<string, unknown>;
  const paths: string[][] = [];
  const walk = (x: unknown, path: string[]): void => {
    if (path.length > 0) paths.push(path);
    if (x !== null && typeof x === "object" && path.length < 3) {
      const keys = Object.keys(x as object);
      for (const k of keys.slice(0, 40)) walk((x as Record<string, unknown>)[k], [...path, k]);
    }
  };
  walk(r, []);
  const path = pick(rng, paths);
  let parent: Record<string, unknown> = r;
  for (const k of path.slice(0, -1)) parent = parent[k] as Record<string, unknown>;
  const key = path[path.length - 1];
  const old = parent[key];
  const values: unknown[] = [null, 0, -1, 0.5, 1e200, -1e200, "x", "", true, [], {}, [1e200], { spec: null }, { path: 123 }, { position: -1 }, { position: 0 }, { embedded: { format: "graph6", text: "~" } }, "/dev/zero", "sha256:" + "0".repeat(64)];
  switch (rng.nextInt(5)) {
    case 0:
      delete parent[key];
      break;
    case 1:
      parent[key] = pick(rng, values);
      break;
    case 2:
      parent[key] = typeof old === "number" ? old + pick(rng, [1, -1, 1e-9, -1e-9, 1e9, 0.5]) : pick(rng, values);
      break;
    case 3:
      parent[`${key}${pick(rng, ["", "X"])}2`] = pick(rng, values);
      break;
    default:
      parent[key] = Array.isArray(old) ? old.slice(0, rng.nextInt(old.length + 1)) : pick(rng, values);
  }
  return r;
}

/** Text of a record with a duplicated key inserted (what JSON.parse would silently resolve). */
export function duplicateKey(text: string, rng: Rng): string {
  const keys = [...text.matchAll(/"([a-zA-Z]+)":/g)].map((m) => m[1]);
  if (keys.length === 0) return text;
  const k = pick(rng, keys);
  return text.replace("{", `{"${k}":${pick(rng, ["0", "1e300", "\"x\"", "null", "{}"])},`);
}
