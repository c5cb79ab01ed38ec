import type { LineKind } from "@/lib/domain";
import { formatQuantity } from "@/lib/format";
import { formatCents } from "@/lib/money";

/** Labour reads in hours ("2.3 h"); other kinds as a plain quantity. */
export function formatQuantityOf(milli: number, kind: LineKind): string {
  return kind === "labor" ? `${formatQuantity(milli)} h` : formatQuantity(milli);
}

/**
 * How a line's amount is counted, in words: labour "1.5 h at $142.50/h" (billed in tenths of
 * an hour at a rate), parts "2 × $194.95", a single sublet or fee just its price.
 */
export function formatPriceOf(quantityMilli: number, unitPriceCents: number, kind: LineKind): string {
  if (kind === "labor") return `${formatQuantity(quantityMilli)} h at ${formatCents(unitPriceCents)}/h`;
  if (quantityMilli === 1_000 && kind !== "part") return formatCents(unitPriceCents);
  return `${formatQuantity(quantityMilli)} × ${formatCents(unitPriceCents)}`;
}

/** The unit price column: labour per hour, others per unit. */
export function formatUnitPriceOf(unitPriceCents: number, kind: LineKind): string {
  return kind === "labor" ? `${formatCents(unitPriceCents)}/h` : formatCents(unitPriceCents);
}

export const PAYMENT_METHOD_LABELS: Record<string, string> = {
  card: "Card",
  cheque: "Cheque",
  transfer: "Bank transfer",
  cash: "Cash",
};
