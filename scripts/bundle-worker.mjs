// Second step of `npm run build`: the sweep worker's entry (dist/experiment/worker.js, from tsc)
// and the ~150 compiled modules it imports, joined into one ES module,
// dist/experiment/worker-bundle.js, which src/experiment/pool.ts starts. Node 20 loads an ES
// module graph file by file (resolve, read, parse, link, evaluate); one file costs a worker about
// a third of the CPU at start-up (bench/sweep.bench.mjs, startup_s; DEVELOPERS.md, Benchmarks).
// Packages from node_modules (ml-matrix, better-sqlite3, …) and Node's own modules stay imports.
// Rollup is a general-purpose bundler (a devDependency); the code it joins is tsc's output as is.
import { existsSync } from "node:fs";
import { dirname, join, relative, sep } from "node:path";
import { fileURLToPath } from "node:url";
import { rollup } from "rollup";

const root = join(dirname(fileURLToPath(import.meta.url)), "..");
const entry = join(root, "dist", "experiment", "worker.js");
const out = join(root, "dist", "experiment", "worker-bundle.js");
if (!existsSync(entry)) {
  console.error(`bundle-worker: ${entry} is missing: run tsc first (npm run build does both)`);
  process.exit(2);
}

const outDir = dirname(out);
/**
 * A joined module keeps its own `import.meta.url`: a module from another folder gets its old URL
 * rebuilt from the bundle's (`new URL("../graph/x.js", import.meta.url)`), so paths it resolves
 * against itself (createRequire, files beside it) mean what they meant before. Any other use of
 * import.meta in such a module stops the build rather than change meaning.
 */
const keepImportMeta = {
  name: "keep-import-meta",
  resolveImportMeta(property, { moduleId }) {
    if (dirname(moduleId) === outDir) return null;
    if (property !== "url") throw new Error(`bundle-worker: ${moduleId} uses import.meta${property === null ? "" : `.${property}`}, which the bundle cannot keep`);
    const rel = relative(outDir, moduleId).split(sep).join("/");
    return `new URL(${JSON.stringify(rel.startsWith(".") ? rel : `./${rel}`)}, import.meta.url).href`;
  },
};

const bundle = await rollup({
  input: entry,
  // Relative imports are ours (dist/); everything else is a package or a Node module.
  external: (id) => !id.startsWith(".") && !id.startsWith("/"),
  plugins: [keepImportMeta],
  onwarn(warning) {
    // A circular import among our modules is legal ES and keeps its evaluation order; anything else is news.
    if (warning.code === "CIRCULAR_DEPENDENCY") return;
    throw new Error(`bundle-worker: ${warning.message}`);
  },
});
await bundle.write({ file: out, format: "es", sourcemap: false });
await bundle.close();
