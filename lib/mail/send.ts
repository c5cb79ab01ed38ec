import nodemailer, { type Transporter } from "nodemailer";
import { getDb } from "@/db/client";
import { mailLog } from "@/db/schema";
import { env } from "@/lib/env";
import { nowIso } from "@/lib/ids";
import type { RenderedMail } from "./layout";

export interface Attachment {
  filename: string;
  content: Buffer;
  contentType: string;
}

const holder = globalThis as unknown as { __cotterMail?: { url: string; transport: Transporter } };

/** SMTP_URL when set; otherwise the local mail catcher that `npm run demo` starts. */
export function smtpUrl(): string {
  const e = env();
  return e.SMTP_URL ?? `smtp://127.0.0.1:${e.FAKE_SMTP_PORT}`;
}

function transport(): Transporter {
  const url = smtpUrl();
  if (!holder.__cotterMail || holder.__cotterMail.url !== url) {
    holder.__cotterMail = {
      url,
      transport: nodemailer.createTransport(url, { connectionTimeout: 5_000, greetingTimeout: 5_000, socketTimeout: 10_000 }),
    };
  }
  return holder.__cotterMail.transport;
}

/**
 * Sends one message to each recipient (people do not see each other's
 * addresses) and logs every attempt. Never throws: a mail outage must not undo
 * or fail the change that caused the mail.
 */
export async function sendMail(
  to: string[],
  mail: RenderedMail,
  template: string,
  attachments: Attachment[] = [],
): Promise<{ sent: number; failed: number }> {
  let sent = 0;
  let failed = 0;
  for (const address of [...new Set(to.map((a) => a.trim().toLowerCase()).filter(Boolean))]) {
    let error: string | null = null;
    try {
      await transport().sendMail({ from: env().MAIL_FROM, to: address, subject: mail.subject, text: mail.text, html: mail.html, attachments });
      sent += 1;
    } catch (e) {
      failed += 1;
      error = e instanceof Error ? e.message : String(e);
      console.error(`mail to ${address} failed: ${error}`);
    }
    await getDb()
      .insert(mailLog)
      .values({ to: address, subject: mail.subject, template, link: mail.link, status: error ? "failed" : "sent", error, at: nowIso() })
      .catch((e: unknown) => console.error("mail log write failed", e));
  }
  return { sent, failed };
}

/** An absolute link into the app for an e-mail. */
export function appUrl(path: string): string {
  return new URL(path, env().NEXTAUTH_URL).toString();
}
