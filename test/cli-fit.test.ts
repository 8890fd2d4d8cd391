// `halfplus fit` as a user runs it: rows imported into a results store, fitted per family, as text,
// JSON and LaTeX; the numbers checked against numpy's least squares on the same data.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ensureBuilt, halfplus } from "./helpers/cli.js";
import { itNeeds, python } from "./helpers/requirements.js";

let dir: string;
let store: string;

// Two families of demo rows (invented, demo data): "wide" follows surplus = 0.3·m^0.9·d^-0.4 times a
// fixed multiplicative wobble; "narrow" has brackets that open with m. Not a published data set:
// the check below is that our numbers equal numpy's on exactly these rows.
interface Row { family: string; n: number; m: number; d: number; lo: number; hi: number }
const ROWS: Row[] = [];
const wobble = [1.03, 0.97, 1.05, 0.96, 1.01, 0.99, 1.04, 0.98, 1.02, 0.95, 1.0, 1.06];
for (let i = 0; i < 12; i++) {
  const m = 40 * 1.6 ** i;
  const d = 2 + ((i * 5) % 7);
  const s = 0.3 * m ** 0.9 * d ** -0.4 * wobble[i];
  ROWS.push({ family: "wide", n: Math.round(m / 2), m: Math.round(m), d, lo: +s.toFixed(3), hi: +(s * 1.02).toFixed(3) });
}
for (let i = 0; i < 8; i++) {
  const m = 60 * 1.5 ** i;
  const d = 3 + (i % 4);
  const s = 0.5 * m ** 0.8 * d ** -0.5 * wobble[i + 2];
  ROWS.push({ family: "narrow", n: Math.round(m / 3), m: Math.round(m), d, lo: +s.toFixed(3), hi: +(s * (1 + 0.01 * i)).toFixed(3) });
}

beforeAll(() => {
  ensureBuilt();
  dir = mkdtempSync(join(tmpdir(), "halfplus-fit-cli-"));
  store = join(dir, "rows.db");
  const csv = ["family,n,m,degeneracy,surplusLower,surplusUpper", ...ROWS.map((r) => `${r.family},${r.n},${r.m},${r.d},${r.lo},${r.hi}`)].join("\n") + "\n";
  writeFileSync(join(dir, "rows.csv"), csv);
  const imp = halfplus(["import", join(dir, "rows.csv"), "--into", store]);
  expect(imp.code, imp.stderr).toBe(0);
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

interface TermJson { name: string; estimate: number; standardError: number; lower: number; upper: number; bootstrapLower: number | null; conjectured: number | null; pValue: number | null }
interface FitJson { family: string; response: string; terms: TermJson[]; rows: number; rSquared: number }

describe("halfplus fit", () => {
  itNeeds([python("numpy")], "per-family estimates and standard errors equal numpy's least squares on the same rows", () => {
    const r = halfplus(["fit", store, "--end", "lower", "--json", "--no-bootstrap"]);
    expect(r.code, r.stderr).toBe(0);
    const report = JSON.parse(r.stdout) as { kind: string; rows: number; fits: FitJson[]; skipped: unknown[] };
    expect(report.kind).toBe("halfplus/fit-report");
    expect(report.rows).toBe(ROWS.length);
    expect(report.fits.map((f) => f.family)).toEqual(["narrow", "wide"]);
    expect(report.skipped).toEqual([]);
    // Outside reference: numpy.linalg.lstsq (Debian python3-numpy) on [1, ln m, ln d] → ln surplus;
    // standard errors from s²(XᵀX)⁻¹ (Seber & Lee, Linear Regression Analysis, 2nd ed., §3.4).
    const script = [
      "import json, sys, numpy as np",
      "rows = json.load(sys.stdin); out = {}",
      "for fam in sorted({r['family'] for r in rows}):",
      "    R = [r for r in rows if r['family'] == fam]",
      "    X = np.array([[1.0, np.log(r['m']), np.log(r['d'])] for r in R]); y = np.array([np.log(r['lo']) for r in R])",
      "    b, *_ = np.linalg.lstsq(X, y, rcond=None); res = y - X @ b; s2 = res @ res / (len(R) - 3)",
      "    se = np.sqrt(np.diag(s2 * np.linalg.inv(X.T @ X)))",
      "    out[fam] = {'b': b.tolist(), 'se': se.tolist()}",
      "print(json.dumps(out))",
    ].join("\n");
    const py = spawnSync("python3", ["-c", script], { input: JSON.stringify(ROWS), encoding: "utf8" });
    expect(py.status, py.stderr).toBe(0);
    const ref = JSON.parse(py.stdout) as Record<string, { b: number[]; se: number[] }>;
    for (const f of report.fits) {
      expect(f.rows).toBe(ROWS.filter((x) => x.family === f.family).length);
      const names = f.terms.map((t) => t.name);
      expect(names).toEqual(["constant", "mExponent", "dExponent"]);
      f.terms.forEach((t, j) => {
        expect(Math.abs(t.estimate - ref[f.family].b[j])).toBeLessThan(1e-9 * Math.max(1, Math.abs(ref[f.family].b[j])));
        expect(Math.abs(t.standardError - ref[f.family].se[j])).toBeLessThan(1e-8 * Math.max(1e-3, ref[f.family].se[j]));
        expect(t.bootstrapLower).toBeNull(); // --no-bootstrap
      });
    }
    // The "wide" rows were made with exponents 0.9 and -0.4 (demo data, above); a fit that misses
    // them by far would mean the store handed the wrong columns to the fit.
    const wide = report.fits.find((f) => f.family === "wide")!;
    expect(wide.terms[1].estimate).toBeGreaterThan(0.85);
    expect(wide.terms[1].estimate).toBeLessThan(0.95);
  });

  it("by default fits both bracket ends per family and prints the band between their exponents", () => {
    const r = halfplus(["fit", store, "--family", "narrow", "--resamples", "1000", "--solver-seed", "7"]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toContain("8 rows from");
    expect(r.stdout).toContain("family narrow: exponent band");
    expect(r.stdout).not.toContain("family wide");
    expect(r.stdout).toMatch(/band mExponent: estimates [\d.]+ \.\. [\d.]+/);
    // No closed brackets among imported bounds that differ: the exact fit is absent and says why
    // (the first "narrow" row has lo = hi, one closed bracket, fewer than the 4 the law needs).
    expect(r.stdout).toMatch(/no exact fit: 1 closed bracket usable; the law "m-and-d" needs at least 4/);
    // The upper end's exponent is the larger here: brackets widen with m (common practice, no source).
    const json = JSON.parse(halfplus(["fit", store, "--family", "narrow", "--json", "--solver-seed", "7"]).stdout) as { bands: { bands: { name: string; lowerEnd: number; upperEnd: number }[] }[] };
    const m = json.bands[0].bands.find((b) => b.name === "mExponent")!;
    expect(m.upperEnd).toBeGreaterThan(m.lowerEnd);
    // Same seed, same bytes (common practice, no source).
    expect(halfplus(["fit", store, "--family", "narrow", "--solver-seed", "7"]).stdout).toBe(r.stdout);
  });

  it("tests a conjectured exponent given on the command line", () => {
    const r = halfplus(["fit", store, "--family", "wide", "--law", "m", "--end", "upper", "--json", "--no-bootstrap", "--conjecture", "slope=0.9"]);
    expect(r.code, r.stderr).toBe(0);
    const f = (JSON.parse(r.stdout) as { fits: FitJson[] }).fits[0];
    const slope = f.terms.find((t) => t.name === "slope")!;
    expect(slope.conjectured).toBe(0.9);
    expect(slope.pValue).not.toBeNull();
  });

  it("writes a booktabs table for a paper", () => {
    const r = halfplus(["fit", store, "--latex", "--end", "lower", "--no-bootstrap"]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toContain("\\begin{tabular}");
    expect(r.stdout).toContain("\\toprule");
    expect(r.stdout.match(/exponent of \$m\$/g)?.length).toBe(2);
  });

  it("refuses bad input with one line and exit 2", () => {
    const cases: [string[], RegExp][] = [
      [["fit", join(dir, "missing.db")], /missing\.db: no such results store/],
      [["fit", store, "--family", "nope"], /--family: .* has no rows of nope \(families there: narrow, wide\)/],
      [["fit", store, "--conjecture", "slope=1"], /--conjecture: the law "m-and-d" has no term "slope"/],
      [["fit", store, "--conjecture", "mExponent=one"], /--conjecture: mExponent needs a number/],
      [["fit", store, "--json", "--latex"], /--json and --latex cannot both be given/],
      [["fit", store, "--law", "cubic"], /--law must be one of/],
      [["fit", store, "--resamples", "10"], /--resamples/],
    ];
    for (const [args, message] of cases) {
      const r = halfplus(args);
      expect(r.code, args.join(" ")).toBe(2);
      expect(r.stderr.trim().split("\n")).toHaveLength(1);
      expect(r.stderr).toMatch(message);
    }
  });
});
