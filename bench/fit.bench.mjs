// Fitting speed: 10^5 rows, law "m-and-d", with 1000 bootstrap resamples (target < 5 s, one core),
// and the parts: the QR fit alone, and the one-predictor laws.
import { fitConstant, fitPowerLaw } from "../dist/fit/index.js";
import { Rng } from "../dist/random/prng.js";
import { report } from "./util.mjs";

/** Best of `reps` runs: wall-clock and CPU milliseconds (CPU time shows the cost when other work shares the cores). */
function timeBoth(f, reps) {
  let best = { ms: Infinity, cpuMs: Infinity }, result;
  for (let i = 0; i < reps; i++) {
    globalThis.gc?.();
    const c0 = process.cpuUsage();
    const t0 = process.hrtime.bigint();
    result = f();
    const ms = Number(process.hrtime.bigint() - t0) / 1e6;
    const c = process.cpuUsage(c0);
    if (ms < best.ms) best = { ms, cpuMs: (c.user + c.system) / 1000 };
  }
  return { ...best, result };
}

const N = 100_000;
const rng = new Rng(1);
const rows = [];
for (let i = 0; i < N; i++) {
  const m = Math.round(100 * Math.exp(rng.nextFloat() * 9));
  const d = 2 + rng.nextInt(60);
  const s = 0.3 * m * d ** -0.5 * Math.exp(0.2 * rng.nextNormal());
  rows.push({ key: `r${i}`, family: "bench", m, degeneracy: d, surplusLower: s, surplusUpper: s * 1.05, exact: false });
}

const out = [];
const row = (step, target, t, result) => out.push({ step, ms: Math.round(t.ms), cpuMs: Math.round(t.cpuMs), targetMs: target ?? "", ok: target === null ? "" : t.ms < target, result });

const plain = timeBoth(() => fitPowerLaw(rows, { bootstrap: false }), 3);
row("fitPowerLaw m-and-d, no bootstrap", null, plain, `a=${plain.result.coefficient("mExponent").estimate.toFixed(4)}`);
const boot = timeBoth(() => fitPowerLaw(rows, { bootstrap: { resamples: 1000, solverSeed: 1 } }), 2);
const bi = boot.result.bootstrapInterval("mExponent");
row("fitPowerLaw m-and-d, 1000 resamples", 5000, boot, `a in [${bi.lower.toFixed(4)}, ${bi.upper.toFixed(4)}]`);
const one = timeBoth(() => fitPowerLaw(rows, { law: "m-over-sqrt-d", bootstrap: { resamples: 1000, solverSeed: 1 } }), 2);
row("fitPowerLaw m-over-sqrt-d, 1000 resamples", 5000, one, `slope=${one.result.coefficient("slope").estimate.toFixed(4)}`);
const c = timeBoth(() => fitConstant(rows, { bootstrap: { resamples: 1000, solverSeed: 1 } }), 2);
row("fitConstant slope 1, 1000 resamples", null, c, `C=${c.result.scale().estimate.toFixed(4)}`);
const q = timeBoth(() => boot.result.summary(), 3);
row("summary() (no refitting)", null, q, `${q.result.length} chars`);

report("fit", out);
console.log(`load average ${(await import("node:os")).loadavg().map((x) => x.toFixed(2)).join(" ")} on ${(await import("node:os")).cpus().length} cores`);
if (out.some((r) => r.ok === false)) process.exitCode = 1;
