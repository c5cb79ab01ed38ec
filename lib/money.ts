/**
 * Money is integer cents everywhere. Quantities are integer thousandths
 * ("milli" units: 1.1 h = 1100) and percentages are integer thousandths of a
 * percent ("milli-percent": 8.875 % = 8875), so every product below is exact
 * integer arithmetic and only the final division rounds.
 */
import { memoised } from "./intl-cache";

export type Cents = number;

const MAX_SAFE = BigInt(Number.MAX_SAFE_INTEGER);

export function assertCents(value: number, what = "amount"): Cents {
  if (!Number.isSafeInteger(value)) throw new RangeError(`${what} must be a whole number of cents, got ${value}`);
  return value;
}

/**
 * numerator / denominator rounded half away from zero (commercial "half up":
 * 0.5 ¢ goes to 1 ¢, −0.5 ¢ to −1 ¢, so a credit mirrors its charge).
 */
export function divideHalfUp(numerator: bigint, denominator: bigint): number {
  if (denominator <= 0n) throw new RangeError("denominator must be positive");
  const negative = numerator < 0n;
  const magnitude = negative ? -numerator : numerator;
  const quotient = (magnitude * 2n + denominator) / (denominator * 2n);
  const result = negative ? -quotient : quotient;
  if (result > MAX_SAFE || result < -MAX_SAFE) throw new RangeError("amount out of range");
  return Number(result);
}

/** Line amount = quantity × unit price, rounded half up to the cent. */
export function lineAmountCents(quantityMilli: number, unitPriceCents: Cents): Cents {
  assertCents(quantityMilli, "quantity (thousandths)");
  assertCents(unitPriceCents, "unit price");
  return divideHalfUp(BigInt(quantityMilli) * BigInt(unitPriceCents), 1000n);
}

/** amount × rate, where rate is in thousandths of a percent (10 % = 10000). */
export function percentOfCents(amountCents: Cents, rateMilliPct: number): Cents {
  assertCents(amountCents);
  assertCents(rateMilliPct, "rate (thousandths of a percent)");
  return divideHalfUp(BigInt(amountCents) * BigInt(rateMilliPct), 100_000n);
}

export function sumCents(values: Iterable<Cents>): Cents {
  let total = 0;
  for (const v of values) total += assertCents(v);
  return assertCents(total, "total");
}

const DECIMAL = /^\s*(-)?\$?\s*(\d{1,3}(?:,\d{3})+|\d*)(?:\.(\d*))?\s*$/;

/**
 * Parses a decimal written by a person ("1,240.5", "$12", "0.375") into an
 * integer of 10^-scale units, without ever going through a float.
 */
export function parseDecimal(text: string, scale: number): number | null {
  const match = DECIMAL.exec(text);
  if (!match) return null;
  const [, sign, whole = "", fraction = ""] = match;
  if (whole === "" && fraction === "") return null;
  if (fraction.length > scale && /[1-9]/.test(fraction.slice(scale))) return null;
  const digits = whole.replaceAll(",", "") + fraction.slice(0, scale).padEnd(scale, "0");
  const value = Number(digits === "" ? "0" : digits);
  if (!Number.isSafeInteger(value)) return null;
  return sign ? -value : value;
}

/** "1,240.50" → 124050; null when the text is not an amount with at most 2 decimals. */
export function parseDollars(text: string): Cents | null {
  return parseDecimal(text, 2);
}

/** "8.875" → 8875 thousandths of a percent. */
export function parsePercent(text: string): number | null {
  return parseDecimal(text, 3);
}

/** A quantity as a number (1.1) to thousandths (1100); numbers carry at most 3 decimals. */
export function toMilli(quantity: number): number {
  const milli = Math.round(quantity * 1000);
  if (!Number.isSafeInteger(milli) || Math.abs(milli - quantity * 1000) > 1e-6) {
    throw new RangeError(`quantity ${quantity} has more than 3 decimals`);
  }
  return milli;
}

export function fromMilli(milli: number): number {
  return milli / 1000;
}

/** Milli-percent to a plain percent number for display and the API (8875 → 8.875). */
export function milliPctToPercent(milliPct: number): number {
  return milliPct / 1000;
}

const currencyFormat = memoised((key: string) => {
  const [locale, currency] = key.split("|") as [string, string];
  return new Intl.NumberFormat(locale, { style: "currency", currency, minimumFractionDigits: 2 });
});

function formatter(currency: string, locale: string): Intl.NumberFormat {
  return currencyFormat(`${locale}|${currency}`);
}

/** 124050 → "$1,240.50". Formatting happens only at the edge. */
export function formatCents(cents: Cents, currency = "USD", locale = "en-US"): string {
  assertCents(cents);
  // Divide as a string so no binary fraction ever reaches the formatter.
  const negative = cents < 0;
  const abs = Math.abs(cents);
  const decimal = `${negative ? "-" : ""}${Math.trunc(abs / 100)}.${String(abs % 100).padStart(2, "0")}`;
  return formatter(currency, locale).format(decimal as unknown as number);
}
