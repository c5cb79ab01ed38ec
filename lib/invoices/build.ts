import { coreTotalOf, priceEstimate, type AccountSettings, type EstimateLine, type ShopSettings } from "@/lib/estimate";
import { assertCents, type Cents } from "@/lib/money";
import type { LineKind, LineState } from "@/lib/domain";

/** A work-order line as the invoice needs it. */
export interface BillableLine {
  id: string;
  position: number;
  kind: LineKind;
  description: string;
  partNumber: string;
  quantityMilli: number;
  unitPriceCents: Cents;
  taxable: boolean;
  coreChargeCents: Cents;
  /** A core already back before invoicing is not charged. */
  coreReturned: boolean;
  state: LineState;
}

export interface InvoiceLineDraft {
  sourceLineId: string;
  position: number;
  kind: LineKind;
  description: string;
  partNumber: string;
  quantityMilli: number;
  unitPriceCents: Cents;
  amountCents: Cents;
  taxable: boolean;
  /** Per unit of quantity, 0 when none or already returned. */
  coreChargeCents: Cents;
}

export interface InvoiceTotals {
  laborCents: Cents;
  partsCents: Cents;
  subletCents: Cents;
  feesCents: Cents;
  linesCents: Cents;
  shopSuppliesCents: Cents;
  taxableCents: Cents;
  taxCents: Cents;
  /** Core charges, apart and untaxed; credited when the core comes back. */
  coreCents: Cents;
  /** What the account owes: lines + shop supplies + tax + cores. */
  totalCents: Cents;
}

export interface InvoiceDraft {
  lines: InvoiceLineDraft[];
  totals: InvoiceTotals;
  /** Approved lines not yet done: not billed, shown as a warning. */
  notDone: BillableLine[];
}

/** Approved and completed work: the lines a technician has marked done. */
export function isBillable(line: Pick<BillableLine, "state">): boolean {
  return line.state === "done";
}

function asEstimateLine(line: BillableLine): EstimateLine {
  return {
    id: line.id,
    kind: line.kind,
    quantityMilli: line.quantityMilli,
    unitPriceCents: line.unitPriceCents,
    taxable: line.taxable,
    coreChargeCents: line.coreReturned ? 0 : line.coreChargeCents,
    state: line.state,
    version: 1,
    approvedByUserId: null,
    byStanding: false,
    approvedAmountCents: null,
    isDiagnosis: false,
  };
}

/**
 * Prices the done lines exactly as the estimate does (lib/estimate): line
 * amounts half up, shop supplies a capped percent of labour, tax once on the
 * taxable subtotal (zero for an exempt account), cores apart and untaxed.
 */
export function buildInvoice(lines: readonly BillableLine[], shop: ShopSettings, account: AccountSettings): InvoiceDraft {
  const billable = [...lines].filter(isBillable).sort((a, b) => a.position - b.position);
  const notDone = lines.filter((l) => l.state === "approved" || l.state === "in_progress");
  const estimateLines = billable.map(asEstimateLine);
  const pricing = priceEstimate(estimateLines, shop, account);
  const charges = pricing.approved;
  const drafts = billable.map((line, i): InvoiceLineDraft => {
    const priced = pricing.lines[i];
    if (!priced || priced.id !== line.id) throw new Error("pricing lost a line");
    return {
      sourceLineId: line.id,
      position: i,
      kind: line.kind,
      description: line.description,
      partNumber: line.partNumber,
      quantityMilli: line.quantityMilli,
      unitPriceCents: line.unitPriceCents,
      amountCents: priced.amountCents,
      taxable: account.taxExempt ? false : line.taxable,
      coreChargeCents: line.coreReturned ? 0 : line.coreChargeCents,
    };
  });
  const coreCents = estimateLines.reduce((sum, l) => sum + coreTotalOf(l), 0);
  return {
    lines: drafts,
    notDone,
    totals: {
      laborCents: charges.byKind.labor,
      partsCents: charges.byKind.part,
      subletCents: charges.byKind.sublet,
      feesCents: charges.byKind.fee,
      linesCents: charges.linesCents,
      shopSuppliesCents: charges.shopSuppliesCents,
      taxableCents: charges.taxableCents,
      taxCents: charges.taxCents,
      coreCents,
      totalCents: assertCents(charges.totalCents + coreCents, "invoice total"),
    },
  };
}
