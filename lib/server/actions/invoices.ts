"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { issueInvoice, markLinesDone, setWorkOrderPoNumber } from "@/db/queries/invoice-issue";
import { issueCreditNote } from "@/db/queries/credit-notes";
import { recordManualPayment, resolveFlaggedPayment, voidInvoice } from "@/db/queries/payments";
import { guardedAction } from "@/lib/server/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { env } from "@/lib/env";
import { calendarDate } from "@/lib/format";
import { localMiddayIso } from "@/lib/dates";
import { afterResponse } from "@/lib/server/http/after-response";
import { queueCreditNote, queueInvoiceIssued, queuePaymentReceived } from "@/lib/server/notifications/invoices";
import { expireCheckoutSession } from "@/lib/server/payments/stripe";
import {
  creditNoteInput,
  issueInvoiceInput,
  markLinesDoneInput,
  recordPaymentInput,
  resolvePaymentInput,
  setPoNumberInput,
  voidInvoiceInput,
} from "@/lib/validation/invoices";

function refreshInvoice(invoiceId: string, workOrderId?: string) {
  revalidatePath(`/invoices/${invoiceId}`);
  revalidatePath(`/fleet/invoices/${invoiceId}`);
  revalidatePath("/invoices");
  revalidatePath("/receivables");
  if (workOrderId) revalidatePath(`/work-orders/${workOrderId}`);
}

export const issueInvoiceAction = guardedAction({ roles: CAN.issueInvoices, input: issueInvoiceInput }, async ({ user, input }) => {
  const created = await issueInvoice(user, input.workOrderId, { poNumber: input.poNumber }, undefined, (tx, inv) => queueInvoiceIssued(tx, inv.id));
  refreshInvoice(created.id, input.workOrderId);
  // The issue form disappears once the invoice exists, so go to the invoice from here.
  redirect(`/invoices/${created.id}`);
});

export const markLinesDoneAction = guardedAction({ roles: CAN.issueInvoices, input: markLinesDoneInput }, async ({ user, input }) => {
  const result = await markLinesDone(user, input.workOrderId, input.lineIds);
  revalidatePath(`/work-orders/${input.workOrderId}`);
  return result;
});

export const setPoNumberAction = guardedAction({ roles: CAN.enterPoNumber, input: setPoNumberInput }, async ({ user, input }) => {
  const result = await setWorkOrderPoNumber(user, input.workOrderId, input.poNumber);
  revalidatePath(`/work-orders/${input.workOrderId}`);
  revalidatePath("/fleet/invoices");
  return result;
});

export const recordPaymentAction = guardedAction({ roles: CAN.issueInvoices, input: recordPaymentInput }, async ({ user, input }) => {
  const timeZone = env().APP_TIME_ZONE;
  const now = new Date();
  // A payment dated today keeps its real time; an earlier date is placed at midday so it stays on that day.
  const receivedAt = input.receivedOn === calendarDate(now, timeZone) ? now.toISOString() : localMiddayIso(input.receivedOn, timeZone);
  const result = await recordManualPayment(
    user,
    input.invoiceId,
    { method: input.method, amountCents: input.amount, reference: input.reference, receivedAt, note: input.note },
    (tx, r) => queuePaymentReceived(tx, r.paymentId),
  );
  refreshInvoice(input.invoiceId);
  return result;
});

export const creditNoteAction = guardedAction({ roles: CAN.issueInvoices, input: creditNoteInput }, async ({ user, input }) => {
  const result = await issueCreditNote(user, input.invoiceId, { amountCents: input.amount, reason: input.reason }, (tx, c) => queueCreditNote(tx, c.id));
  refreshInvoice(input.invoiceId);
  return result;
});

export const voidInvoiceAction = guardedAction({ roles: CAN.issueInvoices, input: voidInvoiceInput }, async ({ user, input }) => {
  const result = await voidInvoice(user, input.invoiceId, input.reason);
  // Close any payment page still open for it, after the redirect has gone out: the payment service
  // may be slow, and a payment that slips through is held for review anyway.
  afterResponse(() => Promise.allSettled(result.openCheckoutSessionIds.map(expireCheckoutSession)));
  refreshInvoice(input.invoiceId, result.workOrderId);
  // Next step is the corrected invoice, issued from the work order.
  redirect(`/work-orders/${result.workOrderId}#invoice`);
});

export const resolvePaymentAction = guardedAction({ roles: CAN.issueInvoices, input: resolvePaymentInput }, async ({ user, input }) => {
  const result = await resolveFlaggedPayment(user, input.paymentId, input.resolution);
  refreshInvoice(result.invoiceId);
  return result;
});
