import "server-only";
import PDFDocument from "pdfkit";
import { LINE_KIND_LABELS, type LineKind } from "@/lib/domain";
import { formatDate } from "@/lib/format";
import { PAYMENT_STATE_LABELS, type PaymentState } from "@/lib/invoices/balance";
import type { BillTo, ShopSnapshot, UnitSnapshot } from "@/lib/invoices/snapshot";
import { formatQuantityOf, formatUnitPriceOf, PAYMENT_METHOD_LABELS } from "@/lib/invoices/format";
import { formatCents } from "@/lib/money";

/** What the PDF shows; the invoice detail read satisfies it. */
export interface InvoiceDocument {
  label: string;
  paymentState: PaymentState;
  issuedAt: string;
  dueAt: string;
  termsDays: number;
  poNumber: string | null;
  billTo: BillTo;
  shop: ShopSnapshot | null;
  unit: UnitSnapshot | null;
  workOrderNumber: string;
  taxExemptCertificate: string | null;
  taxRatePercent: number;
  lines: { kind: LineKind; description: string; partNumber: string; quantityMilli: number; unitPriceCents: number; amountCents: number; coreChargeCents: number }[];
  totals: {
    laborCents: number;
    partsCents: number;
    subletCents: number;
    feesCents: number;
    shopSuppliesCents: number;
    taxCents: number;
    coreCents: number;
    totalCents: number;
  };
  paidCents: number;
  creditedCents: number;
  balanceCents: number;
  payments: { receivedAt: string; method: string; reference: string; amountCents: number; applied: boolean; resolution: string | null }[];
  creditNotes: { label: string; issuedAt: string; reason: string; amountCents: number }[];
  voidReason: string | null;
}

const INK = "#2a2a28";
const FAINT = "#6e685e";
const RUST = "#b4501e";
const LEFT = 50;
const RIGHT = 562;
const BOTTOM = 720;

// Column x positions of the line table (Letter, 612 pt wide, 50 pt margins).
const COL = { desc: LEFT, kind: 318, qty: 372, price: 420, amount: 490 };

function money(cents: number): string {
  return formatCents(cents);
}

/**
 * Renders the invoice as a PDF with the built-in Helvetica faces (no font
 * files to ship). Everything shown comes from the issued snapshot.
 */
export function renderInvoicePdf(inv: InvoiceDocument, timeZone: string): Promise<Buffer> {
  const doc = new PDFDocument({ size: "LETTER", margin: 50, info: { Title: `Invoice ${inv.label}`, Author: inv.shop?.name ?? "Cotter" } });
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("data", (c: Buffer) => chunks.push(c));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });

  // Shop (left) and invoice facts (right).
  const shop = inv.shop;
  doc.fillColor(INK).font("Helvetica-Bold").fontSize(16).text(shop?.name ?? "", LEFT, 50, { width: 300 });
  doc.font("Helvetica").fontSize(9).fillColor(FAINT);
  for (const line of [...(shop?.addressLines ?? []), shop?.phone ?? "", shop?.email ?? ""].filter(Boolean)) doc.text(line, { width: 300 });
  doc.fillColor(RUST).font("Helvetica-Bold").fontSize(22).text("INVOICE", 360, 48, { width: RIGHT - 360, align: "right" });
  doc.fillColor(INK).fontSize(12).text(inv.label, 360, doc.y, { width: RIGHT - 360, align: "right" });
  const facts: [string, string][] = [
    ["Issued", formatDate(inv.issuedAt, timeZone)],
    ["Due", formatDate(inv.dueAt)],
    ["Terms", `Net ${inv.termsDays} days`],
    ["PO number", inv.poNumber ?? "—"],
    ["Work order", inv.workOrderNumber],
    ["Status", PAYMENT_STATE_LABELS[inv.paymentState]],
  ];
  let y = doc.y + 4;
  doc.fontSize(9);
  for (const [k, v] of facts) {
    doc.font("Helvetica").fillColor(FAINT).text(k, 360, y, { width: 80 });
    doc.font("Helvetica-Bold").fillColor(INK).text(v, 440, y, { width: RIGHT - 440, align: "right" });
    y += 13;
  }

  // Bill to and unit.
  y = Math.max(y, 150) + 10;
  doc.moveTo(LEFT, y).lineTo(RIGHT, y).strokeColor("#d8cdb9").stroke();
  y += 10;
  const bill = inv.billTo;
  doc.font("Helvetica-Bold").fontSize(9).fillColor(FAINT).text("BILL TO", LEFT, y);
  doc.font("Helvetica-Bold").fontSize(10).fillColor(INK).text(bill.accountName, LEFT, y + 13, { width: 240 });
  doc.font("Helvetica").fontSize(9);
  for (const line of [bill.contactName, ...bill.address.split("\n"), bill.email, bill.phone].filter(Boolean)) doc.text(line, { width: 240 });
  if (inv.taxExemptCertificate !== null) {
    doc.font("Helvetica-Bold").text(`Tax exempt, certificate ${inv.taxExemptCertificate || "on file"}`, { width: 240 });
  }
  const leftBottom = doc.y;
  const unit = inv.unit;
  doc.font("Helvetica-Bold").fontSize(9).fillColor(FAINT).text("UNIT", 320, y);
  if (unit) {
    doc.font("Helvetica-Bold").fontSize(10).fillColor(INK).text(`Unit ${unit.unitNumber}`, 320, y + 13, { width: RIGHT - 320 });
    doc.font("Helvetica").fontSize(9);
    doc.text([unit.year, unit.description].filter(Boolean).join(" "), { width: RIGHT - 320 });
    if (unit.vin) doc.text(`VIN ${unit.vin}`, { width: RIGHT - 320 });
    else if (unit.serialNumber) doc.text(`Serial ${unit.serialNumber}`, { width: RIGHT - 320 });
    doc.text(`${inv.workOrderNumber}: ${unit.workOrderTitle}`, { width: RIGHT - 320 });
  }
  y = Math.max(leftBottom, doc.y) + 16;

  // The three Cs of the visit: complaint, cause, correction.
  const threeCs = unit?.concerns ?? [];
  if (threeCs.length) {
    doc.font("Helvetica-Bold").fontSize(9).fillColor(FAINT).text("WORK PERFORMED", LEFT, y);
    y = doc.y + 4;
    threeCs.forEach((c, i) => {
      const rows: [string, string][] = [[`Complaint ${i + 1}`, c.complaint], ["Cause", c.cause || "—"], ["Correction", c.correction || "—"]];
      for (const [label, text] of rows) {
        const height = doc.font("Helvetica").fontSize(9).heightOfString(text, { width: RIGHT - LEFT - 80 });
        if (y + height > BOTTOM) {
          doc.addPage();
          y = 50;
        }
        doc.font("Helvetica").fontSize(9).fillColor(FAINT).text(label, LEFT, y, { width: 78 });
        doc.font(label.startsWith("Complaint") ? "Helvetica-Bold" : "Helvetica").fillColor(INK).text(text, LEFT + 80, y, { width: RIGHT - LEFT - 80 });
        y += height + 3;
      }
      y += 4;
    });
    y += 8;
  }

  // Lines.
  const header = (top: number) => {
    doc.font("Helvetica-Bold").fontSize(8).fillColor(FAINT);
    doc.text("DESCRIPTION", COL.desc, top, { width: COL.kind - COL.desc - 8 });
    doc.text("KIND", COL.kind, top, { width: COL.qty - COL.kind });
    doc.text("QTY", COL.qty, top, { width: COL.price - COL.qty - 6, align: "right" });
    doc.text("UNIT PRICE", COL.price, top, { width: COL.amount - COL.price - 6, align: "right" });
    doc.text("AMOUNT", COL.amount, top, { width: RIGHT - COL.amount, align: "right" });
    doc.moveTo(LEFT, top + 12).lineTo(RIGHT, top + 12).strokeColor(INK).stroke();
    return top + 18;
  };
  y = header(y);
  doc.fontSize(9).fillColor(INK);
  for (const line of inv.lines) {
    const text = line.partNumber ? `${line.description} (${line.partNumber})` : line.description;
    const core = line.coreChargeCents > 0 ? `Core charge ${money(line.coreChargeCents)} each, refunded when the core comes back` : "";
    doc.font("Helvetica");
    const height = doc.heightOfString(text, { width: COL.kind - COL.desc - 8 }) + (core ? 11 : 0);
    if (y + height > BOTTOM) {
      doc.addPage();
      y = header(50);
    }
    doc.font("Helvetica").fillColor(INK).text(text, COL.desc, y, { width: COL.kind - COL.desc - 8 });
    if (core) doc.fontSize(7.5).fillColor(FAINT).text(core, COL.desc, doc.y, { width: COL.kind - COL.desc - 8 }).fontSize(9).fillColor(INK);
    doc.text(LINE_KIND_LABELS[line.kind], COL.kind, y, { width: COL.qty - COL.kind });
    doc.text(formatQuantityOf(line.quantityMilli, line.kind), COL.qty, y, { width: COL.price - COL.qty - 6, align: "right" });
    doc.text(formatUnitPriceOf(line.unitPriceCents, line.kind), COL.price, y, { width: COL.amount - COL.price - 6, align: "right" });
    doc.text(money(line.amountCents), COL.amount, y, { width: RIGHT - COL.amount, align: "right" });
    y += height + 6;
  }

  // Totals.
  const t = inv.totals;
  const totals: [string, number, boolean][] = [
    ["Labour", t.laborCents, false],
    ["Parts", t.partsCents, false],
    ["Sublet", t.subletCents, false],
    ["Fees", t.feesCents, false],
    ["Shop supplies", t.shopSuppliesCents, false],
    [inv.taxExemptCertificate !== null ? "Tax (exempt)" : `Tax ${inv.taxRatePercent}%`, t.taxCents, false],
    ["Core charges (untaxed)", t.coreCents, false],
    ["Total", t.totalCents, true],
    ["Paid", inv.paidCents, false],
    ["Credited", inv.creditedCents, false],
    ["Balance due", inv.balanceCents, true],
  ];
  const rows = totals.filter(([label, cents]) => cents !== 0 || ["Total", "Balance due", "Paid"].includes(label) || label.startsWith("Tax"));
  if (y + rows.length * 14 + 20 > BOTTOM) {
    doc.addPage();
    y = 50;
  }
  doc.moveTo(340, y).lineTo(RIGHT, y).strokeColor("#d8cdb9").stroke();
  y += 6;
  for (const [label, cents, strong] of rows) {
    doc.font(strong ? "Helvetica-Bold" : "Helvetica").fontSize(strong ? 10.5 : 9).fillColor(INK);
    doc.text(label, 340, y, { width: 140 });
    doc.text(money(cents), 480, y, { width: RIGHT - 480, align: "right" });
    y += strong ? 16 : 13;
  }

  // Payments, then credit notes (separate numbered documents that lower what is owed).
  const section = (title: string, rows: [text: string, cents: number][]) => {
    if (rows.length === 0) return;
    y += 10;
    if (y + 20 + rows.length * 13 > BOTTOM) {
      doc.addPage();
      y = 50;
    }
    doc.font("Helvetica-Bold").fontSize(9).fillColor(FAINT).text(title, LEFT, y);
    y += 14;
    doc.font("Helvetica").fillColor(INK);
    for (const [text, cents] of rows) {
      doc.text(text, LEFT, y, { width: 400 });
      doc.text(money(cents), 480, y, { width: RIGHT - 480, align: "right" });
      y += 13;
    }
  };
  section(
    "PAYMENTS",
    inv.payments.map((p) => {
      const held = !p.applied ? (p.resolution === "returned" ? " (returned to the payer)" : " (held for review)") : "";
      return [`${formatDate(p.receivedAt, timeZone)}  ${PAYMENT_METHOD_LABELS[p.method] ?? p.method}  ${p.reference}${held}`, p.amountCents];
    }),
  );
  section(
    "CREDIT NOTES",
    inv.creditNotes.map((c) => [`${c.label}  ${formatDate(c.issuedAt, timeZone)}  ${c.reason}`, -c.amountCents]),
  );

  // Terms and footer.
  y += 14;
  if (y > BOTTOM - 40) {
    doc.addPage();
    y = 50;
  }
  doc.font("Helvetica").fontSize(9).fillColor(INK);
  if (inv.paymentState === "void") {
    doc.font("Helvetica-Bold").fillColor(RUST).text(`VOID${inv.voidReason ? `: ${inv.voidReason.replace(/[.\s]+$/, "")}` : ""}. Nothing is owed on this invoice.`, LEFT, y, { width: RIGHT - LEFT });
  } else {
    doc.text(`Terms: net ${inv.termsDays} days. Please pay by ${formatDate(inv.dueAt)}, quoting ${inv.label}${inv.poNumber ? ` and PO ${inv.poNumber}` : ""}.`, LEFT, y, {
      width: RIGHT - LEFT,
    });
  }
  if (shop?.footer) doc.moveDown(0.5).font("Helvetica").fillColor(FAINT).text(shop.footer, LEFT, doc.y, { width: RIGHT - LEFT });
  doc.end();
  return done;
}
