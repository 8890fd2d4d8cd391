import { execFileSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { Rng } from "../src/random/prng.js";
import { check, itNeeds } from "./helpers/requirements.js";

// Source: the xoshiro128** reference C code published by Blackman & Vigna (2018), public
// domain; retyped here from the paper's algorithm and compiled with the system C compiler.
const REFERENCE_C = `
#include <stdint.h>
#include <stdio.h>
static inline uint32_t rotl(const uint32_t x, int k) { return (x << k) | (x >> (32 - k)); }
static uint32_t s[4];
uint32_t next(void) {
  const uint32_t result = rotl(s[1] * 5, 7) * 9;
  const uint32_t t = s[1] << 9;
  s[2] ^= s[0]; s[3] ^= s[1]; s[1] ^= s[2]; s[0] ^= s[3];
  s[2] ^= t; s[3] = rotl(s[3], 11);
  return result;
}
int main(void) {
  s[0] = 0x01234567u; s[1] = 0x89abcdefu; s[2] = 0xdeadbeefu; s[3] = 0x00c0ffeeu;
  for (int i = 0; i < 1000; i++) printf("%u\\n", next());
  return 0;
}`;

function hasCompiler(): boolean {
  try {
    execFileSync("cc", ["--version"], { stdio: "ignore" });
    return true;
  } catch {
    return false;
  }
}

describe("xoshiro128**", () => {
  itNeeds([check("a C compiler, cc (gcc)", hasCompiler)], "matches the reference C implementation for 1000 outputs", () => {
    const dir = mkdtempSync(join(tmpdir(), "halfplus-prng-"));
    writeFileSync(join(dir, "x.c"), REFERENCE_C);
    execFileSync("cc", ["-O1", "-o", join(dir, "x"), join(dir, "x.c")]);
    const expected = execFileSync(join(dir, "x"), { encoding: "utf8" }).trim().split("\n").map(Number);
    const r = Rng.fromState(0x01234567, 0x89abcdef, 0xdeadbeef, 0x00c0ffee);
    const got = Array.from({ length: 1000 }, () => r.nextU32());
    expect(got).toEqual(expected);
  });

  it("is reproducible from a seed and differs across seeds and streams", () => {
    // Determinism, common practice, no source.
    const a = new Rng(42), b = new Rng(42), c = new Rng(43), d = new Rng(42, 1);
    const xs = Array.from({ length: 8 }, () => a.nextU32());
    expect(Array.from({ length: 8 }, () => b.nextU32())).toEqual(xs);
    expect(Array.from({ length: 8 }, () => c.nextU32())).not.toEqual(xs);
    expect(Array.from({ length: 8 }, () => d.nextU32())).not.toEqual(xs);
  });

  it("nextInt is uniform (chi-square, 20 cells, 10^5 draws)", () => {
    // Critical value chi2(19) at p = 0.001 is 43.82 (standard statistical tables).
    const r = new Rng(7);
    const cells = new Array(20).fill(0);
    const N = 100_000;
    for (let i = 0; i < N; i++) cells[r.nextInt(20)]++;
    const e = N / 20;
    const chi2 = cells.reduce((s, o) => s + ((o - e) * (o - e)) / e, 0);
    expect(chi2).toBeLessThan(43.82);
  });

  it("nextFloat lies in [0,1) and has mean 1/2", () => {
    const r = new Rng(9);
    let s = 0;
    for (let i = 0; i < 100_000; i++) {
      const x = r.nextFloat();
      expect(x >= 0 && x < 1).toBe(true);
      s += x;
    }
    // Standard error of the mean is sqrt(1/12/1e5) ≈ 9.1e-4; 5 standard errors.
    expect(Math.abs(s / 100_000 - 0.5)).toBeLessThan(5 * 9.2e-4);
  });

  it("rejects bad seeds with a message naming the seed", () => {
    // Input validation, common practice, no source.
    expect(() => new Rng(-1)).toThrow(/seed/);
    expect(() => new Rng(1.5)).toThrow(/seed/);
  });
});
