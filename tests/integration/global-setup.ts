import { mkdirSync, readdirSync, readFileSync, rmSync } from "node:fs";
import path from "node:path";
import { createClient } from "@libsql/client";
import type { TestProject } from "vitest/node";
import { migrateDatabase } from "@/db/migrate";
import { seedDatabase } from "@/db/seed";
import { startFakeSmtp } from "@/mocks/smtp/server";
import "@/tests/support/mailbox";

declare module "vitest" {
  export interface ProvidedContext {
    /** A migrated database with the demo data, made once per run; each file copies it (setup.ts). */
    templateDb: string;
    /** Where each file leaves how many /api/v1 answers it checked against the OpenAPI document. */
    answerCounts: string;
  }
}

/**
 * Once per run: migrate and seed one template database (about a second and a
 * half each time, formerly paid by every file) and start one mail catcher.
 */
export default async function setup(project: TestProject) {
  const dir = path.join(import.meta.dirname, "..", ".artifacts", "integration");
  mkdirSync(dir, { recursive: true });
  const file = path.join(dir, `template-${process.pid}-${Date.now()}.db`);
  const url = `file:${file}`;
  await migrateDatabase(url);
  // Demo photos need the upload service and take seconds to draw; tests that need photos upload their own.
  await seedDatabase(url, { photos: false });
  // Fold the write-ahead log into the file, so copying the one file copies everything.
  const client = createClient({ url });
  await client.execute("PRAGMA wal_checkpoint(TRUNCATE)");
  client.close();

  // Room for every file's mail in one run; the demo's catcher keeps fewer.
  const smtp = await startFakeSmtp({ keep: 20_000 });
  project.provide("templateDb", file);
  const counts = path.join(dir, `answers-${process.pid}-${Date.now()}`);
  mkdirSync(counts, { recursive: true });
  project.provide("answerCounts", counts);
  project.provide("mailCatcher", { smtpPort: smtp.smtpPort, httpUrl: `http://127.0.0.1:${smtp.httpPort}` });

  return async () => {
    const files = readdirSync(counts);
    const total = files.reduce((sum, f) => sum + Number(readFileSync(path.join(counts, f), "utf8")), 0);
    console.log(`OpenAPI: ${total} /api/v1 answers in ${files.length} files matched the document.`);
    rmSync(counts, { recursive: true, force: true });
    await smtp.close();
    for (const suffix of ["", "-wal", "-shm"]) rmSync(`${file}${suffix}`, { force: true });
  };
}
