import { spawnSync } from "node:child_process";
import { mkdirSync, rmSync } from "node:fs";
import path from "node:path";
import { performance } from "node:perf_hooks";

/**
 * A fresh file with every migration applied and the demo data loaded (no
 * photos); returns the seconds it took. Runs in a child process: the
 * migrator leaves a connection open on the file until its process ends, and
 * the bulk load needs the file to itself.
 */
export function prepareDemoFile(file: string): number {
  const started = performance.now();
  mkdirSync(path.dirname(file), { recursive: true });
  for (const suffix of ["", "-wal", "-shm", "-journal"]) rmSync(`${file}${suffix}`, { force: true });
  const child = spawnSync(process.execPath, ["--import", "tsx", import.meta.filename, file], { stdio: "inherit" });
  if (child.status !== 0) throw new Error(`migrating and seeding ${file} failed`);
  return (performance.now() - started) / 1000;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const { migrateDatabase } = await import("@/db/migrate");
  const { seedDatabase } = await import("@/db/seed");
  const url = `file:${process.argv[2]}`;
  await migrateDatabase(url);
  await seedDatabase(url, { photos: false });
}
