import type { CaughtMail, FakeSmtp } from "@/mocks/smtp/server";
import { mailCatcherForFile } from "./fake-smtp";

/** The file's mail catcher (see fake-smtp.ts), plus a reader for the single-use links people are mailed. */
export function catchMail(): { smtp: () => FakeSmtp; linkIn: (mail: CaughtMail, path: string) => string } {
  return {
    smtp: mailCatcherForFile(),
    /** The token at the end of the first link to `path` in a message's text. */
    linkIn(mail, path) {
      const match = new RegExp(`https?://\\S+${path}/([A-Za-z0-9_-]{43})`).exec(mail.text);
      if (!match?.[1]) throw new Error(`no ${path} link in “${mail.subject}”`);
      return match[1];
    },
  };
}
