// The packed form of tree certificates (src/cut/tree/tree-codec.ts): what it keeps, that verify
// re-proves every region from it, that forged, truncated or padded byte strings are refused with one
// line, and that random edits of the bytes never make verify accept a bound below the max cut.
// Oracle: brute-force max cut (test/helpers/maxcut.ts, written apart from src/cut; common practice,
// no source); exactMaxCut agrees with it here.

import { deflateRawSync, inflateRawSync } from "node:zlib";
import { beforeAll, describe, expect, it } from "vitest";
import { bracket } from "../src/cut/bracket/bracket.js";
import type { BracketRecord } from "../src/cut/bracket/record.js";
import { parseBracketRecord, verifyBracket } from "../src/cut/bracket/verify.js";
import { exactMaxCut } from "../src/cut/exact/exact-max-cut.js";
import { relaxationTreeSearch, verifyTreeCertificate, type TreeCertificate, type TreeRegion, type TreeSearchRecord } from "../src/cut/tree/relaxation-tree.js";
import { packTreeRegions, unpackTreeRegions, type PackedTreeRegions } from "../src/cut/tree/tree-codec.js";
import { InputError } from "../src/errors.js";
import { family } from "../src/families/registry.js";
import type { Graph } from "../src/graph/graph.js";
import { Rng } from "../src/random/prng.js";
import { packJson, unpackJson } from "../src/experiment/witness.js";
import { bruteForceMaxCut } from "./helpers/maxcut.js";

const clone = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;

let g: Graph;
let maxCut: number;
let plain: TreeSearchRecord;
let tri: TreeSearchRecord;

beforeAll(() => {
  g = family("gnp:n=24,p=0.5,seed=2");
  maxCut = bruteForceMaxCut(g);
  // Deterministic node budgets; both searches close (checked below), the plain one with 23 regions
  // (exhaustive and triangle-dual), the triangle-bounded one with 4 holding 601 inequalities.
  const opts = { branching: "most-decided" as const, work: 400, solverSeed: 1, rootRounds: 20, roundsPerNode: 10 };
  plain = relaxationTreeSearch(g, { ...opts, relaxation: "plain" });
  tri = relaxationTreeSearch(g, { ...opts, relaxation: "triangles" });
});

/** A region's identity apart from y: path, bound, kind, shift, inequalities and multipliers. */
const key = (r: TreeRegion): string => JSON.stringify({ ...r, certificate: { ...r.certificate, y: undefined } });

/** The raw bytes of a packed certificate, and the packed form of (edited) raw bytes, as a careful forger would make it. */
const rawOf = (p: PackedTreeRegions): Uint8Array => inflateRawSync(Buffer.from(p.data, "base64"));
const repack = (p: PackedTreeRegions, raw: Uint8Array, regions = p.regions): PackedTreeRegions => ({ ...p, regions, bytes: raw.length, data: Buffer.from(deflateRawSync(raw)).toString("base64") });

/** The tree check of a packed certificate, decoding included: a decoding fault is a failed check with its one-line reason. */
function check(cert: TreeCertificate, packed: PackedTreeRegions): { ok: boolean; bound: number; message: string } {
  let regions: TreeRegion[];
  try {
    regions = unpackTreeRegions(clone(packed), g.n);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return { ok: false, bound: NaN, message: (e as Error).message };
  }
  return verifyTreeCertificate(g, { ...cert, regions });
}

describe("packed tree certificates", () => {
  it("both searches close at the brute-force max cut (exactMaxCut agrees)", () => {
    expect(exactMaxCut(g).value).toBe(maxCut);
    for (const r of [plain, tri]) {
      expect(r.status).toBe("optimal");
      expect(r.value).toBe(maxCut);
    }
    expect(new Set(plain.certificate.regions.map((x) => x.certificate.kind))).toEqual(new Set(["exhaustive", "triangle-dual"]));
    expect(tri.certificate.regions.some((x) => x.certificate.kind === "triangle-dual" && x.certificate.mu.length > 0)).toBe(true);
  });

  it("keep every path, bound, shift, inequality and multiplier exactly; y only rounded up, and verify re-proves the closure", () => {
    for (const r of [plain, tri]) {
      const cert = r.certificate;
      const packed = packTreeRegions(g, cert);
      expect(packed.regions).toBe(cert.regions.length);
      const back = unpackTreeRegions(clone(packed), g.n);
      expect(back.map(key).sort()).toEqual(cert.regions.map(key).sort());
      const original = new Map(cert.regions.map((x) => [key(x), x]));
      let entries = 0;
      for (const b of back) {
        const a = original.get(key(b))!;
        if (a.certificate.kind !== "triangle-dual" || b.certificate.kind !== "triangle-dual") continue;
        expect(b.certificate.y.length).toBe(a.certificate.y.length);
        // Rounded up to a multiple of 2^-2 at the coarsest: y' ≥ y and y' − y < 1/4.
        a.certificate.y.forEach((y, i) => {
          const d = (b.certificate as { y: number[] }).y[i] - y;
          expect(d >= 0 && d < 0.25).toBe(true);
          entries++;
        });
      }
      expect(entries).toBeGreaterThan(0);
      const v = verifyTreeCertificate(g, { ...cert, regions: back });
      expect(v.ok, v.message).toBe(true);
      expect(v.bound).toBe(maxCut);
      // The same regions give the same text (raw deflate at a fixed level).
      expect(packTreeRegions(g, cert)).toEqual(packed);
      // Doubles throughout (`exact`): y comes back bit for bit.
      const exact = unpackTreeRegions(clone(packTreeRegions(g, cert, { exact: true })), g.n);
      expect(exact.map((x) => JSON.stringify(x)).sort()).toEqual(cert.regions.map((x) => JSON.stringify(x)).sort());
      // Smaller than the JSON arrays: by a factor of 2 at least here (μ stays in doubles), about ten on ER_7 (DEVELOPERS.md).
      expect(JSON.stringify(packed).length * 2).toBeLessThan(JSON.stringify(cert.regions).length);
    }
  });

  it("refuse forged, truncated and padded byte strings with one line", () => {
    const cert = plain.certificate;
    const packed = packTreeRegions(g, cert);
    const raw = rawOf(packed);
    const forgeries: [string, PackedTreeRegions, RegExp][] = [
      ["base64 cut short", { ...packed, data: packed.data.slice(0, Math.floor(packed.data.length / 8) * 4) }, /does not inflate|inflates to/],
      ["raw bytes cut short, lengths consistent", repack(packed, raw.subarray(0, raw.length - 5)), /ends early/],
      ["a byte appended", repack(packed, Uint8Array.from([...raw, 0])), /bytes after the last/],
      ["one region more than the data holds", repack(packed, raw, packed.regions + 1), /ends early/],
      ["one region fewer", repack(packed, raw, packed.regions - 1), /bytes after the last/],
      ["stated length too short", { ...packed, bytes: packed.bytes - 1 }, /does not inflate|inflates to/],
      ["stated length too long", { ...packed, bytes: packed.bytes + 1 }, /inflates to/],
      ["not base64", { ...packed, data: `${packed.data.slice(0, -4)}*AAA` }, /not base64/],
      ["another format", { ...packed, format: "halfplus/tree-regions-0" as PackedTreeRegions["format"] }, /unknown format/],
      ["a precision finer than 2^-52", repack(packed, (() => { const b = Uint8Array.from(raw); b[precisionOffset(b)] = 60; return b; })()), /finer than/],
    ];
    for (const [what, forged, reason] of forgeries) {
      const v = check(cert, forged);
      expect(v.ok, what).toBe(false);
      expect(v.message, what).toMatch(reason);
      expect(v.message, what).not.toMatch(/\n/);
    }
  });

  it("refuse re-encoded certificates that drop a region, lower a bound or lower y", () => {
    for (const r of [plain, tri]) {
      const cert = r.certificate;
      const idx = cert.regions.findIndex((x) => x.certificate.kind === "triangle-dual");
      const dropped = { ...cert, regions: cert.regions.filter((_, i) => i !== idx) };
      expect(check(cert, packTreeRegions(g, dropped, { exact: true })).message).toMatch(/do not cover every cut/);
      const lowered = clone(cert);
      lowered.regions[idx].bound -= 1;
      expect(check(cert, packTreeRegions(g, lowered, { exact: true })).message).toMatch(/above the claimed/);
      const bent = clone(cert);
      (bent.regions[idx].certificate as { y: number[] }).y[1] -= 1;
      const v = check(cert, packTreeRegions(g, bent, { exact: true }));
      expect(v.ok).toBe(false);
      expect(v.message).toMatch(/Cholesky|above the claimed/);
    }
  });

  it("random byte edits never make verify accept a bound below the max cut", () => {
    const rng = new Rng(11, 0);
    let accepted = 0, refused = 0;
    for (const r of [plain, tri]) {
      const packed = packTreeRegions(g, r.certificate);
      const raw = rawOf(packed);
      for (let t = 0; t < 150; t++) {
        const b = Uint8Array.from(raw);
        const edits = 1 + rng.nextInt(3);
        for (let e = 0; e < edits; e++) b[rng.nextInt(b.length)] = rng.nextInt(256);
        const v = check(r.certificate, repack(packed, b));
        if (v.ok) {
          accepted++;
          expect(v.bound).toBeGreaterThanOrEqual(maxCut);
        } else {
          refused++;
          expect(v.message).not.toMatch(/\n/);
        }
      }
    }
    expect(accepted + refused).toBe(300);
    expect(refused).toBeGreaterThan(0);
  });
});

/** Offset of the precision byte of the first triangle-dual region (walks the layout of tree-codec.ts). */
function precisionOffset(b: Uint8Array): number {
  let at = 0;
  const varint = (): number => {
    let x = 0, scale = 1;
    for (;;) {
      const c = b[at++];
      x += (c & 127) * scale;
      if (c < 128) return x;
      scale *= 128;
    }
  };
  for (;;) {
    varint();
    const add = varint();
    for (let i = 0; i < add; i++) varint();
    varint();
    const kind = b[at++];
    if (kind === 1) {
      varint();
      return at;
    }
  }
}

describe("bracket records with packed tree certificates", () => {
  /** An honest record of g whose upper end is the plain search's tree, in the form given. */
  function treeRecord(form: "packed" | "plain"): BracketRecord {
    const base = clone(bracket(g, { work: 2e6, solverSeed: 1 }));
    const c = plain.certificate;
    return {
      ...base, lower: plain.value, upper: plain.upper, exact: true, upperKind: "proven", surplusLower: plain.value - g.totalWeight / 2, surplusUpper: plain.upper - g.totalWeight / 2,
      partition: Array.from(plain.partition), upperMethod: plain.method,
      certificate: { kind: "sdp-tree", rootVertex: c.rootVertex, relaxation: "plain", ...(form === "packed" ? { packed: packTreeRegions(g, c) } : { regions: c.regions }), nodes: plain.nodes, roundedDown: true, tolerance: 0 },
    };
  }

  it("verify accepts the packed form and the plain form of earlier builds", () => {
    for (const form of ["packed", "plain"] as const) {
      const rec = parseBracketRecord(clone(treeRecord(form)), "test");
      const v = verifyBracket(g, rec);
      expect(v.ok, JSON.stringify(v.checks)).toBe(true);
      expect(v.verdict).toBe("verified");
    }
  });

  it("a results store's certificate column keeps either form as it is (packJson/unpackJson, src/experiment/witness.ts)", () => {
    for (const form of ["packed", "plain"] as const) {
      const rec = treeRecord(form);
      const stored = unpackJson(packJson(rec.certificate), "test") as BracketRecord["certificate"];
      expect(stored).toEqual(clone(rec.certificate));
      expect(verifyBracket(g, { ...rec, certificate: stored }).verdict).toBe("verified");
    }
  });

  it("a record with both forms, neither, or a malformed packed field is bad input naming the field", () => {
    const both = treeRecord("packed");
    (both.certificate as { regions?: unknown }).regions = plain.certificate.regions;
    const neither = treeRecord("packed");
    delete (neither.certificate as { packed?: unknown }).packed;
    const noData = treeRecord("packed");
    (noData.certificate as { packed: { data?: unknown } }).packed.data = 7;
    for (const [rec, field] of [[both, "certificate"], [neither, "certificate"], [noData, "certificate.packed.data"]] as const) {
      expect(() => parseBracketRecord(clone(rec), "test")).toThrow(InputError);
      expect(() => parseBracketRecord(clone(rec), "test")).toThrow(field);
    }
  });

  it("a truncated packed certificate is rejected in one line: the upper check fails, the record is rejected", () => {
    const rec = treeRecord("packed");
    const p = (rec.certificate as { packed: PackedTreeRegions }).packed;
    p.data = p.data.slice(0, Math.floor(p.data.length / 8) * 4);
    const v = verifyBracket(g, parseBracketRecord(clone(rec), "test"));
    expect(v.verdict).toBe("rejected");
    const upper = v.checks.find((c) => c.name === "upper")!;
    expect(upper.ok).toBe(false);
    expect(upper.message).toMatch(/^tree certificate rejected: certificate\.packed: /);
    expect(upper.message).not.toMatch(/\n/);
  });
});
