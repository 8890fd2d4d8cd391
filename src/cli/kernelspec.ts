// The Jupyter kernelspec for halfplus notebooks: a kernel.json that starts tslab's kernel (pinned
// dependency) by absolute path with this Node, so TypeScript cells run against this install of
// halfplus; where Jupyter looks for kernelspecs; and what `halfplus kernel status` checks.
//
// Written by us rather than by tslab's installer, which needs a Python that can import
// jupyter_client. The kernelspec format is Jupyter's (argv with {connection_file}, display_name,
// language, env, metadata; logo-*.png/svg beside it).

import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { homedir } from "node:os";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { deflateSync } from "node:zlib";
import { InputError } from "../errors.js";
import { halfplusVersion } from "../experiment/provenance.js";

/** Folder name of the kernelspec (what notebooks' metadata.kernelspec.name says). */
export const KERNEL_NAME = "halfplus";
/** What Jupyter's kernel pickers show. */
export const KERNEL_DISPLAY_NAME = "halfplus · TypeScript";
/** How to get Jupyter, shown when it is missing. */
export const JUPYTER_INSTALL_HINT =
  "Debian/Ubuntu: `apt-get install jupyter-notebook` (or `jupyter-nbconvert jupyter-client python3-ipykernel` to run notebooks headless); elsewhere JupyterLab in a Python environment: `python3 -m pip install jupyterlab`";

const here = dirname(fileURLToPath(import.meta.url));
/** This package's root folder (dist/cli/.. /.. or src/cli/../..). */
export const PACKAGE_ROOT = resolve(here, "..", "..");

export interface TslabInstall {
  /** tslab's package folder. */
  dir: string;
  version: string;
  /** The kernel's entry script (bin/tslab). */
  entry: string;
}

/** The tslab this package depends on, or null when it is not installed. */
export function findTslab(): TslabInstall | null {
  try {
    const pkg = createRequire(join(PACKAGE_ROOT, "package.json")).resolve("tslab/package.json");
    const dir = dirname(pkg);
    const version = (JSON.parse(readFileSync(pkg, "utf8")) as { version: string }).version;
    const entry = join(dir, "bin", "tslab");
    return existsSync(entry) ? { dir, version, entry } : null;
  } catch {
    return null;
  }
}

export interface KernelJson {
  argv: string[];
  display_name: string;
  language: string;
  interrupt_mode: "signal";
  env: Record<string, string>;
  metadata: { halfplus: { version: string; package: string; tslab: string } };
}

/** kernel.json: this Node running tslab's entry in TypeScript mode (no --js flag). */
export function kernelJson(tslab: TslabInstall, node: string = process.execPath): KernelJson {
  return {
    argv: [node, tslab.entry, "kernel", "--config-path", "{connection_file}"],
    display_name: KERNEL_DISPLAY_NAME,
    language: "typescript",
    interrupt_mode: "signal",
    env: {},
    metadata: { halfplus: { version: halfplusVersion(), package: PACKAGE_ROOT, tslab: tslab.version } },
  };
}

/** Jupyter's per-user data folder, by jupyter_core's rules. */
export function jupyterUserDataDir(env: NodeJS.ProcessEnv = process.env, platform: NodeJS.Platform = process.platform): string {
  if (env.JUPYTER_DATA_DIR) return resolve(env.JUPYTER_DATA_DIR);
  if (platform === "darwin") return join(homedir(), "Library", "Jupyter");
  if (platform === "win32") return join(env.APPDATA ?? join(homedir(), "AppData", "Roaming"), "jupyter");
  return join(env.XDG_DATA_HOME ? resolve(env.XDG_DATA_HOME) : join(homedir(), ".local", "share"), "jupyter");
}

export interface InstallTarget {
  user?: boolean;
  prefix?: string;
}

/** The kernelspec folder for an install target (default: the user's). */
export function kernelDir(target: InstallTarget): string {
  if (target.user && target.prefix !== undefined) throw new InputError("give either --user or --prefix, not both");
  if (target.prefix !== undefined) {
    if (target.prefix.trim() === "") throw new InputError("--prefix needs a folder");
    return join(resolve(target.prefix), "share", "jupyter", "kernels", KERNEL_NAME);
  }
  return join(jupyterUserDataDir(), "kernels", KERNEL_NAME);
}

/** Our logo as SVG: a cut through a graph's edge set, in the palette's navy. */
export const LOGO_SVG = `<svg xmlns="http://www.w3.org/2000/svg" width="64" height="64" viewBox="0 0 64 64">
<rect x="2" y="2" width="60" height="60" rx="12" fill="#353D95"/>
<g stroke="#FFFFFF" stroke-width="3" stroke-linecap="round"><line x1="16" y1="18" x2="48" y2="22"/><line x1="16" y1="18" x2="44" y2="46"/><line x1="20" y1="44" x2="48" y2="22"/><line x1="20" y1="44" x2="44" y2="46"/></g>
<line x1="32" y1="8" x2="32" y2="56" stroke="#D1A335" stroke-width="3" stroke-dasharray="5 4"/>
<g fill="#FFFFFF"><circle cx="16" cy="18" r="5"/><circle cx="20" cy="44" r="5"/></g>
<g fill="#64CDBC"><circle cx="48" cy="22" r="5"/><circle cx="44" cy="46" r="5"/></g>
</svg>
`;

// The same mark as PNG (Jupyter's classic front-ends want logo-32x32.png / logo-64x64.png):
// drawn per pixel with 4× supersampling and written with zlib, no image library needed.
function crc32(buf: Buffer): number {
  let c = 0xffffffff;
  for (const b of buf) {
    c ^= b;
    for (let k = 0; k < 8; k++) c = (c >>> 1) ^ (0xedb88320 & -(c & 1));
  }
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type: string, data: Buffer): Buffer {
  const head = Buffer.alloc(8);
  head.writeUInt32BE(data.length, 0);
  head.write(type, 4, "latin1");
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(Buffer.concat([head.subarray(4), data])), 0);
  return Buffer.concat([head, data, crc]);
}

function segDist(px: number, py: number, x1: number, y1: number, x2: number, y2: number): number {
  const dx = x2 - x1, dy = y2 - y1;
  const t = Math.max(0, Math.min(1, ((px - x1) * dx + (py - y1) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(px - x1 - t * dx, py - y1 - t * dy);
}

/** The logo at `size` pixels as a PNG file. */
export function logoPng(size: number): Buffer {
  const hex = (h: string) => [1, 3, 5].map((i) => parseInt(h.slice(i, i + 2), 16));
  const navy = hex("#353D95"), white = [255, 255, 255], gold = hex("#D1A335"), mint = hex("#64CDBC");
  const edges: [number, number, number, number][] = [[16, 18, 48, 22], [16, 18, 44, 46], [20, 44, 48, 22], [20, 44, 44, 46]];
  // Colour and opacity at a point of the 64-unit design.
  const at = (x: number, y: number): [number[], number] => {
    for (const [cx, cy, col] of [[16, 18, white], [20, 44, white], [48, 22, mint], [44, 46, mint]] as [number, number, number[]][]) if (Math.hypot(x - cx, y - cy) <= 5) return [col, 1];
    if (Math.abs(x - 32) <= 1.5 && y >= 8 && y <= 56 && (y - 8) % 9 < 5) return [gold, 1];
    if (edges.some(([a, b, c, d]) => segDist(x, y, a, b, c, d) <= 1.5)) return [white, 1];
    const qx = Math.max(14 - x, x - 50, 0), qy = Math.max(14 - y, y - 50, 0);
    if (x >= 2 && x <= 62 && y >= 2 && y <= 62 && Math.hypot(qx, qy) <= 12) return [navy, 1];
    return [[0, 0, 0], 0];
  };
  const raw = Buffer.alloc(size * (4 * size + 1));
  const s = 64 / size;
  for (let py = 0; py < size; py++) {
    raw[py * (4 * size + 1)] = 0;
    for (let px = 0; px < size; px++) {
      let r = 0, g = 0, b = 0, a = 0;
      for (let sy = 0; sy < 4; sy++) for (let sx = 0; sx < 4; sx++) {
        const [col, op] = at((px + (sx + 0.5) / 4) * s, (py + (sy + 0.5) / 4) * s);
        r += col[0] * op, g += col[1] * op, b += col[2] * op, a += op;
      }
      const o = py * (4 * size + 1) + 1 + 4 * px;
      raw[o] = a ? Math.round(r / a) : 0;
      raw[o + 1] = a ? Math.round(g / a) : 0;
      raw[o + 2] = a ? Math.round(b / a) : 0;
      raw[o + 3] = Math.round((255 * a) / 16);
    }
  }
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(size, 0);
  ihdr.writeUInt32BE(size, 4);
  ihdr.set([8, 6, 0, 0, 0], 8);
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk("IHDR", ihdr), chunk("IDAT", deflateSync(raw)), chunk("IEND", Buffer.alloc(0))]);
}

/** Writes the kernelspec folder (kernel.json and logos); returns the folder. */
export function installKernelSpec(target: InstallTarget): { dir: string; spec: KernelJson } {
  const tslab = findTslab();
  if (tslab === null) throw new InputError(`tslab is not installed beside halfplus (${PACKAGE_ROOT}); run \`npm install\` there first`);
  const dir = kernelDir(target);
  const spec = kernelJson(tslab);
  try {
    mkdirSync(dir, { recursive: true });
    writeFileSync(join(dir, "kernel.json"), JSON.stringify(spec, null, 2) + "\n");
    writeFileSync(join(dir, "logo-svg.svg"), LOGO_SVG);
    writeFileSync(join(dir, "logo-32x32.png"), logoPng(32));
    writeFileSync(join(dir, "logo-64x64.png"), logoPng(64));
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    throw new InputError(`cannot write ${dir} (${err.code ?? err.message}); choose another place with --prefix DIR or --user`);
  }
  return { dir, spec };
}

/** A program's first line of output, or null when it cannot run. */
function run(cmd: string, args: string[], env?: NodeJS.ProcessEnv): { ok: boolean; out: string } | null {
  const r = spawnSync(cmd, args, { encoding: "utf8", timeout: 30_000, env: { ...process.env, PYDEVD_DISABLE_FILE_VALIDATION: "1", ...env } });
  if (r.error) return null;
  return { ok: r.status === 0, out: `${r.stdout ?? ""}` };
}

export interface KernelStatus {
  node: { version: string; requireModule: boolean };
  tslab: TslabInstall | null;
  jupyter: { found: boolean; version: string | null; nbconvert: boolean; frontEnds: string[] };
  kernel: { found: boolean; dir: string | null; argvOk: boolean | null; points: string | null };
  /** Where tslab's TypeScript would find `halfplus` from `cwd` (Node 10 rules: node_modules upward). */
  importFrom: { cwd: string; found: string | null };
  ready: boolean;
}

/** node_modules/halfplus from `cwd` upwards, as tslab's TypeScript resolves it. */
export function findHalfplusFrom(cwd: string): string | null {
  let dir = resolve(cwd);
  for (;;) {
    const p = join(dir, "node_modules", "halfplus", "package.json");
    if (existsSync(p)) return dirname(p);
    const up = dirname(dir);
    if (up === dir) return null;
    dir = up;
  }
}

/** What is installed: Node's support for loading ES modules with require, tslab, Jupyter, our kernel. */
export function kernelStatus(cwd: string = process.cwd()): KernelStatus {
  const tslab = findTslab();
  const requireModule = (process.features as { require_module?: boolean }).require_module === true;
  const v = run("jupyter", ["--version"]);
  const jupyter = { found: v !== null && v.ok, version: null as string | null, nbconvert: false, frontEnds: [] as string[] };
  const kernel = { found: false, dir: null as string | null, argvOk: null as boolean | null, points: null as string | null };
  if (jupyter.found) {
    jupyter.version = /jupyter_core\s*:\s*(\S+)/.exec(v!.out)?.[1] ?? null;
    const line = (name: string) => new RegExp(`^${name}\\s*:\\s*(.+?)\\s*$`, "m").exec(v!.out)?.[1];
    jupyter.nbconvert = (line("nbconvert") ?? "not installed") !== "not installed";
    for (const fe of ["jupyterlab", "notebook"]) if ((line(fe) ?? "not installed") !== "not installed") jupyter.frontEnds.push(fe === "jupyterlab" ? "JupyterLab" : "Notebook");
    const list = run("jupyter", ["kernelspec", "list", "--json"]);
    try {
      const specs = (JSON.parse(list?.out ?? "{}") as { kernelspecs?: Record<string, { resource_dir: string; spec: { argv: string[] } }> }).kernelspecs ?? {};
      const ours = specs[KERNEL_NAME];
      if (ours) {
        kernel.found = true;
        kernel.dir = ours.resource_dir;
        kernel.points = ours.spec.argv[1] ?? null;
        kernel.argvOk = ours.spec.argv.slice(0, 2).every((p) => existsSync(p));
      }
    } catch {
      // An unreadable listing counts as "not found"; the hint below says how to install.
    }
  }
  const found = findHalfplusFrom(cwd);
  return {
    node: { version: process.version, requireModule },
    tslab,
    jupyter,
    kernel,
    importFrom: { cwd: resolve(cwd), found },
    ready: requireModule && tslab !== null && jupyter.found && kernel.found && kernel.argvOk === true,
  };
}

/** The status as lines for a terminal, each problem followed by how to fix it. */
export function formatKernelStatus(s: KernelStatus): string {
  const ok = (b: boolean) => (b ? "ok     " : "missing");
  const lines = [
    `${ok(s.node.requireModule)}  Node ${s.node.version}${s.node.requireModule ? "" : " cannot load ES modules with require (tslab needs that): use Node 20.19 or later, or 22.12 or later"}`,
    `${ok(s.tslab !== null)}  tslab ${s.tslab ? `${s.tslab.version} at ${s.tslab.dir}` : `not installed beside halfplus: run \`npm install\` in ${PACKAGE_ROOT}`}`,
    `${ok(s.jupyter.found)}  Jupyter ${s.jupyter.found ? `${s.jupyter.version ?? ""} (${[...s.jupyter.frontEnds, ...(s.jupyter.nbconvert ? ["nbconvert"] : [])].join(", ") || "no front-end"})` : `not found on PATH; install it: ${JUPYTER_INSTALL_HINT}`}`,
  ];
  if (s.jupyter.found && s.jupyter.frontEnds.length === 0) lines.push(`         no notebook front-end: ${JUPYTER_INSTALL_HINT}`);
  if (!s.jupyter.found) lines.push(`${ok(false)}  kernel "${KERNEL_NAME}": cannot be checked without Jupyter`);
  else if (!s.kernel.found) lines.push(`${ok(false)}  kernel "${KERNEL_NAME}" not installed: run \`npx halfplus kernel install\` (or --prefix DIR, then add DIR/share/jupyter to JUPYTER_PATH)`);
  else if (s.kernel.argvOk !== true) lines.push(`${ok(false)}  kernel "${KERNEL_NAME}" at ${s.kernel.dir} points to ${s.kernel.points}, which is gone: run \`npx halfplus kernel install\` again`);
  else lines.push(`${ok(true)}  kernel "${KERNEL_NAME}" at ${s.kernel.dir} (runs ${s.kernel.points})`);
  lines.push(
    s.importFrom.found
      ? `${ok(true)}  notebooks in ${s.importFrom.cwd} import "halfplus" from ${s.importFrom.found}`
      : `note     notebooks in ${s.importFrom.cwd} cannot import "halfplus": no node_modules/halfplus here or above; run \`npm install halfplus\` in the notebooks' folder (a clone of halfplus links itself on \`npm ci\`)`,
  );
  lines.push(s.ready ? "ready: open a notebook and pick the kernel \"" + KERNEL_DISPLAY_NAME + "\"" : "not ready: see the lines marked missing");
  return lines.join("\n") + "\n";
}
