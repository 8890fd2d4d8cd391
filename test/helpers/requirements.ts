// What a test needs from outside the repository (a Debian tool, a Python module, reference data)
// and what happens when it is missing: on a user's clone the test skips and says what it needs;
// under CI (CI=true) it fails and names what is missing, so a broken install cannot pass as green.
import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { describe, it } from "vitest";

/**
 * The shared reference data (G-set graphs and tables, NIST StRD): `../shared/reference` beside the
 * repository, or wherever HALFPLUS_REFERENCE points (a CI machine that keeps it elsewhere).
 */
export const REFERENCE = process.env.HALFPLUS_REFERENCE ?? resolve(dirname(fileURLToPath(import.meta.url)), "..", "..", "..", "shared", "reference");

/** CI sets CI=true; there a missing requirement is a failure, not a skip. */
export const STRICT = process.env.CI === "true" || process.env.CI === "1";

export type Requirement =
  | { kind: "tool"; name: string }
  | { kind: "python"; module: string }
  | { kind: "file"; path: string; label?: string }
  | { kind: "check"; label: string; ok: () => boolean };

const cache = new Map<string, boolean>();

function memo(key: string, probe: () => boolean): boolean {
  let v = cache.get(key);
  if (v === undefined) {
    try {
      v = probe();
    } catch {
      v = false;
    }
    cache.set(key, v);
  }
  return v;
}

/** A program on PATH, e.g. tool("nauty-geng"). */
export function tool(name: string): Requirement {
  return { kind: "tool", name };
}

/** A module python3 can import, e.g. python("networkx"). */
export function python(module: string): Requirement {
  return { kind: "python", module };
}

/** A file or folder, e.g. the reference data in ../shared. */
export function file(path: string, label?: string): Requirement {
  return { kind: "file", path, label };
}

/** Anything else that can be probed (a compiler works, a build exists). */
export function check(label: string, ok: () => boolean): Requirement {
  return { kind: "check", label, ok };
}

function describeRequirement(r: Requirement): string {
  switch (r.kind) {
    case "tool":
      return `the program ${r.name} (not on PATH)`;
    case "python":
      return `the Python module ${r.module} (python3 cannot import it)`;
    case "file":
      return r.label ?? r.path;
    case "check":
      return r.label;
  }
}

function present(r: Requirement): boolean {
  switch (r.kind) {
    case "tool":
      return memo(`tool:${r.name}`, () => spawnSync("sh", ["-c", `command -v '${r.name.replace(/'/g, "")}'`]).status === 0);
    case "python":
      return memo(`py:${r.module}`, () => spawnSync("python3", ["-c", `import ${r.module}`]).status === 0);
    case "file":
      return existsSync(r.path);
    case "check":
      return memo(`check:${r.label}`, r.ok);
  }
}

/** Descriptions of the requirements that are not met (empty when all are). */
export function missing(reqs: readonly Requirement[]): string[] {
  return reqs.filter((r) => !present(r)).map(describeRequirement);
}

/** True when every requirement is met. */
export function available(...reqs: Requirement[]): boolean {
  return missing(reqs).length === 0;
}

type TestFn = () => unknown | Promise<unknown>;

/**
 * `it` that needs something from outside: runs when present; otherwise skips (saying what it
 * needs) or, under CI, fails naming what is missing.
 */
export function itNeeds(reqs: readonly Requirement[], name: string, fn: TestFn, timeout?: number): void {
  const miss = missing(reqs);
  if (miss.length === 0) it(name, fn, timeout);
  else if (STRICT) it(name, () => {
    throw new Error(`CI is missing ${miss.join(", ")}`);
  });
  else it.skip(`${name} [needs ${miss.join(", ")}]`, fn);
}

/** `describe` whose every test needs something from outside; same rule as itNeeds. */
export function describeNeeds(reqs: readonly Requirement[], name: string, body: () => void): void {
  const miss = missing(reqs);
  if (miss.length === 0) describe(name, body);
  else if (STRICT) describe(name, () => {
    it(`requirements of "${name}"`, () => {
      throw new Error(`CI is missing ${miss.join(", ")}`);
    });
  });
  else describe.skip(`${name} [needs ${miss.join(", ")}]`, body);
}
