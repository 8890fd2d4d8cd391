// Second step of `npm run build`: each worker thread's entry (tsc's output in dist/) and the compiled
// modules it imports, joined into one ES module beside the entry, which the code that starts the
// worker loads instead:
//   dist/experiment/worker.js                → worker-bundle.js         (sweep workers, src/experiment/pool.ts)
//   dist/cut/bracket/bracket-worker.js       → bracket-worker-bundle.js (`halfplus cut`, src/cut/bracket/bracket-runner.ts)
//   dist/experiment/census/census-worker.js  → census-worker-bundle.js  (`halfplus census`, src/experiment/census/run.ts)
// Node 20 loads an ES module graph file by file (resolve, read, parse, link, evaluate); one file
// costs a worker about a third of the CPU at start-up (bench/sweep.bench.mjs, startup_s;
// DEVELOPERS.md, Worker start-up). Each bundle stands alone (no chunks shared between them): a worker
// then reads one file, and the three together are small beside dist/.
// Packages from node_modules (ml-matrix, better-sqlite3, …) and Node's own modules stay imports.
// Rollup is a general-purpose bundler (a devDependency); the code it joins is tsc's output as is.
import { existsSync } from "node:fs";
import { dirname, join, relative, sep } from "node:path";
import { fileURLToPath } from "node:url";
import { rollup } from "rollup";

const dist = join(dirname(fileURLToPath(import.meta.url)), "..", "dist");

/** Worker entries (relative to dist/) and the bundle each becomes (written beside it). */
const WORKER_BUNDLES = [
  ["experiment/worker.js", "experiment/worker-bundle.js"],
  ["cut/bracket/bracket-worker.js", "cut/bracket/bracket-worker-bundle.js"],
  ["experiment/census/census-worker.js", "experiment/census/census-worker-bundle.js"],
];

/**
 * A joined module keeps its own `import.meta.url`: a module from another folder gets its old URL
 * rebuilt from the bundle's (`new URL("../graph/x.js", import.meta.url)`), so paths it resolves
 * against itself (createRequire, files beside it) mean what they meant before. Any other use of
 * import.meta in such a module stops the build rather than change meaning.
 */
function keepImportMeta(outDir) {
  return {
    name: "keep-import-meta",
    resolveImportMeta(property, { moduleId }) {
      if (dirname(moduleId) === outDir) return null;
      if (property !== "url") throw new Error(`bundle-worker: ${moduleId} uses import.meta${property === null ? "" : `.${property}`}, which the bundle cannot keep`);
      const rel = relative(outDir, moduleId).split(sep).join("/");
      return `new URL(${JSON.stringify(rel.startsWith(".") ? rel : `./${rel}`)}, import.meta.url).href`;
    },
  };
}

// One rollup run per bundle; the parsed modules carry over from one run to the next (rollup's cache).
let cache;
for (const [entryRel, outRel] of WORKER_BUNDLES) {
  const entry = join(dist, entryRel);
  const out = join(dist, outRel);
  if (!existsSync(entry)) {
    console.error(`bundle-worker: ${entry} is missing: run tsc first (npm run build does both)`);
    process.exit(2);
  }
  const bundle = await rollup({
    input: entry,
    cache,
    // Relative imports are ours (dist/); everything else is a package or a Node module.
    external: (id) => !id.startsWith(".") && !id.startsWith("/"),
    plugins: [keepImportMeta(dirname(out))],
    onwarn(warning) {
      // A circular import among our modules is legal ES and keeps its evaluation order; anything else is news.
      if (warning.code === "CIRCULAR_DEPENDENCY") return;
      throw new Error(`bundle-worker: ${warning.message}`);
    },
  });
  cache = bundle.cache;
  await bundle.write({ file: out, format: "es", sourcemap: false });
  await bundle.close();
}
