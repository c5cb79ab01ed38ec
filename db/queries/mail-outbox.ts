import { and, count, desc, eq, lt, or, sql } from "drizzle-orm";
import { getDb, writeTx } from "@/db/client";
import { MAIL_STATUSES, mailOutbox } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { decodeCursor, paginate } from "@/lib/http/pagination";
import { conflict, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { recordAudit } from "./audit";

export type MailStatus = (typeof MAIL_STATUSES)[number];

/** The most messages a state's count goes to: the page shows "1,000+" beyond it. */
export const MAIL_COUNT_CAP = 1000;

/** A page of outgoing mail, newest first, with how many are in each state (the owner's Outgoing mail page). */
export async function outgoingMail(options: { status?: MailStatus; limit: number; cursor?: string }) {
  const db = getDb();
  const after = decodeCursor(options.cursor, 2);
  const where = and(
    options.status ? eq(mailOutbox.status, options.status) : undefined,
    after ? or(lt(mailOutbox.createdAt, String(after[0])), and(eq(mailOutbox.createdAt, String(after[0])), lt(mailOutbox.id, String(after[1])))) : undefined,
  );
  const rows = await db
    .select({
      id: mailOutbox.id,
      to: mailOutbox.to,
      subject: mailOutbox.subject,
      template: mailOutbox.template,
      status: mailOutbox.status,
      attempts: mailOutbox.attempts,
      sendAfter: mailOutbox.sendAfter,
      lastError: mailOutbox.lastError,
      sentAt: mailOutbox.sentAt,
      createdAt: mailOutbox.createdAt,
      hasBody: sql<number>`length(${mailOutbox.text}) > 0`,
    })
    .from(mailOutbox)
    .where(where)
    .orderBy(desc(mailOutbox.createdAt), desc(mailOutbox.id))
    .limit(options.limit + 1);
  // Counted up to a cap per state: sent mail piles up for years, and a tab's figure need not walk all of it.
  const counts = await Promise.all(
    MAIL_STATUSES.map(async (status) => {
      const capped = db.select({ one: sql`1` }).from(mailOutbox).where(eq(mailOutbox.status, status)).limit(MAIL_COUNT_CAP).as("capped");
      const [row] = await db.select({ n: count() }).from(capped);
      return { status, n: row?.n ?? 0 };
    }),
  );
  const { page, nextCursor } = paginate(rows, options.limit, (r) => [r.createdAt, r.id]);
  return {
    messages: page.map(({ hasBody, ...r }) => ({ ...r, retryable: r.status === "failed" && Boolean(hasBody) })),
    nextCursor,
    counts: Object.fromEntries(MAIL_STATUSES.map((s) => [s, counts.find((c) => c.status === s)?.n ?? 0])) as Record<MailStatus, number>,
  };
}

/** A person sends a failed message again: it goes back in the queue with its attempts counted afresh. */
export async function retryMail(user: SessionUser, id: string): Promise<void> {
  await writeTx(async (tx) => {
    const [row] = await tx.select({ status: mailOutbox.status, text: mailOutbox.text, to: mailOutbox.to }).from(mailOutbox).where(eq(mailOutbox.id, id)).limit(1);
    if (!row) throw notFound("That message");
    if (row.status !== "failed") throw conflict("not_failed", "Only a message that failed can be sent again.");
    if (row.text === "") throw conflict("no_body", "This message was logged before Cotter kept whole messages; there is nothing to send again.");
    await tx.update(mailOutbox).set({ status: "queued", attempts: 0, sendAfter: nowIso(), lastError: null }).where(eq(mailOutbox.id, id));
    await recordAudit(tx, user, { action: "mail.retry", entityType: "mail", entityId: id, detail: { to: row.to } });
  });
}
