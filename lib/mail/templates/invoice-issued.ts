import { formatDate } from "@/lib/format";
import { formatCents } from "@/lib/money";
import { renderMail, type RenderedMail } from "../layout";

export interface InvoiceIssuedMail {
  label: string;
  shopName: string;
  accountName: string;
  unitNumber: string;
  workOrderNumber: string;
  totalCents: number;
  dueOn: string;
  poNumber: string | null;
  taxExemptCertificate: string | null;
  url: string;
}

/** To the account's clerks, with the PDF attached and a link to pay. */
export function invoiceIssuedMail(m: InvoiceIssuedMail): RenderedMail {
  return renderMail({
    subject: `Invoice ${m.label} for unit ${m.unitNumber}: ${formatCents(m.totalCents)} due ${formatDate(m.dueOn)}`,
    heading: `Invoice ${m.label} from ${m.shopName}`,
    paragraphs: [
      `${m.shopName} has issued invoice ${m.label} to ${m.accountName} for the work on unit ${m.unitNumber} (${m.workOrderNumber}). The invoice is attached as a PDF.`,
      "You can pay it online by card, or by cheque or bank transfer quoting the invoice number.",
    ],
    facts: [
      ["Invoice", m.label],
      ["Amount due", formatCents(m.totalCents)],
      ["Due", formatDate(m.dueOn)],
      ["PO number", m.poNumber ?? "—"],
      ...(m.taxExemptCertificate !== null ? ([["Tax exempt", m.taxExemptCertificate || "on file"]] as [string, string][]) : []),
    ],
    action: { label: "View and pay the invoice", url: m.url },
  });
}
