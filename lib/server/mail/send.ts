import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";

const holder = globalThis as unknown as { __cotterMail?: { url: string; transport: Transporter } };

/** SMTP_URL when set; otherwise the local mail catcher that `npm run demo` starts. */
export function smtpUrl(): string {
  const e = env();
  return e.SMTP_URL ?? `smtp://127.0.0.1:${e.FAKE_SMTP_PORT}`;
}

/** The SMTP connection the mail worker sends through (lib/server/mail/worker.ts); nothing else sends mail. */
export function transport(): Transporter {
  const url = smtpUrl();
  if (!holder.__cotterMail || holder.__cotterMail.url !== url) {
    holder.__cotterMail = {
      url,
      transport: nodemailer.createTransport(url, { connectionTimeout: 5_000, greetingTimeout: 5_000, socketTimeout: 10_000 }),
    };
  }
  return holder.__cotterMail.transport;
}

/** An absolute link into the app for an e-mail. */
export function appUrl(path: string): string {
  return new URL(path, env().NEXTAUTH_URL).toString();
}
