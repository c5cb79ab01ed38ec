import { inject } from "vitest";
import type { CaughtMail } from "@/mocks/smtp/server";
import { mailbox, type Mailbox } from "@/tests/support/mailbox";

/** This file's mailbox in the run's one mail catcher; setup.ts already points SMTP_URL at it. */
export function fileMailbox(): Mailbox {
  const name = process.env.COTTER_TEST_MAILBOX;
  if (!name) throw new Error("no mailbox: is tests/integration/setup.ts the project's setup file?");
  return mailbox(inject("mailCatcher"), name);
}

/** The file's mailbox, plus a reader for the single-use links people are mailed. */
export function catchMail(): { smtp: () => Mailbox; linkIn: (mail: CaughtMail, path: string) => string } {
  const box = fileMailbox();
  return {
    smtp: () => box,
    /** The token at the end of the first link to `path` in a message's text. */
    linkIn(mail, path) {
      const match = new RegExp(`https?://\\S+${path}/([A-Za-z0-9_-]{43})`).exec(mail.text);
      if (!match?.[1]) throw new Error(`no ${path} link in “${mail.subject}”`);
      return match[1];
    },
  };
}
