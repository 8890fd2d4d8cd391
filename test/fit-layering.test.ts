// src/fit sits below plot and cli and above experiment in the layer order (DECISIONS.md): it may
// import only errors.ts, random/ and its own modules (the rows it fits are plain data).
import { readdirSync, readFileSync } from "node:fs";
import { resolve } from "node:path";
import { describe, expect, it } from "vitest";

const FIT = resolve(__dirname, "..", "src", "fit");

describe("src/fit layering", () => {
  it("imports nothing but ../errors.js, ../random/ and ./ modules", () => {
    const files = readdirSync(FIT).filter((f) => f.endsWith(".ts"));
    expect(files).toContain("index.ts");
    for (const f of files) {
      const text = readFileSync(resolve(FIT, f), "utf8");
      for (const m of text.matchAll(/\bfrom\s+"([^"]+)"/g)) {
        const spec = m[1];
        const ok = spec.startsWith("./") || spec === "../errors.js" || spec === "../random/index.js";
        expect(ok, `${f} imports ${spec}`).toBe(true);
      }
    }
    // Every module is re-exported by the folder's index.
    const index = readFileSync(resolve(FIT, "index.ts"), "utf8");
    for (const f of files.filter((x) => x !== "index.ts")) expect(index).toContain(`./${f.replace(/\.ts$/, ".js")}`);
  });
});
