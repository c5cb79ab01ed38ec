import { and, desc, eq, gt } from "drizzle-orm";
import { getDb, writeTx } from "@/db/client";
import { checkoutSessions, invoices, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { invoiceLabel } from "@/lib/domain";
import { conflict, notFound } from "@/lib/http/problem";
import { balanceOf } from "@/lib/invoices/balance";
import { recordAudit } from "./audit";
import { scopedTo } from "./scope";

const REUSE_WITHIN_MS = 20 * 60 * 60 * 1000;

/**
 * The invoice a payer wants a payment page for, scoped, with its open balance,
 * and the newest page still open for exactly that amount (so two tabs do not
 * make two payments). 404 for another account's invoice, 409 when nothing is owed.
 */
export async function payableInvoice(user: SessionUser, invoiceId: string) {
  const db = getDb();
  const [inv] = await db
    .select({ invoice: invoices, workOrderNumber: workOrders.number })
    .from(invoices)
    .innerJoin(workOrders, eq(workOrders.id, invoices.workOrderId))
    .where(and(eq(invoices.id, invoiceId), scopedTo(invoices.accountId, user)))
    .limit(1);
  if (!inv) throw notFound("That invoice");
  const i = inv.invoice;
  const label = invoiceLabel(i.number);
  const balance = balanceOf(i);
  if (i.status !== "open" || balance <= 0) {
    throw conflict("not_payable", i.status === "void" ? `${label} is void; nothing is owed on it.` : `${label} has nothing left to pay.`);
  }

  const since = new Date(Date.now() - REUSE_WITHIN_MS).toISOString();
  const [recent] = await db
    .select()
    .from(checkoutSessions)
    .where(
      and(
        eq(checkoutSessions.invoiceId, i.id),
        eq(checkoutSessions.status, "open"),
        eq(checkoutSessions.amountCents, balance),
        gt(checkoutSessions.createdAt, since),
      ),
    )
    .orderBy(desc(checkoutSessions.createdAt))
    .limit(1);
  return { invoice: i, workOrderNumber: inv.workOrderNumber, label, balance, recentSessionId: recent?.id ?? null };
}

/** What the payment service now says of a page we had as open. */
export async function setCheckoutStatus(sessionId: string, status: string): Promise<void> {
  await writeTx((tx) => tx.update(checkoutSessions).set({ status }).where(eq(checkoutSessions.id, sessionId)));
}

/** A payment page the payment service has just opened, kept with who asked for it. */
export async function recordCheckoutSession(
  user: SessionUser,
  s: { id: string; invoiceId: string; accountId: string; amountCents: number; url: string },
): Promise<void> {
  await writeTx(async (tx) => {
    await tx.insert(checkoutSessions).values({
      id: s.id,
      invoiceId: s.invoiceId,
      accountId: s.accountId,
      amountCents: s.amountCents,
      status: "open",
      url: s.url,
      createdBy: user.id,
    });
    await recordAudit(tx, user, {
      action: "checkout.start",
      entityType: "invoice",
      entityId: s.invoiceId,
      accountId: s.accountId,
      detail: { sessionId: s.id, amountCents: s.amountCents },
    });
  });
}

/** The newest payment page opened for an invoice, to tell a payer coming back whether it has been confirmed. */
export async function latestCheckout(invoiceId: string) {
  const [row] = await getDb()
    .select({ id: checkoutSessions.id, status: checkoutSessions.status, completedAt: checkoutSessions.completedAt })
    .from(checkoutSessions)
    .where(eq(checkoutSessions.invoiceId, invoiceId))
    .orderBy(desc(checkoutSessions.createdAt))
    .limit(1);
  return row ?? null;
}
