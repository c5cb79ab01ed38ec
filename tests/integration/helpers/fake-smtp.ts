import { afterAll, beforeAll } from "vitest";
import { resetEnvCache } from "@/lib/env";
import { startFakeSmtp, type FakeSmtp } from "@/mocks/smtp/server";

/** Starts the local mail catcher for a test file and points the app's mail at it; returns a getter. */
export function mailCatcherForFile(): () => FakeSmtp {
  let smtp: FakeSmtp | null = null;
  beforeAll(async () => {
    smtp = await startFakeSmtp();
    process.env.SMTP_URL = `smtp://127.0.0.1:${smtp.smtpPort}`;
    resetEnvCache();
  });
  afterAll(async () => {
    await smtp?.close();
  });
  return () => {
    if (!smtp) throw new Error("the mail catcher is not running yet");
    return smtp;
  };
}
