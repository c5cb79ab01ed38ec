// Shared integration set-up: every test file gets its own real SQLite file,
// migrated with the committed migrations and loaded with the demo data.
import { mkdirSync, rmSync } from "node:fs";
import path from "node:path";
import { afterAll } from "vitest";
import { closeDb } from "@/db/client";
import { migrateDatabase } from "@/db/migrate";
import { seedDatabase } from "@/db/seed";
import { resetEnvCache } from "@/lib/env";
import { stopMailWorker } from "@/lib/server/mail/worker";

const dir = path.join(import.meta.dirname, "..", ".artifacts", "integration");
mkdirSync(dir, { recursive: true });
const file = path.join(dir, `db-${process.pid}-${Date.now()}-${Math.random().toString(36).slice(2, 8)}.db`);
const url = `file:${file}`;

process.env.DATABASE_URL = url;
process.env.NEXTAUTH_SECRET = "integration-tests-secret-integration-tests-secret";
process.env.NEXTAUTH_URL = "http://localhost:3000";
resetEnvCache();

await migrateDatabase(url);
// Demo photos need the upload service and take seconds to draw; tests that need photos upload their own.
await seedDatabase(url, { photos: false });

afterAll(async () => {
  // The mail worker starts by itself when a test queues mail; it must be done before the file goes.
  await stopMailWorker();
  closeDb();
  for (const suffix of ["", "-wal", "-shm"]) rmSync(`${file}${suffix}`, { force: true });
});
