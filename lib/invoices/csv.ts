import type { Cents } from "@/lib/money";
import type { PaymentState } from "./balance";

/**
 * CSV export of invoices and payments for a fleet's accounting (README,
 * "CSV export"). RFC 4180: comma separated, CRLF line ends, fields with a
 * comma, quote or line break in double quotes. Amounts are plain decimals
 * (1240.50), dates YYYY-MM-DD in the shop's time zone.
 */
export const CSV_COLUMNS = [
  "record",
  "date",
  "invoice",
  "work_order",
  "unit",
  "po_number",
  "status",
  "due_date",
  "labour",
  "parts",
  "sublet",
  "fees",
  "shop_supplies",
  "tax",
  "cores",
  "total",
  "method",
  "reference",
  "amount",
  "balance",
] as const;

export type CsvColumn = (typeof CSV_COLUMNS)[number];

export interface CsvInvoice {
  issuedOn: string;
  invoice: string;
  workOrder: string;
  unit: string;
  poNumber: string | null;
  state: PaymentState;
  dueOn: string;
  laborCents: Cents;
  partsCents: Cents;
  subletCents: Cents;
  feesCents: Cents;
  shopSuppliesCents: Cents;
  taxCents: Cents;
  coreCents: Cents;
  totalCents: Cents;
  balanceCents: Cents;
}

export interface CsvPayment {
  receivedOn: string;
  invoice: string;
  workOrder: string;
  unit: string;
  poNumber: string | null;
  /** applied, held (flagged, waiting for the shop) or returned. */
  status: "applied" | "held" | "returned";
  method: string;
  reference: string;
  amountCents: Cents;
}

export interface CsvCredit {
  issuedOn: string;
  /** The credit note's number, e.g. CN-4. */
  creditNote: string;
  invoice: string;
  workOrder: string;
  unit: string;
  poNumber: string | null;
  reason: string;
  amountCents: Cents;
}

/** 124050 → "1240.50"; −500 → "-5.00". */
export function decimalDollars(cents: Cents): string {
  const sign = cents < 0 ? "-" : "";
  const abs = Math.abs(cents);
  return `${sign}${Math.trunc(abs / 100)}.${String(abs % 100).padStart(2, "0")}`;
}

/**
 * Quotes per RFC 4180. Text a person typed that starts like a formula is
 * prefixed with an apostrophe so a spreadsheet shows it instead of running it
 * (OWASP, "CSV Injection").
 */
export function csvField(value: string, typedByPerson = false): string {
  let v = value;
  if (typedByPerson && /^[=+\-@\t\r]/.test(v)) v = `'${v}`;
  return /[",\r\n]/.test(v) ? `"${v.replaceAll('"', '""')}"` : v;
}

function invoiceRow(i: CsvInvoice): Record<CsvColumn, string> {
  return {
    record: "invoice",
    date: i.issuedOn,
    invoice: i.invoice,
    work_order: i.workOrder,
    unit: csvField(i.unit, true),
    po_number: csvField(i.poNumber ?? "", true),
    status: i.state,
    due_date: i.dueOn,
    labour: decimalDollars(i.laborCents),
    parts: decimalDollars(i.partsCents),
    sublet: decimalDollars(i.subletCents),
    fees: decimalDollars(i.feesCents),
    shop_supplies: decimalDollars(i.shopSuppliesCents),
    tax: decimalDollars(i.taxCents),
    cores: decimalDollars(i.coreCents),
    total: decimalDollars(i.totalCents),
    method: "",
    reference: "",
    amount: "",
    balance: decimalDollars(i.balanceCents),
  };
}

function paymentRow(p: CsvPayment): Record<CsvColumn, string> {
  return {
    record: "payment",
    date: p.receivedOn,
    invoice: p.invoice,
    work_order: p.workOrder,
    unit: csvField(p.unit, true),
    po_number: csvField(p.poNumber ?? "", true),
    status: p.status,
    due_date: "",
    labour: "",
    parts: "",
    sublet: "",
    fees: "",
    shop_supplies: "",
    tax: "",
    cores: "",
    total: "",
    method: p.method,
    reference: csvField(p.reference, true),
    amount: decimalDollars(p.amountCents),
    balance: "",
  };
}

/** A credit note reads like a payment that moved no money: it lowers what the invoice owes. */
function creditRow(c: CsvCredit): Record<CsvColumn, string> {
  return {
    ...paymentRow({ ...c, receivedOn: c.issuedOn, status: "applied", method: "credit_note", reference: "", amountCents: c.amountCents }),
    record: "credit",
    reference: csvField(`${c.creditNote}: ${c.reason}`, true),
  };
}

/** Invoices, payments and credit notes in date order (an invoice before what follows it on the same day). */
export function toCsv(invoices: readonly CsvInvoice[], payments: readonly CsvPayment[], credits: readonly CsvCredit[] = []): string {
  const rows = [
    ...invoices.map((i) => ({ date: i.issuedOn, order: 0, key: i.invoice, row: invoiceRow(i) })),
    ...payments.map((p) => ({ date: p.receivedOn, order: 1, key: p.invoice, row: paymentRow(p) })),
    ...credits.map((c) => ({ date: c.issuedOn, order: 2, key: c.invoice, row: creditRow(c) })),
  ].sort((a, b) => a.date.localeCompare(b.date) || a.order - b.order || a.key.localeCompare(b.key));
  const lines = [CSV_COLUMNS.join(","), ...rows.map((r) => CSV_COLUMNS.map((c) => r.row[c]).join(","))];
  return `${lines.join("\r\n")}\r\n`;
}
