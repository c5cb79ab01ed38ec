import { assertCents, lineAmountCents, percentOfCents, type Cents } from "../money";
import type { AccountSettings, EstimateLine, LineKind, LineState, ShopSettings } from "./types";

export interface PricedLine {
  id: string;
  amountCents: Cents;
  /** quantity × core charge; shown apart, never taxed. */
  coreTotalCents: Cents;
}

export type KindSubtotals = Record<LineKind, Cents>;

export type StateBucketName = "approved" | "pending" | "declined" | "held" | "draft";

export interface StateBucket {
  amountCents: Cents;
  coreCents: Cents;
  /** Sum of the amounts of lines flagged taxable. */
  taxableLinesCents: Cents;
  byKind: KindSubtotals;
  lineCount: number;
}

/** What a set of lines costs once shop supplies and tax are added. */
export interface Charges {
  linesCents: Cents;
  byKind: KindSubtotals;
  shopSuppliesCents: Cents;
  /** The base the tax is computed on (0 for a tax-exempt account). */
  taxableCents: Cents;
  taxCents: Cents;
  coreCents: Cents;
  /** lines + shop supplies + tax (cores excluded, as in the API's grand total). */
  totalCents: Cents;
  totalWithCoresCents: Cents;
}

/** Exactly the API's `totals` object (api-v1.md, work order detail). */
export interface ApiTotals {
  approvedCents: Cents;
  pendingCents: Cents;
  declinedCents: Cents;
  heldCents: Cents;
  shopSuppliesCents: Cents;
  taxCents: Cents;
  grandTotalCents: Cents;
}

export interface EstimatePricing {
  lines: PricedLine[];
  byState: Record<StateBucketName, StateBucket>;
  /** approved + in_progress + done lines: what the customer has agreed to pay. */
  approved: Charges;
  /** As if every pending (proposed) line were approved too: the whole estimate. */
  ifAllPendingApproved: Charges;
  totals: ApiTotals;
}

export function bucketOf(state: LineState): StateBucketName {
  switch (state) {
    case "approved":
    case "in_progress":
    case "done":
      return "approved";
    case "proposed":
      return "pending";
    case "declined":
      return "declined";
    case "held":
      return "held";
    case "draft":
      return "draft";
  }
}

export function lineAmountOf(line: EstimateLine): Cents {
  return lineAmountCents(line.quantityMilli, line.unitPriceCents);
}

export function coreTotalOf(line: EstimateLine): Cents {
  return line.coreChargeCents === 0 ? 0 : lineAmountCents(line.quantityMilli, line.coreChargeCents);
}

/** Percent of the labour subtotal, capped; zero for an exempt account and never negative. */
export function shopSuppliesCents(laborCents: Cents, shop: ShopSettings, account: AccountSettings): Cents {
  if (account.shopSuppliesExempt || laborCents <= 0) return 0;
  const fee = percentOfCents(laborCents, shop.shopSuppliesRateMilliPct);
  return Math.max(0, Math.min(fee, shop.shopSuppliesCapCents));
}

/** Rounded half up once on the whole taxable subtotal, never per line. */
export function taxCents(taxableCents: Cents, account: AccountSettings): Cents {
  if (account.taxExempt) return 0;
  return percentOfCents(taxableCents, account.taxRateMilliPct);
}

function emptyKinds(): KindSubtotals {
  return { labor: 0, part: 0, sublet: 0, fee: 0 };
}

function emptyBucket(): StateBucket {
  return { amountCents: 0, coreCents: 0, taxableLinesCents: 0, byKind: emptyKinds(), lineCount: 0 };
}

/** Shop supplies and tax for the union of some state buckets. */
export function chargesFor(buckets: readonly StateBucket[], shop: ShopSettings, account: AccountSettings): Charges {
  const byKind = emptyKinds();
  let linesCents = 0;
  let coreCents = 0;
  let taxableLines = 0;
  for (const b of buckets) {
    linesCents += b.amountCents;
    coreCents += b.coreCents;
    taxableLines += b.taxableLinesCents;
    byKind.labor += b.byKind.labor;
    byKind.part += b.byKind.part;
    byKind.sublet += b.byKind.sublet;
    byKind.fee += b.byKind.fee;
  }
  const supplies = shopSuppliesCents(byKind.labor, shop, account);
  const taxableCents = account.taxExempt ? 0 : taxableLines + (shop.shopSuppliesTaxable ? supplies : 0);
  const tax = taxCents(taxableCents, account);
  const totalCents = assertCents(linesCents + supplies + tax, "total");
  return {
    linesCents,
    byKind,
    shopSuppliesCents: supplies,
    taxableCents,
    taxCents: tax,
    coreCents,
    totalCents,
    totalWithCoresCents: assertCents(totalCents + coreCents, "total with cores"),
  };
}

/**
 * Prices a work order's lines. `amounts` lets a caller that already computed
 * the line amounts (decideLines) skip recomputing them.
 */
export function priceEstimate(
  lines: readonly EstimateLine[],
  shop: ShopSettings,
  account: AccountSettings,
  amounts?: ReadonlyMap<string, Cents>,
): EstimatePricing {
  const byState: Record<StateBucketName, StateBucket> = {
    approved: emptyBucket(),
    pending: emptyBucket(),
    declined: emptyBucket(),
    held: emptyBucket(),
    draft: emptyBucket(),
  };
  const priced: PricedLine[] = [];
  for (const line of lines) {
    const amountCents = amounts?.get(line.id) ?? lineAmountOf(line);
    const coreTotalCents = coreTotalOf(line);
    priced.push({ id: line.id, amountCents, coreTotalCents });
    const bucket = byState[bucketOf(line.state)];
    bucket.amountCents += amountCents;
    bucket.coreCents += coreTotalCents;
    bucket.byKind[line.kind] += amountCents;
    if (line.taxable) bucket.taxableLinesCents += amountCents;
    bucket.lineCount += 1;
  }
  for (const bucket of Object.values(byState)) assertCents(bucket.amountCents, "subtotal");

  const approved = chargesFor([byState.approved], shop, account);
  const ifAllPendingApproved = chargesFor([byState.approved, byState.pending], shop, account);
  return {
    lines: priced,
    byState,
    approved,
    ifAllPendingApproved,
    totals: {
      approvedCents: byState.approved.amountCents,
      pendingCents: byState.pending.amountCents,
      declinedCents: byState.declined.amountCents,
      heldCents: byState.held.amountCents,
      shopSuppliesCents: approved.shopSuppliesCents,
      taxCents: approved.taxCents,
      grandTotalCents: approved.totalCents,
    },
  };
}
