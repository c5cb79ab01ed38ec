// Shared integration set-up: every test file gets its own real SQLite file, a
// copy of the run's migrated and seeded template (global-setup.ts), and its
// own mailbox in the run's one mail catcher.
import { copyFileSync, mkdirSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { afterAll, inject } from "vitest";
import { closeDb } from "@/db/client";
import { resetEnvCache } from "@/lib/env";
import { stopMailWorker } from "@/lib/server/mail/worker";
import { mailbox } from "@/tests/support/mailbox";
import { answersChecked } from "@/tests/support/openapi-responses";

const dir = path.join(import.meta.dirname, "..", ".artifacts", "integration");
mkdirSync(dir, { recursive: true });
const file = path.join(dir, `db-${process.pid}-${Date.now()}-${Math.random().toString(36).slice(2, 8)}.db`);
copyFileSync(inject("templateDb"), file);

// Mail from this file goes to its own mailbox; helpers/mail.ts reads it back.
const mailboxName = `file-${path.basename(file, ".db")}`;
process.env.COTTER_TEST_MAILBOX = mailboxName;
process.env.SMTP_URL = mailbox(inject("mailCatcher"), mailboxName).smtpUrl;
process.env.DATABASE_URL = `file:${file}`;
process.env.NEXTAUTH_SECRET = "integration-tests-secret-integration-tests-secret";
process.env.NEXTAUTH_URL = "http://localhost:3000";
resetEnvCache();

afterAll(async () => {
  // How many /api/v1 answers this file held to the OpenAPI document; the run's teardown adds them up.
  writeFileSync(path.join(inject("answerCounts"), `${path.basename(file, ".db")}.count`), String(answersChecked()));
  // The mail worker starts by itself when a test queues mail; it must be done before the file goes.
  await stopMailWorker();
  closeDb();
  for (const suffix of ["", "-wal", "-shm"]) rmSync(`${file}${suffix}`, { force: true });
});
