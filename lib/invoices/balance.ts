import { formatCents, type Cents } from "@/lib/money";
import type { InvoiceStatus } from "@/lib/domain";
import { addDays } from "@/lib/dates";

/** What people read: the stored status plus "partly paid" for an open invoice with money on it. */
export type PaymentState = "open" | "partly_paid" | "paid" | "void";

export const PAYMENT_STATE_LABELS: Record<PaymentState, string> = {
  open: "Open",
  partly_paid: "Partly paid",
  paid: "Paid",
  void: "Void",
};

export interface InvoiceMoney {
  status: InvoiceStatus;
  totalCents: Cents;
  paidCents: Cents;
  /** Credit notes issued against the invoice. */
  creditedCents: Cents;
}

/** What is still owed: total less payments and credit notes; nothing on a void invoice. */
export function balanceOf(inv: InvoiceMoney): Cents {
  return inv.status === "void" ? 0 : inv.totalCents - inv.paidCents - inv.creditedCents;
}

export function paymentStateOf(inv: InvoiceMoney): PaymentState {
  if (inv.status === "void") return "void";
  if (balanceOf(inv) <= 0) return "paid";
  return inv.paidCents > 0 ? "partly_paid" : "open";
}

function settled(inv: InvoiceMoney): InvoiceMoney {
  return { ...inv, status: balanceOf({ ...inv, status: "open" }) <= 0 ? "paid" : "open" };
}

/** The invoice after an applied payment: nothing left owing closes it. */
export function afterPayment(inv: InvoiceMoney, amountCents: Cents): InvoiceMoney {
  return settled({ ...inv, paidCents: inv.paidCents + amountCents });
}

/** The invoice after a credit note: like a payment, it can settle what is left. */
export function afterCredit(inv: InvoiceMoney, amountCents: Cents): InvoiceMoney {
  return settled({ ...inv, creditedCents: inv.creditedCents + amountCents });
}

/**
 * A credit note lowers what is owed and never more: past the open balance it
 * would be a refund, which is settled with the account outside Cotter.
 */
export function creditProblem(inv: InvoiceMoney, amountCents: Cents): string | null {
  if (inv.status === "void") return "This invoice is void; a void invoice owes nothing to credit.";
  if (amountCents <= 0) return "Enter a credit above zero.";
  const balance = balanceOf(inv);
  if (balance <= 0) return "This invoice is paid in full, so there is nothing left to credit; settle a refund with the account directly.";
  if (amountCents > balance) {
    return `A ${formatCents(amountCents)} credit is more than the open balance of ${formatCents(balance)}; a credit can only lower what is owed.`;
  }
  return null;
}

/** Due date: the issue date in the shop's time zone plus the account's payment terms. */
export function dueDateOf(issuedOn: string, termsDays: number): string {
  return addDays(issuedOn, termsDays);
}

export type OnlineVerdict = { apply: true } | { apply: false; reason: string };

/**
 * A card payment takes effect only when it is exactly the open balance of an
 * open invoice. Anything else is recorded and held for the shop to look at,
 * never silently applied.
 */
export function judgeOnlinePayment(inv: InvoiceMoney, amountCents: Cents): OnlineVerdict {
  if (inv.status === "void") return { apply: false, reason: `Paid ${formatCents(amountCents)} on a void invoice.` };
  const balance = balanceOf(inv);
  if (balance <= 0) return { apply: false, reason: `Paid ${formatCents(amountCents)} on an invoice that was already paid in full.` };
  if (amountCents !== balance) {
    return {
      apply: false,
      reason: `Paid ${formatCents(amountCents)} but the open balance was ${formatCents(balance)}.`,
    };
  }
  return { apply: true };
}

/** A payment the shop records by hand (cheque, transfer): more than the balance is refused. */
export function manualPaymentProblem(inv: InvoiceMoney, amountCents: Cents): string | null {
  if (inv.status === "void") return "This invoice is void; record the payment against its replacement.";
  const balance = balanceOf(inv);
  if (balance <= 0) return "This invoice is already paid in full.";
  if (amountCents <= 0) return "Enter an amount above zero.";
  if (amountCents > balance) {
    return `${formatCents(amountCents)} is more than the open balance of ${formatCents(balance)}.`;
  }
  return null;
}
