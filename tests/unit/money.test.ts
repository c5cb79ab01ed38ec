import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  divideHalfUp,
  formatCents,
  lineAmountCents,
  parseDollars,
  parsePercent,
  percentOfCents,
  sumCents,
  toMilli,
} from "@/lib/money";

describe("line amount = quantity × unit price, rounded half up to the cent (product.md computation rules)", () => {
  it("labour in tenths: 2.3 h × $142.50 = $327.75 (worked by hand: 2.3 × 14250 = 32775 ¢)", () => {
    expect(lineAmountCents(2300, 14_250)).toBe(32_775);
  });

  it("fluid in decimals: 2.5 gal × $18.99 = $47.475 → $47.48 (half up)", () => {
    // 2500 × 1899 / 1000 = 4747.5 ¢ → 4748 ¢
    expect(lineAmountCents(2500, 1_899)).toBe(4_748);
  });

  it("0.125 qt × $3.97 = 0.49625 → $0.50 (rounds up from .625 ¢ fractions), 0.125 × $3.95 = 0.49375 → $0.49", () => {
    expect(lineAmountCents(125, 397)).toBe(50);
    expect(lineAmountCents(125, 395)).toBe(49);
  });

  it("is exact where binary floats are not: 1.005 × $1.00 = $1.005 → $1.01 (a float gives 100.4999… ¢ → $1.00)", () => {
    expect(Math.round(1.005 * 100)).toBe(100); // the float trap this module avoids
    expect(lineAmountCents(1005, 100)).toBe(101);
  });

  it("credits mirror charges: −0.5 ¢ rounds to −1 ¢ (half away from zero)", () => {
    expect(divideHalfUp(-5n, 10n)).toBe(-1);
    expect(divideHalfUp(5n, 10n)).toBe(1);
    expect(divideHalfUp(4n, 10n)).toBe(0);
  });

  it("property: the result is within half a cent of the exact product, and ties go up", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1_000_000 }), fc.integer({ min: 0, max: 10_000_000 }), (q, p) => {
        const got = BigInt(lineAmountCents(q, p));
        const twice = BigInt(q) * BigInt(p) * 2n;
        // |2·1000·got − 2·q·p| ≤ 1000, i.e. |got − q·p/1000| ≤ 0.5
        const diff = 2000n * got - twice;
        expect(diff <= 1000n && diff > -1000n).toBe(true);
      }),
    );
  });

  it("refuses fractional cents and unsafe integers", () => {
    expect(() => lineAmountCents(1000, 1.5)).toThrow(RangeError);
    expect(() => sumCents([Number.MAX_SAFE_INTEGER, 1])).toThrow(RangeError);
  });
});

describe("percentages in thousandths of a percent", () => {
  it("8 % of $1,234.50 = $98.76 (123450 × 8000 / 100000 = 9876)", () => {
    expect(percentOfCents(123_450, 8_000)).toBe(9_876);
  });
  it("8.875 % of $100.00 = $8.875 → $8.88 half up", () => {
    expect(percentOfCents(10_000, 8_875)).toBe(888);
  });
});

describe("parsing what people type, without floats", () => {
  it.each([
    ["1,240.50", 124_050],
    ["$12", 1_200],
    ["0.5", 50],
    [".75", 75],
    ["-3.10", -310],
    ["5000", 500_000],
  ])("parseDollars(%s) = %i", (text, cents) => {
    expect(parseDollars(text)).toBe(cents);
  });
  it.each(["", "abc", "1.234", "1,24.00", "$"])("parseDollars(%s) is null", (text) => {
    expect(parseDollars(text)).toBeNull();
  });
  it("percent to thousandths: 8.875 → 8875, 10 → 10000", () => {
    expect(parsePercent("8.875")).toBe(8_875);
    expect(parsePercent("10")).toBe(10_000);
  });
  it("quantity numbers to thousandths: 1.1 → 1100, 2.375 → 2375; refuses a fourth decimal", () => {
    expect(toMilli(1.1)).toBe(1_100);
    expect(toMilli(2.375)).toBe(2_375);
    expect(() => toMilli(0.0001)).toThrow(RangeError);
  });
});

describe("formatting with Intl.NumberFormat (en-US, USD: ECMA-402 reference behaviour)", () => {
  it.each([
    [0, "$0.00"],
    [5, "$0.05"],
    [124_050, "$1,240.50"],
    [500_000, "$5,000.00"],
    [-310, "-$3.10"],
    [123_456_789_01, "$123,456,789.01"],
  ])("formatCents(%i) = %s", (cents, text) => {
    expect(formatCents(cents)).toBe(text);
  });
});
