/**
 * `npm run bench`: every benchmark, one after another. Speed is measured here
 * and reported, never asserted in tests (the machines are shared and noisy).
 */
import { spawnSync } from "node:child_process";
import path from "node:path";

const benches = ["estimate-bench.ts", "decision-bench.ts", "unit-search-bench.ts"];
let failed = false;
for (const file of benches) {
  const result = spawnSync(process.execPath, ["--import", "tsx", path.join(import.meta.dirname, file)], { stdio: "inherit" });
  if (result.status !== 0) failed = true;
}
process.exit(failed ? 1 : 0);
