import type { LineKind } from "@/lib/domain";
import { parseDecimal, parseDollars } from "@/lib/money";

/** What the writer types into a line, as typed. */
export interface LineFormValues {
  kind: LineKind;
  description: string;
  partNumber: string;
  quantity: string;
  unitPrice: string;
  taxable: boolean;
  coreCharge: string;
  concernId: string;
  isDiagnosis: boolean;
}

export interface RateOption {
  id: string;
  name: string;
  rateCents: number;
  isDefault: boolean;
}

export const centsToText = (c: number) => (c / 100).toFixed(2);

export type PricedValues =
  | { ok: true; quantityMilli: number; unitPriceCents: number }
  | { ok: false; quantityMilli: number | null; unitPriceCents: number | null; problem: string | null };

/**
 * The typed values as a line the rules can price, or why not. The same rules as the server's
 * zod schema (lib/validation/estimate-line.ts): labour in tenths of an hour, more than zero.
 */
export function valuesToLine(v: Pick<LineFormValues, "kind" | "quantity" | "unitPrice">): PricedValues {
  const quantityMilli = parseDecimal(v.quantity, 3);
  const unitPriceCents = parseDollars(v.unitPrice);
  const fail = (problem: string | null): PricedValues => ({ ok: false, quantityMilli, unitPriceCents, problem });
  if (quantityMilli === null || quantityMilli <= 0) return fail(v.quantity.trim() ? "Enter a quantity more than zero." : null);
  // Labour is billed in tenths of an hour (trade convention).
  if (v.kind === "labor" && quantityMilli % 100 !== 0) return fail("Labour is in tenths of an hour, like 1.5 or 0.3.");
  if (unitPriceCents === null || unitPriceCents < 0) return fail(v.unitPrice.trim() ? "Enter a price in dollars and cents, like 142.50." : null);
  return { ok: true, quantityMilli, unitPriceCents };
}

/**
 * Changing a line's kind: a labour rate is not a part's price, so leaving labour clears it;
 * coming to labour with no price takes the default rate. Tax follows the shop's default for the kind.
 */
export function switchKind(values: LineFormValues, kind: LineKind, rates: readonly RateOption[], taxDefaults: Record<LineKind, boolean>): LineFormValues {
  if (kind === values.kind) return values;
  const rate = rates.find((r) => r.isDefault) ?? rates[0];
  let unitPrice = values.unitPrice;
  if (values.kind === "labor") unitPrice = "";
  if (kind === "labor" && !unitPrice.trim() && rate) unitPrice = centsToText(rate.rateCents);
  return { ...values, kind, unitPrice, taxable: taxDefaults[kind], isDiagnosis: kind === "labor" ? values.isDiagnosis : false, coreCharge: kind === "part" ? values.coreCharge : "" };
}

/** The labour rate the typed price is, so the picker shows it instead of snapping back. */
export function rateIdFor(unitPrice: string, rates: readonly RateOption[]): string {
  const cents = parseDollars(unitPrice);
  return rates.find((r) => r.rateCents === cents)?.id ?? "";
}

export function sendLabel(drafts: number, accountName: string, sending: boolean): string {
  if (sending) return "Sending…";
  if (drafts === 0) return "No draft lines to send";
  return `Send ${drafts} draft line${drafts === 1 ? "" : "s"} to ${accountName}`;
}
