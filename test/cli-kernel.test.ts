// `halfplus kernel install` and `halfplus kernel status`: the kernelspec's shape (Jupyter's
// kernelspec format: argv with {connection_file}, display_name, language), that Jupyter's own
// `jupyter kernelspec list` finds it, the logos, and one-line errors / install hints.
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { BIN, ROOT, ensureBuilt } from "./helpers/cli.js";
import { decodePng } from "./helpers/png.js";
import { itNeeds, tool } from "./helpers/requirements.js";

ensureBuilt();
const work = mkdtempSync(join(tmpdir(), "halfplus-kernel-cli-"));
afterAll(() => rmSync(work, { recursive: true, force: true }));

function halfplus(args: string[], env: NodeJS.ProcessEnv = {}) {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: ROOT, encoding: "utf8", env: { ...process.env, PYDEVD_DISABLE_FILE_VALIDATION: "1", ...env }, timeout: 120_000 });
  return { code: r.status ?? -1, stdout: r.stdout, stderr: r.stderr };
}

describe("halfplus kernel install", () => {
  const prefix = join(work, "prefix");
  const dir = join(prefix, "share", "jupyter", "kernels", "halfplus");

  it("--prefix writes kernel.json that starts tslab's entry by absolute path with this Node, in TypeScript mode", () => {
    const r = halfplus(["kernel", "install", "--prefix", prefix]);
    expect(r.stderr).toBe("");
    expect(r.code).toBe(0);
    expect(r.stdout).toContain(dir);
    const spec = JSON.parse(readFileSync(join(dir, "kernel.json"), "utf8"));
    expect(spec.argv[0]).toBe(process.execPath);
    expect(spec.argv[1]).toBe(join(ROOT, "node_modules", "tslab", "bin", "tslab"));
    expect(existsSync(spec.argv[1])).toBe(true);
    // tslab's kernel command: `kernel --config-path {connection_file}`; `--js` would make it JavaScript.
    expect(spec.argv.slice(2)).toEqual(["kernel", "--config-path", "{connection_file}"]);
    expect(spec.language).toBe("typescript");
    expect(spec.display_name).toBe("halfplus · TypeScript");
    expect(spec.metadata.halfplus.tslab).toBe("1.0.22");
  });

  it("writes our logo as PNG at 32 and 64 pixels and as SVG", () => {
    for (const size of [32, 64]) {
      const png = decodePng(readFileSync(join(dir, `logo-${size}x${size}.png`)));
      expect([png.width, png.height, png.channels]).toEqual([size, size, 4]);
      // Common practice, no source: a logo is not one flat colour.
      const alphas = new Set<number>();
      for (let i = 3; i < png.pixels.length; i += 4) alphas.add(png.pixels[i]);
      expect(alphas.has(0) && alphas.has(255)).toBe(true);
    }
    expect(readFileSync(join(dir, "logo-svg.svg"), "utf8")).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/);
  });

  itNeeds([tool("xmllint")], "the SVG logo is well-formed XML (xmllint, libxml2)", () => {
    const lint = spawnSync("xmllint", ["--noout", join(dir, "logo-svg.svg")], { encoding: "utf8" });
    expect(lint.status, lint.stderr).toBe(0);
  });

  itNeeds([tool("jupyter")], "Jupyter's own kernelspec listing finds it through JUPYTER_PATH", () => {
    const r = spawnSync("jupyter", ["kernelspec", "list", "--json"], { encoding: "utf8", env: { ...process.env, JUPYTER_PATH: join(prefix, "share", "jupyter"), PYDEVD_DISABLE_FILE_VALIDATION: "1" } });
    expect(r.status, r.stderr).toBe(0);
    const specs = JSON.parse(r.stdout).kernelspecs;
    expect(specs.halfplus.resource_dir).toBe(dir);
    expect(specs.halfplus.spec.display_name).toBe("halfplus · TypeScript");
  });

  it("--user writes into Jupyter's user data folder (JUPYTER_DATA_DIR when set)", () => {
    const data = join(work, "user-data");
    const r = halfplus(["kernel", "install", "--user"], { JUPYTER_DATA_DIR: data });
    expect(r.code).toBe(0);
    expect(existsSync(join(data, "kernels", "halfplus", "kernel.json"))).toBe(true);
  });

  it("mistakes are one line with exit 2", () => {
    for (const args of [["kernel", "install", "--user", "--prefix", prefix], ["kernel", "remove"], ["kernel"]]) {
      const r = halfplus(args);
      expect(r.code).toBe(2);
      expect(r.stderr.trim().split("\n")).toHaveLength(1);
      expect(r.stderr).toMatch(/^halfplus kernel: /);
    }
    const blocked = join(work, "a-file");
    writeFileSync(blocked, "");
    const r = halfplus(["kernel", "install", "--prefix", blocked]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^halfplus kernel: cannot write .* choose another place with --prefix DIR or --user\n$/);
  });
});

describe("halfplus kernel status", () => {
  it("without Jupyter on PATH: says how to get it, exit 1, no stack trace", () => {
    const r = halfplus(["kernel", "status"], { PATH: "/nonexistent" });
    expect(r.code).toBe(1);
    expect(r.stderr).toBe("");
    expect(r.stdout).toContain("Jupyter not found on PATH; install it: Debian/Ubuntu: `apt-get install jupyter-notebook`");
    expect(r.stdout).toContain("JupyterLab in a Python environment");
    expect(r.stdout).not.toMatch(/\n\s+at /);
  });

  itNeeds([tool("jupyter")], "with Jupyter and the kernel on JUPYTER_PATH: ready, exit 0; --json says the same", () => {
    const env = { JUPYTER_PATH: join(work, "prefix", "share", "jupyter") };
    const r = halfplus(["kernel", "status"], env);
    expect(r.stdout).toContain('kernel "halfplus" at');
    expect(r.stdout).toContain('notebooks in');
    expect(r.code, r.stdout).toBe(0);
    const j = JSON.parse(halfplus(["kernel", "status", "--json"], env).stdout);
    expect(j.ready).toBe(true);
    expect(j.tslab.version).toBe("1.0.22");
    expect(j.importFrom.found).toBe(join(ROOT, "node_modules", "halfplus"));
  });

  itNeeds([tool("jupyter")], "a kernelspec pointing at a removed install is reported with the fix", () => {
    const prefix = join(work, "stale");
    expect(halfplus(["kernel", "install", "--prefix", prefix]).code).toBe(0);
    const file = join(prefix, "share", "jupyter", "kernels", "halfplus", "kernel.json");
    const spec = JSON.parse(readFileSync(file, "utf8"));
    spec.argv[1] = join(work, "gone", "tslab", "bin", "tslab");
    writeFileSync(file, JSON.stringify(spec));
    const r = halfplus(["kernel", "status"], { JUPYTER_PATH: join(prefix, "share", "jupyter") });
    expect(r.code).toBe(1);
    expect(r.stdout).toContain("which is gone: run `npx halfplus kernel install` again");
  });
});
