import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { getInvoiceDetail } from "@/db/queries/invoices";
import { accountRecipients, shopRecipients, userEmail } from "@/db/queries/recipients";
import { accounts, creditNotes, payments } from "@/db/schema";
import { creditNoteLabel } from "@/lib/domain";
import { env } from "@/lib/env";
import { renderInvoicePdf } from "@/lib/pdf/invoice-pdf";
import { creditNoteMail } from "./templates/credit-note";
import { invoiceIssuedMail } from "./templates/invoice-issued";
import { paymentFlaggedMail } from "./templates/payment-flagged";
import { paymentReceiptMail } from "./templates/payment-receipt";
import { appUrl, sendMail } from "./send";

// Notices are sent by the system, which reads across accounts like the shop.
const SYSTEM = { role: "owner", accountId: null } as const;

/** The account's clerks, plus its billing address (accounts without a clerk get it there). */
async function billingRecipients(accountId: string): Promise<string[]> {
  const [clerks, [account]] = await Promise.all([
    accountRecipients(accountId, ["clerk"]),
    getDb().select({ email: accounts.billingEmail }).from(accounts).where(eq(accounts.id, accountId)).limit(1),
  ]);
  return [...clerks, ...(account?.email ? [account.email] : [])];
}

export async function notifyInvoiceIssued(invoiceId: string): Promise<void> {
  const inv = await getInvoiceDetail(SYSTEM, invoiceId);
  if (!inv) return;
  const timeZone = env().APP_TIME_ZONE;
  const pdf = await renderInvoicePdf(inv, timeZone);
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
  await sendMail(await billingRecipients(inv.accountId), mail, "invoice-issued", [
    { filename: `${inv.label}.pdf`, content: pdf, contentType: "application/pdf" },
  ]);
}

export async function notifyPaymentReceived(paymentId: string): Promise<void> {
  const [p] = await getDb().select().from(payments).where(eq(payments.id, paymentId)).limit(1);
  if (!p) return;
  const inv = await getInvoiceDetail(SYSTEM, p.invoiceId);
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
  const payer = p.method === "card" ? await userEmail(p.recordedBy) : [];
  await sendMail([...(await billingRecipients(inv.accountId)), ...payer], mail, "payment-receipt");
}

export async function notifyCreditNote(creditNoteId: string): Promise<void> {
  const [c] = await getDb().select().from(creditNotes).where(eq(creditNotes.id, creditNoteId)).limit(1);
  if (!c) return;
  const inv = await getInvoiceDetail(SYSTEM, c.invoiceId);
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
  await sendMail(await billingRecipients(inv.accountId), mail, "credit-note");
}

export async function notifyPaymentFlagged(paymentId: string): Promise<void> {
  const [p] = await getDb().select().from(payments).where(eq(payments.id, paymentId)).limit(1);
  if (!p?.flagged) return;
  const inv = await getInvoiceDetail(SYSTEM, p.invoiceId);
  if (!inv) return;
  const mail = paymentFlaggedMail({
    label: inv.label,
    accountName: inv.accountName,
    amountCents: p.amountCents,
    reason: p.flagReason ?? "",
    url: appUrl(`/invoices/${inv.id}`),
  });
  await sendMail(await shopRecipients(["owner", "writer"]), mail, "payment-flagged");
}
