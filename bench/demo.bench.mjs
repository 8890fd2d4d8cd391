// `npm run demo` end to end: the flagship plan (plans/demo.json) into a fresh folder, with two
// workers, the fits, the report page and the figure files (SVG too when Chromium is installed).
// Target: under 5 minutes on 2 cores (issue 9). Wall-clock seconds per stage; CPU seconds beside
// them, since other load on the machine stretches the wall clock.
// Run: npm run build && node bench/run.mjs demo
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Writable } from "node:stream";
import { runDemo } from "../scripts/demo.mjs";
import { report } from "./util.mjs";

const quiet = () => new Writable({ write(_c, _e, cb) { cb(); } });
const out = mkdtempSync(join(tmpdir(), "halfplus-demo-bench-"));
try {
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const r = await runDemo({ out, workers: 2, stdout: quiet(), stderr: quiet(), tty: false });
  const total = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  report("demo", [
    {
      graphs: r.summary.computed,
      "sweep s": Number(r.summary.seconds.toFixed(1)),
      "solver s (summed over jobs)": Number(r.summary.solverSeconds.toFixed(1)),
      "fits, report and figures s": Number((total - r.summary.seconds).toFixed(1)),
      "total s": Number(total.toFixed(1)),
      "main-thread CPU s": Number(((cpu.user + cpu.system) / 1e6).toFixed(1)),
      formats: r.formats.join("+"),
      "target s": 300,
    },
  ]);
} finally {
  rmSync(out, { recursive: true, force: true });
}
