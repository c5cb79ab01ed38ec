import { invoiceLabel, workOrderLabel, type InvoiceStatus } from "../domain";
import { balanceOf, paymentStateOf } from "../invoices/balance";

/** The stored fields of an invoice every answer about one carries, with the names it is read by. */
export interface InvoiceFields {
  id: string;
  number: number;
  accountId: string;
  accountName: string;
  workOrderId: string;
  workOrderNumber: number;
  status: InvoiceStatus;
  issuedAt: string;
  dueOn: string;
  poNumber: string | null;
  totalCents: number;
  paidCents: number;
  creditedCents: number;
}

/**
 * An invoice on the way out, the one shape of its own fields: the list and the
 * detail (GET /api/v1/invoices, /invoices/:id, the pages) add theirs beside
 * these, so the label, the payment state and the balance are worked out once.
 */
export function invoiceOut(i: InvoiceFields) {
  return {
    id: i.id,
    number: i.number,
    label: invoiceLabel(i.number),
    accountId: i.accountId,
    accountName: i.accountName,
    workOrderId: i.workOrderId,
    workOrderNumber: workOrderLabel(i.workOrderNumber),
    poNumber: i.poNumber,
    status: i.status,
    paymentState: paymentStateOf(i),
    issuedAt: i.issuedAt,
    // A due date is a calendar date in the shop's time zone (ISO 8601 date).
    dueAt: i.dueOn,
    totalCents: i.totalCents,
    paidCents: i.paidCents,
    creditedCents: i.creditedCents,
    balanceCents: balanceOf(i),
  };
}

export type InvoiceOut = ReturnType<typeof invoiceOut>;
