import { formatCents } from "@/lib/money";
import { renderMail, type RenderedMail } from "../layout";

export interface CreditNoteMail {
  creditNote: string;
  invoice: string;
  shopName: string;
  amountCents: number;
  reason: string;
  balanceCents: number;
  url: string;
}

/** To the account's billing people: what was credited, why, and what is still owed. */
export function creditNoteMail(m: CreditNoteMail): RenderedMail {
  const amount = formatCents(m.amountCents);
  return renderMail({
    subject: `Credit ${m.creditNote}: ${amount} off invoice ${m.invoice}`,
    heading: `${amount} credited on ${m.invoice}`,
    paragraphs: [
      `${m.shopName} issued credit note ${m.creditNote} for ${amount} against invoice ${m.invoice}: ${m.reason}.`,
      m.balanceCents <= 0 ? "Nothing is left to pay on this invoice." : `${formatCents(m.balanceCents)} is still open on this invoice.`,
    ],
    facts: [
      ["Credit note", m.creditNote],
      ["Invoice", m.invoice],
      ["Credited", amount],
      ["For", m.reason],
      ["Balance", formatCents(Math.max(m.balanceCents, 0))],
    ],
    action: { label: "View the invoice", url: m.url },
  });
}
