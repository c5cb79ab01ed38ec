import { eq } from "drizzle-orm";
import type Stripe from "stripe";
import { writeTxThen, type InSameTx, type Tx } from "@/db/client";
import { checkoutSessions, invoices, payments, webhookEvents } from "@/db/schema";
import { nowIso } from "@/lib/ids";
import { judgeOnlinePayment } from "@/lib/invoices/balance";
import { recordAudit } from "./audit";
import { applyToInvoice } from "./payments";

export type EventOutcome =
  | { outcome: "duplicate" }
  | { outcome: "ignored" | "not_paid" | "unknown_session" | "unknown_invoice" | "session_expired" | "already_recorded" }
  | { outcome: "payment_recorded"; paymentId: string; invoiceId: string; flagged: boolean };

const SERVICE = { label: "Card payment service" };

function paymentIntentId(s: Stripe.Checkout.Session): string | null {
  if (!s.payment_intent) return null;
  return typeof s.payment_intent === "string" ? s.payment_intent : s.payment_intent.id;
}

async function recordCardPayment(tx: Tx, event: Stripe.Event, s: Stripe.Checkout.Session): Promise<EventOutcome> {
  if (s.payment_status !== "paid") return { outcome: "not_paid" };
  // Only a payment page this app opened can pay anything: the event's metadata is never enough on its own.
  const [session] = await tx.select().from(checkoutSessions).where(eq(checkoutSessions.id, s.id)).limit(1);
  if (!session) return { outcome: "unknown_session" };
  // A session pays once, whatever other events arrive for it (with or without a payment intent).
  if (session.status === "complete") return { outcome: "already_recorded" };
  const [inv] = await tx.select().from(invoices).where(eq(invoices.id, session.invoiceId)).limit(1);
  if (!inv) return { outcome: "unknown_invoice" };
  const intent = paymentIntentId(s);
  if (intent) {
    // A second event for the same charge (a different event id) must not count twice either.
    const [seen] = await tx.select({ id: payments.id }).from(payments).where(eq(payments.paymentIntentId, intent)).limit(1);
    if (seen) return { outcome: "already_recorded" };
  }
  const amount = s.amount_total ?? 0;
  let verdict = judgeOnlinePayment(inv, amount);
  if (verdict.apply && s.currency && s.currency !== "usd") verdict = { apply: false, reason: `Paid in ${s.currency.toUpperCase()}, not USD.` };
  const completedAt = new Date(event.created * 1000).toISOString();
  const [row] = await tx
    .insert(payments)
    .values({
      invoiceId: inv.id,
      accountId: inv.accountId,
      method: "card",
      amountCents: amount,
      reference: "Online card payment",
      receivedAt: completedAt,
      recordedBy: session.createdBy,
      checkoutSessionId: s.id,
      paymentIntentId: intent,
      flagged: !verdict.apply,
      flagReason: verdict.apply ? null : verdict.reason,
      applied: verdict.apply,
    })
    .returning({ id: payments.id });
  if (!row) throw new Error("payment insert returned nothing");
  if (verdict.apply) await applyToInvoice(tx, inv, amount);
  await tx.update(checkoutSessions).set({ status: "complete", completedAt }).where(eq(checkoutSessions.id, s.id));
  await recordAudit(tx, SERVICE, {
    action: verdict.apply ? "payment.card" : "payment.card_flagged",
    entityType: "invoice",
    entityId: inv.id,
    accountId: inv.accountId,
    detail: { paymentId: row.id, eventId: event.id, sessionId: s.id, amountCents: amount, ...(verdict.apply ? {} : { reason: verdict.reason }) },
  });
  return { outcome: "payment_recorded", paymentId: row.id, invoiceId: inv.id, flagged: !verdict.apply };
}

/**
 * Applies one verified event exactly once: the event id is written in the same
 * transaction as its effect, so a repeat delivery finds it and does nothing,
 * and a failure rolls both back for the service to retry.
 */
export async function applyStripeEvent(event: Stripe.Event, notify?: InSameTx<EventOutcome>): Promise<EventOutcome> {
  return writeTxThen(async (tx) => {
    const fresh = await tx
      .insert(webhookEvents)
      .values({ id: event.id, type: event.type, receivedAt: nowIso() })
      .onConflictDoNothing()
      .returning({ id: webhookEvents.id });
    if (fresh.length === 0) return { outcome: "duplicate" };

    let result: EventOutcome;
    switch (event.type) {
      case "checkout.session.completed":
      case "checkout.session.async_payment_succeeded":
        result = await recordCardPayment(tx, event, event.data.object);
        break;
      case "checkout.session.expired":
        await tx.update(checkoutSessions).set({ status: "expired" }).where(eq(checkoutSessions.id, event.data.object.id));
        result = { outcome: "session_expired" };
        break;
      default:
        result = { outcome: "ignored" };
    }
    await tx.update(webhookEvents).set({ result: result.outcome }).where(eq(webhookEvents.id, event.id));
    return result;
  }, notify);
}
