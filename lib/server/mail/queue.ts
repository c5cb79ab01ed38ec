import "server-only";
import { and, eq, gt } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { mailOutbox, type MailAttachmentRef } from "@/db/schema";
import type { RenderedMail } from "@/lib/mail/layout";
import { kickMailWorker } from "./worker";

/** One message, the same for every recipient (each gets their own copy: nobody sees the others' addresses). */
export interface MailMessage {
  to: readonly string[];
  /** A short name for the kind of message, shown on the Outgoing mail page. */
  template: string;
  mail: RenderedMail;
  attachments?: MailAttachmentRef[];
  /** The link carries a single-use token (invitation, password reset): never shown, body dropped once sent. */
  secret?: boolean;
}

/**
 * Events that go out together: each recipient's message waits `windowMs` after
 * the first event, and every later event with the same key joins it (the text
 * is rebuilt from all of them by `compose`).
 */
export interface GroupedMailMessage<T> {
  to: readonly string[];
  template: string;
  group: { key: string; windowMs: number; item: T; compose: (items: T[]) => RenderedMail };
}

/** A link's last path segment (the token) replaced, so the Outgoing mail page never shows a working link. */
export function withoutToken(link: string): string {
  return link.replace(/\/[^/]+$/, "/…");
}

function recipients(to: readonly string[]): string[] {
  return [...new Set(to.map((a) => a.trim().toLowerCase()).filter(Boolean))];
}

/**
 * The one way the app sends e-mail: call it inside the write transaction of
 * the change the mail is about, so the message is kept exactly when the change
 * is (a rollback takes the mail with it). The mail worker sends it after the
 * commit, retrying while the mail server is away; nothing here talks to SMTP.
 */
export async function queueMail<T>(tx: Tx, message: MailMessage | GroupedMailMessage<T>, now = new Date()): Promise<void> {
  const at = now.toISOString();
  for (const to of recipients(message.to)) {
    if ("mail" in message) {
      const { subject, text, html } = message.mail;
      const secret = message.secret ?? false;
      const link = secret ? withoutToken(message.mail.link) : message.mail.link;
      await tx.insert(mailOutbox).values({ to, subject, text, html, link, secret, template: message.template, attachments: message.attachments ?? [], sendAfter: at, createdAt: at });
      continue;
    }
    const { key, windowMs, item, compose } = message.group;
    const groupKey = `${key}|${to}`;
    const [open] = await tx
      .select({ id: mailOutbox.id, items: mailOutbox.groupItems })
      .from(mailOutbox)
      .where(and(eq(mailOutbox.groupKey, groupKey), eq(mailOutbox.status, "queued"), eq(mailOutbox.attempts, 0), gt(mailOutbox.sendAfter, at)))
      .limit(1);
    const items = [...((open?.items as T[] | null) ?? []), item];
    const { subject, text, html, link } = compose(items);
    if (open) {
      await tx.update(mailOutbox).set({ subject, text, html, link, groupItems: items }).where(eq(mailOutbox.id, open.id));
    } else {
      const sendAfter = new Date(now.getTime() + windowMs).toISOString();
      await tx.insert(mailOutbox).values({ to, subject, text, html, link, template: message.template, groupKey, groupItems: items, sendAfter, createdAt: at });
    }
  }
  kickMailWorker();
}
