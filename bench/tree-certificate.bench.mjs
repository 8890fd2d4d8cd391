// Size of a tree certificate and the cost of checking it, in the packed form the bracket writes
// (src/cut/tree/tree-codec.ts) against the plain JSON regions of earlier builds: bytes of each, CPU
// seconds to pack (the encoder re-proves each rounded region), to unpack, and to verify
// (verifyTreeCertificate on the regions each form gives back). Either runs a tree search
// (TREE_CERT_SPEC, default gnp:n=40,p=0.3,seed=1: 373 regions, a few seconds; plain node bound,
// most-decided, as bench/exact-hundred runs it) or reads the certificate of a record written by
// `halfplus cut --effort deep --json -o FILE` (TREE_CERT_RECORD=FILE, with TREE_CERT_SPEC its graph),
// e.g. ER_7: `halfplus cut polarity:q=7 --effort deep --node-bound plain --branching most-decided
// --seconds 900 --json -o er7.jsonl`, about 70–170 CPU-seconds.
import { readFileSync } from "node:fs";
import { loadavg } from "node:os";
import { family, packTreeRegions, relaxationTreeSearch, unpackTreeRegions, verifyTreeCertificate } from "../dist/index.js";
import { report } from "./util.mjs";

const spec = process.env.TREE_CERT_SPEC ?? "gnp:n=40,p=0.3,seed=1";
const g = family(spec);
const cpu = (f) => {
  const t = process.cpuUsage();
  const v = f();
  const u = process.cpuUsage(t);
  return [v, (u.user + u.system) / 1e6];
};

let cert;
if (process.env.TREE_CERT_RECORD) {
  const rec = JSON.parse(readFileSync(process.env.TREE_CERT_RECORD, "utf8").split("\n")[0]);
  const c = rec.certificate;
  const regions = c.regions ?? unpackTreeRegions(c.packed, g.n);
  cert = { rootVertex: c.rootVertex, relaxation: c.relaxation, regions, orbital: c.orbital, automorphisms: c.automorphisms };
} else {
  cert = relaxationTreeSearch(g, { relaxation: "plain", branching: "most-decided", solverSeed: 1, seconds: 600 }).certificate;
}
const plainText = JSON.stringify(cert.regions);
const [packed, packS] = cpu(() => packTreeRegions(g, cert));
const [exactPacked, exactPackS] = cpu(() => packTreeRegions(g, cert, { exact: true }));
const rows = [];
for (const [form, text, decode, encodeS] of [
  ["plain JSON regions", plainText, () => JSON.parse(plainText), 0],
  ["packed, doubles (exact)", JSON.stringify(exactPacked), () => unpackTreeRegions(JSON.parse(JSON.stringify(exactPacked)), g.n), exactPackS],
  ["packed (default)", JSON.stringify(packed), () => unpackTreeRegions(JSON.parse(JSON.stringify(packed)), g.n), packS],
]) {
  const [regions, decodeS] = cpu(decode);
  const [v, verifyS] = cpu(() => verifyTreeCertificate(g, { ...cert, regions }));
  rows.push({ form, bytes: text.length, encode_cpu_s: encodeS.toFixed(2), decode_cpu_s: decodeS.toFixed(2), verify_cpu_s: verifyS.toFixed(2), verified: v.ok });
}
console.log(`${spec}: n=${g.n}, ${cert.regions.length} regions, load ${loadavg()[0].toFixed(1)}`);
report("tree-certificate", rows);
