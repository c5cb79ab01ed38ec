import { formatCents } from "@/lib/money";
import { renderMail, type RenderedMail } from "../layout";

export interface PaymentFlaggedMail {
  label: string;
  accountName: string;
  amountCents: number;
  reason: string;
  url: string;
}

/** To the shop's owner and writers: a card payment was recorded but not applied. */
export function paymentFlaggedMail(m: PaymentFlaggedMail): RenderedMail {
  return renderMail({
    subject: `Check a card payment: ${formatCents(m.amountCents)} on ${m.label}`,
    heading: "A card payment needs a look",
    paragraphs: [
      `${m.accountName} paid ${formatCents(m.amountCents)} by card on invoice ${m.label}. ${m.reason}`,
      "The payment is recorded but not applied to the balance. Open the invoice to apply it, or note that it was returned.",
    ],
    facts: [
      ["Invoice", m.label],
      ["Account", m.accountName],
      ["Amount", formatCents(m.amountCents)],
    ],
    action: { label: "Open the invoice", url: m.url },
  });
}
