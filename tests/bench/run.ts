/**
 * `npm run bench`: every benchmark, one after another. Speed is measured here
 * and reported, never asserted in tests (the machines are shared and noisy).
 * `npm run bench -- http` runs only the named ones (estimate, decision,
 * http); other arguments (`--quick`, `--skip-build`) go to each bench.
 */
import { spawnSync } from "node:child_process";
import path from "node:path";

const benches = { estimate: "estimate-bench.ts", decision: "decision-bench.ts", search: "unit-search-bench.ts", http: "http-bench.ts" };
const args = process.argv.slice(2);
const named = args.filter((a) => !a.startsWith("--"));
const unknown = named.filter((n) => !(n in benches));
if (unknown.length) {
  console.error(`no bench named ${unknown.join(", ")}; there are ${Object.keys(benches).join(", ")}`);
  process.exit(2);
}
const flags = args.filter((a) => a.startsWith("--"));
let failed = false;
for (const [name, file] of Object.entries(benches)) {
  if (named.length && !named.includes(name)) continue;
  const result = spawnSync(process.execPath, ["--import", "tsx", path.join(import.meta.dirname, file), ...flags], { stdio: "inherit" });
  if (result.status !== 0) failed = true;
}
process.exit(failed ? 1 : 0);
