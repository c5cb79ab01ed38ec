import { afterAll, beforeAll } from "vitest";
import { resetEnvCache } from "@/lib/env";
import { startFakeSmtp, type CaughtMail, type FakeSmtp } from "@/mocks/smtp/server";

/** Starts a mail catcher of this file's own for the file's tests and points the app's SMTP at it. */
export function catchMail(): { smtp: () => FakeSmtp; linkIn: (mail: CaughtMail, path: string) => string } {
  let smtp: FakeSmtp | undefined;
  beforeAll(async () => {
    smtp = await startFakeSmtp({ smtpPort: 0, httpPort: 0 });
    process.env.SMTP_URL = `smtp://127.0.0.1:${smtp.smtpPort}`;
    resetEnvCache();
  });
  afterAll(async () => {
    delete process.env.SMTP_URL;
    resetEnvCache();
    await smtp?.close();
  });
  return {
    smtp: () => {
      if (!smtp) throw new Error("mail catcher not started");
      return smtp;
    },
    /** The token at the end of the first link to `path` in a message's text. */
    linkIn(mail, path) {
      const match = new RegExp(`https?://\\S+${path}/([A-Za-z0-9_-]{43})`).exec(mail.text);
      if (!match?.[1]) throw new Error(`no ${path} link in “${mail.subject}”`);
      return match[1];
    },
  };
}
