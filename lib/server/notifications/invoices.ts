import "server-only";
import { eq } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { getInvoiceDetail } from "@/db/queries/invoices";
import { accountRecipients, shopRecipients, userEmail } from "@/db/queries/recipients";
import { accounts, creditNotes, payments } from "@/db/schema";
import { creditNoteLabel } from "@/lib/domain";
import { env } from "@/lib/env";
import { queueMail } from "@/lib/server/mail/queue";
import { appUrl } from "@/lib/server/mail/send";
import { creditNoteMail } from "@/lib/mail/templates/credit-note";
import { invoiceIssuedMail } from "@/lib/mail/templates/invoice-issued";
import { paymentFlaggedMail } from "@/lib/mail/templates/payment-flagged";
import { paymentReceiptMail } from "@/lib/mail/templates/payment-receipt";

// Notices are sent by the system, which reads across accounts like the shop.
const SYSTEM = { role: "owner", accountId: null } as const;

/** The account's clerks, plus its billing address (accounts without a clerk get it there). */
async function billingRecipients(tx: Tx, accountId: string): Promise<string[]> {
  const [clerks, [account]] = await Promise.all([
    accountRecipients(accountId, ["clerk"], tx),
    tx.select({ email: accounts.billingEmail }).from(accounts).where(eq(accounts.id, accountId)).limit(1),
  ]);
  return [...clerks, ...(account?.email ? [account.email] : [])];
}

/** Queued in the invoice's own transaction; the PDF is drawn when the message is sent. */
export async function queueInvoiceIssued(tx: Tx, invoiceId: string): Promise<void> {
  const inv = await getInvoiceDetail(SYSTEM, invoiceId, tx);
  if (!inv) return;
  const mail = invoiceIssuedMail({
    label: inv.label,
    shopName: inv.shop?.name ?? "The shop",
    accountName: inv.accountName,
    unitNumber: inv.unit?.unitNumber ?? "",
    workOrderNumber: inv.workOrderNumber,
    totalCents: inv.totalCents,
    dueOn: inv.dueAt,
    poNumber: inv.poNumber,
    taxExemptCertificate: inv.taxExemptCertificate,
    url: appUrl(`/fleet/invoices/${inv.id}`),
  });
  await queueMail(tx, {
    to: await billingRecipients(tx, inv.accountId),
    template: "invoice-issued",
    mail,
    attachments: [{ kind: "invoice_pdf", invoiceId: inv.id, filename: `${inv.label}.pdf` }],
  });
}

export async function queuePaymentReceived(tx: Tx, paymentId: string): Promise<void> {
  const [p] = await tx.select().from(payments).where(eq(payments.id, paymentId)).limit(1);
  if (!p) return;
  const inv = await getInvoiceDetail(SYSTEM, p.invoiceId, tx);
  if (!inv) return;
  const mail = paymentReceiptMail({
    label: inv.label,
    shopName: inv.shop?.name ?? "The shop",
    amountCents: p.amountCents,
    method: p.method,
    reference: p.reference,
    receivedAt: p.receivedAt,
    timeZone: env().APP_TIME_ZONE,
    balanceCents: inv.balanceCents,
    held: !p.applied,
    url: appUrl(`/fleet/invoices/${inv.id}`),
  });
  const payer = p.method === "card" ? await userEmail(p.recordedBy, tx) : [];
  await queueMail(tx, { to: [...(await billingRecipients(tx, inv.accountId)), ...payer], template: "payment-receipt", mail });
}

export async function queueCreditNote(tx: Tx, creditNoteId: string): Promise<void> {
  const [c] = await tx.select().from(creditNotes).where(eq(creditNotes.id, creditNoteId)).limit(1);
  if (!c) return;
  const inv = await getInvoiceDetail(SYSTEM, c.invoiceId, tx);
  if (!inv) return;
  const mail = creditNoteMail({
    creditNote: creditNoteLabel(c.number),
    invoice: inv.label,
    shopName: inv.shop?.name ?? "The shop",
    amountCents: c.amountCents,
    reason: c.reason,
    balanceCents: inv.balanceCents,
    url: appUrl(`/fleet/invoices/${inv.id}`),
  });
  await queueMail(tx, { to: await billingRecipients(tx, inv.accountId), template: "credit-note", mail });
}

export async function queuePaymentFlagged(tx: Tx, paymentId: string): Promise<void> {
  const [p] = await tx.select().from(payments).where(eq(payments.id, paymentId)).limit(1);
  if (!p?.flagged) return;
  const inv = await getInvoiceDetail(SYSTEM, p.invoiceId, tx);
  if (!inv) return;
  const mail = paymentFlaggedMail({
    label: inv.label,
    accountName: inv.accountName,
    amountCents: p.amountCents,
    reason: p.flagReason ?? "",
    url: appUrl(`/invoices/${inv.id}`),
  });
  await queueMail(tx, { to: await shopRecipients(["owner", "writer"], tx), template: "payment-flagged", mail });
}
