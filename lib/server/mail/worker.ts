import "server-only";
import { and, asc, eq, inArray, lt, lte, min } from "drizzle-orm";
import { getDb, writeTx } from "@/db/client";
import { getInvoiceDetail } from "@/db/queries/invoices";
import { mailOutbox, type MailAttachmentRef, type MailOutboxRow } from "@/db/schema";
import { env } from "@/lib/env";
import { renderInvoicePdf } from "@/lib/server/pdf/invoice-pdf";
import { retryDelayMs } from "@/lib/mail/retry-schedule";
import { transport } from "./send";

const BATCH = 20;
/** How often an idle worker looks for mail another instance queued, or a retry that came due. */
const POLL_MS = 5_000;
/** A message claimed this long ago by a worker that never finished (the process died) is tried again. */
const STALE_CLAIM_MS = 10 * 60_000;

// Mail is sent by the system, which reads across accounts like the shop.
const SYSTEM = { role: "owner", accountId: null } as const;

async function attachmentsOf(refs: MailAttachmentRef[]) {
  const built = [];
  for (const ref of refs) {
    const inv = await getInvoiceDetail(SYSTEM, ref.invoiceId);
    if (!inv) throw new Error(`attachment: invoice ${ref.invoiceId} is gone`);
    built.push({ filename: ref.filename, content: await renderInvoicePdf(inv, env().APP_TIME_ZONE), contentType: "application/pdf" });
  }
  return built;
}

async function claimDue(now: Date): Promise<MailOutboxRow[]> {
  const at = now.toISOString();
  return writeTx(async (tx) => {
    await tx
      .update(mailOutbox)
      .set({ status: "queued", claimedAt: null })
      .where(and(eq(mailOutbox.status, "sending"), lt(mailOutbox.claimedAt, new Date(now.getTime() - STALE_CLAIM_MS).toISOString())));
    const due = await tx
      .select({ id: mailOutbox.id })
      .from(mailOutbox)
      .where(and(eq(mailOutbox.status, "queued"), lte(mailOutbox.sendAfter, at)))
      .orderBy(asc(mailOutbox.sendAfter))
      .limit(BATCH);
    if (!due.length) return [];
    return tx
      .update(mailOutbox)
      .set({ status: "sending", claimedAt: at })
      .where(and(inArray(mailOutbox.id, due.map((d) => d.id)), eq(mailOutbox.status, "queued")))
      .returning();
  });
}

async function sendOne(row: MailOutboxRow, now: Date): Promise<"sent" | "retry" | "failed"> {
  try {
    await transport().sendMail({ from: env().MAIL_FROM, to: row.to, subject: row.subject, text: row.text, html: row.html, attachments: await attachmentsOf(row.attachments) });
    // A message with a single-use link keeps no copy of it once it has gone.
    const body = row.secret ? { text: "", html: "" } : {};
    await writeTx((tx) =>
      tx.update(mailOutbox).set({ status: "sent", sentAt: new Date().toISOString(), attempts: row.attempts + 1, lastError: null, claimedAt: null, ...body }).where(eq(mailOutbox.id, row.id)),
    );
    return "sent";
  } catch (error) {
    const attempts = row.attempts + 1;
    const delay = retryDelayMs(attempts);
    const lastError = (error instanceof Error ? error.message : String(error)).slice(0, 500);
    console.error(`mail to ${row.to} (${row.template}) failed, attempt ${attempts}: ${lastError}`);
    await writeTx((tx) =>
      tx
        .update(mailOutbox)
        .set({ status: delay === null ? "failed" : "queued", attempts, lastError, claimedAt: null, sendAfter: new Date(now.getTime() + (delay ?? 0)).toISOString() })
        .where(eq(mailOutbox.id, row.id)),
    );
    return delay === null ? "failed" : "retry";
  }
}

/** One pass: sends every message that is due (as of `now`), each at most once. Tests call it directly. */
export async function deliverDueMail(now = new Date()): Promise<{ sent: number; retry: number; failed: number }> {
  const tally = { sent: 0, retry: 0, failed: 0 };
  for (;;) {
    const rows = await claimDue(now);
    for (const row of rows) tally[await sendOne(row, now)] += 1;
    if (rows.length < BATCH) return tally;
  }
}

async function nextDueInMs(now: number): Promise<number> {
  const [row] = await getDb().select({ next: min(mailOutbox.sendAfter) }).from(mailOutbox).where(eq(mailOutbox.status, "queued"));
  return row?.next ? Math.max(0, Date.parse(row.next) - now) : POLL_MS;
}

interface WorkerState {
  timer: ReturnType<typeof setTimeout> | null;
  running: Promise<void> | null;
  stopped: boolean;
}

// On globalThis: instrumentation and the route handlers are separate bundles, and must share one worker.
const holder = globalThis as unknown as { __cotterMailWorker?: WorkerState };

function schedule(state: WorkerState, ms: number): void {
  if (state.stopped) return;
  if (state.timer) clearTimeout(state.timer);
  state.timer = setTimeout(() => void tick(state), ms);
  // Never the reason a process stays alive (scripts, tests).
  state.timer.unref();
}

async function tick(state: WorkerState): Promise<void> {
  state.timer = null;
  if (state.running) return schedule(state, 100);
  let wait = POLL_MS;
  state.running = (async () => {
    try {
      await deliverDueMail();
      wait = Math.min(POLL_MS, await nextDueInMs(Date.now()));
    } catch (error) {
      console.error("mail worker pass failed", error);
    }
  })();
  await state.running;
  state.running = null;
  schedule(state, Math.max(50, wait));
}

/** Starts the background sender (instrumentation.ts at server start; otherwise the first queued mail starts it). Idempotent. */
export function startMailWorker(): void {
  const state = holder.__cotterMailWorker;
  if (state && !state.stopped) return;
  const fresh: WorkerState = { timer: null, running: null, stopped: false };
  holder.__cotterMailWorker = fresh;
  schedule(fresh, 0);
}

/** A message was just queued: look soon rather than at the next poll (and start the worker if nothing has). */
export function kickMailWorker(): void {
  const state = holder.__cotterMailWorker;
  if (!state) return startMailWorker();
  if (!state.stopped && !state.running) schedule(state, 50);
}

/** Stops the worker after its current pass; it stays stopped until startMailWorker (tests, scripts). */
export async function stopMailWorker(): Promise<void> {
  const state = holder.__cotterMailWorker;
  if (!state) return;
  state.stopped = true;
  if (state.timer) clearTimeout(state.timer);
  await state.running;
}
