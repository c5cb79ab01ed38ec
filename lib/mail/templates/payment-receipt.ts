import { formatDate } from "@/lib/format";
import { PAYMENT_METHOD_LABELS } from "@/lib/invoices/format";
import { formatCents } from "@/lib/money";
import { renderMail, type RenderedMail } from "../layout";

export interface PaymentReceiptMail {
  label: string;
  shopName: string;
  amountCents: number;
  method: string;
  reference: string;
  receivedAt: string;
  timeZone: string;
  balanceCents: number;
  /** A card payment that did not match the balance: received, not yet applied. */
  held: boolean;
  url: string;
}

/** Sent for every payment, however it arrived. */
export function paymentReceiptMail(m: PaymentReceiptMail): RenderedMail {
  const amount = formatCents(m.amountCents);
  const paragraphs = m.held
    ? [
        `${m.shopName} received ${amount} for invoice ${m.label}. The amount does not match what was open on the invoice, so the shop will look at it and apply or return it; you do not need to do anything.`,
      ]
    : [
        `${m.shopName} received ${amount} for invoice ${m.label}. Thank you.`,
        m.balanceCents <= 0 ? "The invoice is now paid in full." : `${formatCents(m.balanceCents)} is still open on this invoice.`,
      ];
  return renderMail({
    subject: `Receipt: ${amount} for invoice ${m.label}`,
    heading: `Payment received: ${amount}`,
    paragraphs,
    facts: [
      ["Invoice", m.label],
      ["Amount", amount],
      ["Paid by", PAYMENT_METHOD_LABELS[m.method] ?? m.method],
      ...(m.reference ? ([["Reference", m.reference]] as [string, string][]) : []),
      ["Received", formatDate(m.receivedAt, m.timeZone)],
      ["Balance", m.held ? "Unchanged until the shop applies it" : formatCents(Math.max(m.balanceCents, 0))],
    ],
    action: { label: "View the invoice", url: m.url },
  });
}
