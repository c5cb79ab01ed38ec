import { and, eq } from "drizzle-orm";
import { writeTx, writeTxThen, type InSameTx, type Tx } from "@/db/client";
import { checkoutSessions, invoices, payments, type Invoice } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { invoiceLabel, type PaymentMethod } from "@/lib/domain";
import { conflict, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { afterPayment, balanceOf, manualPaymentProblem } from "@/lib/invoices/balance";
import { recordAudit } from "./audit";
import { settleNothingToBill } from "./billing-state";
import { scopedTo } from "./scope";

/** The invoice, scoped to the user's account; another account's is not found. */
export async function invoiceFor(tx: Tx, user: SessionUser, invoiceId: string): Promise<Invoice> {
  const [inv] = await tx
    .select()
    .from(invoices)
    .where(and(eq(invoices.id, invoiceId), scopedTo(invoices.accountId, user)))
    .limit(1);
  if (!inv) throw notFound("That invoice");
  return inv;
}

/** Adds an applied payment to the invoice's paid amount; paid in full closes it. */
export async function applyToInvoice(tx: Tx, inv: Invoice, amountCents: number): Promise<Invoice> {
  const next = afterPayment(inv, amountCents);
  await tx
    .update(invoices)
    .set({ paidCents: next.paidCents, status: next.status, updatedAt: nowIso() })
    .where(eq(invoices.id, inv.id));
  return { ...inv, paidCents: next.paidCents, status: next.status };
}

export interface ManualPayment {
  method: Exclude<PaymentMethod, "card">;
  amountCents: number;
  reference: string;
  /** ISO instant the money arrived. */
  receivedAt: string;
  note?: string;
}

/** A cheque, transfer or cash payment the shop records by hand, whole or in part. */
export async function recordManualPayment(user: SessionUser, invoiceId: string, input: ManualPayment, notify?: InSameTx<{ paymentId: string }>) {
  return writeTxThen(async (tx) => {
    const inv = await invoiceFor(tx, user, invoiceId);
    const problem = manualPaymentProblem(inv, input.amountCents);
    if (problem) throw conflict("payment_refused", problem);
    const [row] = await tx
      .insert(payments)
      .values({
        invoiceId: inv.id,
        accountId: inv.accountId,
        method: input.method,
        amountCents: input.amountCents,
        reference: input.reference,
        receivedAt: input.receivedAt,
        recordedBy: user.id,
        note: input.note ?? "",
      })
      .returning({ id: payments.id });
    if (!row) throw new Error("payment insert returned nothing");
    const after = await applyToInvoice(tx, inv, input.amountCents);
    await recordAudit(tx, user, {
      action: "payment.record",
      entityType: "invoice",
      entityId: inv.id,
      accountId: inv.accountId,
      detail: { paymentId: row.id, method: input.method, amountCents: input.amountCents, reference: input.reference },
    });
    return { paymentId: row.id, invoiceId: inv.id, status: after.status, balanceCents: balanceOf(after) };
  }, notify);
}

/**
 * Voids an open invoice with no payments on it. The number stays used (the
 * sequence has no gaps) and the invoice stays readable; the work order can
 * then be invoiced again. Returns the open payment pages to close.
 */
export async function voidInvoice(user: SessionUser, invoiceId: string, reason: string) {
  return writeTx(async (tx) => {
    const inv = await invoiceFor(tx, user, invoiceId);
    const label = invoiceLabel(inv.number);
    if (inv.status === "void") throw conflict("already_void", `${label} is already void.`);
    const [paid] = await tx.select({ id: payments.id }).from(payments).where(eq(payments.invoiceId, inv.id)).limit(1);
    if (paid || inv.paidCents > 0) {
      throw conflict("has_payments", `${label} has payments recorded against it, so it cannot be voided.`);
    }
    if (inv.creditedCents > 0) {
      throw conflict("has_credit_notes", `${label} has credit notes against it, so it cannot be voided; credit the rest instead.`);
    }
    const at = nowIso();
    await tx
      .update(invoices)
      .set({ status: "void", voidedAt: at, voidedBy: user.id, voidReason: reason, updatedAt: at })
      .where(eq(invoices.id, inv.id));
    // The visit's work is open for billing again.
    await settleNothingToBill(tx, inv.workOrderId);
    const open = await tx
      .select({ id: checkoutSessions.id })
      .from(checkoutSessions)
      .where(and(eq(checkoutSessions.invoiceId, inv.id), eq(checkoutSessions.status, "open")));
    await recordAudit(tx, user, {
      action: "invoice.void",
      entityType: "invoice",
      entityId: inv.id,
      accountId: inv.accountId,
      detail: { number: inv.number, reason },
    });
    return { invoiceId: inv.id, workOrderId: inv.workOrderId, openCheckoutSessionIds: open.map((o) => o.id) };
  });
}

/** The shop's decision on a card payment that did not match: apply it, or note it went back to the payer. */
export async function resolveFlaggedPayment(user: SessionUser, paymentId: string, resolution: "applied" | "returned") {
  return writeTx(async (tx) => {
    const [p] = await tx
      .select()
      .from(payments)
      .where(and(eq(payments.id, paymentId), scopedTo(payments.accountId, user)))
      .limit(1);
    if (!p) throw notFound("That payment");
    if (!p.flagged || p.resolution !== null) throw conflict("not_flagged", "This payment is not waiting for a decision.");
    const inv = await invoiceFor(tx, user, p.invoiceId);
    if (resolution === "applied" && inv.status === "void") {
      throw conflict("invoice_void", `${invoiceLabel(inv.number)} is void; a payment cannot be applied to it.`);
    }
    const at = nowIso();
    await tx
      .update(payments)
      .set({ resolution, resolvedAt: at, resolvedBy: user.id, applied: resolution === "applied" })
      .where(eq(payments.id, p.id));
    if (resolution === "applied") await applyToInvoice(tx, inv, p.amountCents);
    await recordAudit(tx, user, {
      action: `payment.${resolution}`,
      entityType: "invoice",
      entityId: inv.id,
      accountId: inv.accountId,
      detail: { paymentId: p.id, amountCents: p.amountCents },
    });
    return { invoiceId: inv.id };
  });
}
