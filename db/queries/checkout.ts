import { and, desc, eq, gt } from "drizzle-orm";
import { getDb, writeTx } from "@/db/client";
import { checkoutSessions, invoices, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { invoiceLabel, workOrderLabel } from "@/lib/domain";
import { conflict, HttpError, notFound } from "@/lib/http/problem";
import { balanceOf } from "@/lib/invoices/balance";
import { appUrl } from "@/lib/server/mail/send";
import { createCheckoutSession, isServiceUnavailable, retrieveCheckoutSession } from "@/lib/server/payments/stripe";
import { recordAudit } from "./audit";
import { scopedTo } from "./scope";

const REUSE_WITHIN_MS = 20 * 60 * 60 * 1000;

const paymentServiceUnavailable = () =>
  new HttpError(
    503,
    "payment_service_unavailable",
    "Payment service unavailable",
    "The card-payment service is not answering, so no payment page was opened and nothing was charged. Try again in a few minutes, or pay by cheque or bank transfer.",
  );

/** Where the payment page sends the browser back: the invoice, never a page that records anything. */
export function fleetInvoicePath(invoiceId: string): string {
  return `/fleet/invoices/${invoiceId}`;
}

/**
 * A payment page for the invoice's open balance (clerk, approver). An open page
 * for the same amount is reused, so two tabs do not make two payments.
 */
export async function startCheckout(user: SessionUser, invoiceId: string): Promise<{ url: string; sessionId: string }> {
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
  if (recent) {
    const current = await retrieveCheckoutSession(recent.id).catch(() => null);
    if (current?.status === "open" && current.url) return { url: current.url, sessionId: current.id };
    if (current?.status) {
      await writeTx((tx) => tx.update(checkoutSessions).set({ status: current.status ?? "expired" }).where(eq(checkoutSessions.id, recent.id)));
    }
  }

  const back = appUrl(fleetInvoicePath(i.id));
  const session = await createCheckoutSession({
    invoiceId: i.id,
    accountId: i.accountId,
    title: `Invoice ${label}`,
    description: `${workOrderLabel(inv.workOrderNumber)}, ${i.unitSnapshot?.unitNumber ?? "unit"}: open balance`,
    amountCents: balance,
    successUrl: `${back}?checkout=returned`,
    cancelUrl: `${back}?checkout=cancelled`,
    customerEmail: user.email,
  }).catch((error: unknown) => {
    if (!isServiceUnavailable(error)) throw error;
    console.error(`checkout for ${label}: payment service unavailable`, error);
    throw paymentServiceUnavailable();
  });
  if (!session.url) throw new Error("the payment service returned a session without a page");
  const url = session.url;
  await writeTx(async (tx) => {
    await tx.insert(checkoutSessions).values({
      id: session.id,
      invoiceId: i.id,
      accountId: i.accountId,
      amountCents: balance,
      status: "open",
      url,
      createdBy: user.id,
    });
    await recordAudit(tx, user, {
      action: "checkout.start",
      entityType: "invoice",
      entityId: i.id,
      accountId: i.accountId,
      detail: { sessionId: session.id, amountCents: balance },
    });
  });
  return { url, sessionId: session.id };
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
