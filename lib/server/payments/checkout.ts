import "server-only";
import { payableInvoice, recordCheckoutSession, setCheckoutStatus } from "@/db/queries/checkout";
import type { SessionUser } from "@/lib/auth/session-user";
import { workOrderLabel } from "@/lib/domain";
import { HttpError } from "@/lib/http/problem";
import { appUrl } from "@/lib/server/mail/send";
import { createCheckoutSession, isServiceUnavailable, retrieveCheckoutSession } from "./stripe";

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
  const { invoice: i, workOrderNumber, label, balance, recentSessionId } = await payableInvoice(user, invoiceId);
  if (recentSessionId) {
    const current = await retrieveCheckoutSession(recentSessionId).catch(() => null);
    if (current?.status === "open" && current.url) return { url: current.url, sessionId: current.id };
    if (current?.status) await setCheckoutStatus(recentSessionId, current.status);
  }

  const back = appUrl(fleetInvoicePath(i.id));
  const session = await createCheckoutSession({
    invoiceId: i.id,
    accountId: i.accountId,
    title: `Invoice ${label}`,
    description: `${workOrderLabel(workOrderNumber)}, ${i.unitSnapshot?.unitNumber ?? "unit"}: open balance`,
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
  await recordCheckoutSession(user, { id: session.id, invoiceId: i.id, accountId: i.accountId, amountCents: balance, url: session.url });
  return { url: session.url, sessionId: session.id };
}
