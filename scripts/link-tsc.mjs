// The notebook kernel (tslab) brings its own TypeScript 5.0 (@tslab/typescript-for-tslab), whose
// `tsc` and `tsserver` npm may link into node_modules/.bin in place of ours; halfplus is written for
// the `typescript` devDependency (5.9), so `npx tsc` would type-check with the wrong compiler. This
// points the two links back at it. Run by `prepare` (npm install / npm ci in this repository); a
// no-op where the devDependency is absent (an installed copy of the package).
import { existsSync, lstatSync, readlinkSync, symlinkSync, unlinkSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

const root = join(dirname(fileURLToPath(import.meta.url)), "..");
const bin = join(root, "node_modules", ".bin");
for (const name of ["tsc", "tsserver"]) {
  const target = join("..", "typescript", "bin", name);
  if (!existsSync(join(bin, target))) continue;
  const link = join(bin, name);
  let current = null;
  try {
    current = lstatSync(link).isSymbolicLink() ? readlinkSync(link) : "(a file)";
  } catch {
    current = null;
  }
  if (current === target) continue;
  if (current !== null) unlinkSync(link);
  symlinkSync(target, link);
}
