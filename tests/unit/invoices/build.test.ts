import { describe, expect, it } from "vitest";
import type { AccountSettings, ShopSettings } from "@/lib/estimate";
import { buildInvoice, type BillableLine } from "@/lib/invoices/build";

// Rules from /work/shared/product.md, "Computation rules"; every figure is
// worked by hand in the comment beside it.
const shop: ShopSettings = { shopSuppliesRateMilliPct: 8_000, shopSuppliesCapCents: 5_000, shopSuppliesTaxable: false };
const taxable: AccountSettings = {
  taxExempt: false,
  taxRateMilliPct: 6_250,
  shopSuppliesExempt: false,
  standingAuthorisationCents: 0,
  repairBudgetCents: null,
  fiscalYearStartMonth: 1,
  overrunPercentMilli: 10_000,
  overrunCapCents: 5_000,
  overrunFloorCents: 0,
};
const exempt: AccountSettings = { ...taxable, taxExempt: true };

let n = 0;
function line(overrides: Partial<BillableLine>): BillableLine {
  n += 1;
  return {
    id: `L${n}`,
    position: n,
    kind: "part",
    description: `Line ${n}`,
    partNumber: "",
    quantityMilli: 1000,
    unitPriceCents: 10_000,
    taxable: false,
    coreChargeCents: 0,
    coreReturned: false,
    state: "done",
    ...overrides,
  };
}

describe("an invoice prices its done lines exactly as the estimate does", () => {
  it("labour, a taxable part with a core, shop supplies and tax (worked example)", () => {
    const draft = buildInvoice(
      [
        // 2.3 h × $142.50 = $327.75
        line({ kind: "labor", quantityMilli: 2300, unitPriceCents: 14_250 }),
        // 2 × $210.00 = $420.00, core 2 × $45.00 = $90.00 apart
        line({ kind: "part", quantityMilli: 2000, unitPriceCents: 21_000, taxable: true, coreChargeCents: 4_500 }),
      ],
      shop,
      taxable,
    );
    expect(draft.lines.map((l) => l.amountCents)).toEqual([32_775, 42_000]);
    expect(draft.totals).toEqual({
      laborCents: 32_775,
      partsCents: 42_000,
      subletCents: 0,
      feesCents: 0,
      linesCents: 74_775,
      // 8 % × $327.75 = $26.22 (under the $50 cap)
      shopSuppliesCents: 2_622,
      // tax on the taxable part only, once: 6.25 % × $420.00 = $26.25; cores untaxed
      taxableCents: 42_000,
      taxCents: 2_625,
      coreCents: 9_000,
      // 747.75 + 26.22 + 26.25 + 90.00 = 890.22
      totalCents: 89_022,
    });
  });

  it("a tax-exempt account pays no tax and no line is marked taxable", () => {
    const draft = buildInvoice([line({ quantityMilli: 2000, unitPriceCents: 21_000, taxable: true })], shop, exempt);
    expect(draft.totals.taxCents).toBe(0);
    expect(draft.totals.taxableCents).toBe(0);
    expect(draft.lines.every((l) => !l.taxable)).toBe(true);
    expect(draft.totals.totalCents).toBe(42_000);
  });

  it("half a cent rounds up on the line: 2.5 gal × $18.99 = $47.475 → $47.48", () => {
    const draft = buildInvoice([line({ quantityMilli: 2500, unitPriceCents: 1_899 })], shop, exempt);
    expect(draft.totals.totalCents).toBe(4_748);
  });

  it("shop supplies are capped: 8 % of 9.0 h × $142.50 = $102.60 → $50.00", () => {
    const draft = buildInvoice([line({ kind: "labor", quantityMilli: 9000, unitPriceCents: 14_250 })], shop, exempt);
    expect(draft.totals.shopSuppliesCents).toBe(5_000);
    expect(draft.totals.totalCents).toBe(128_250 + 5_000);
  });

  it("tax is rounded once on the subtotal, not per line (3 × $0.10 at 6.25 %)", () => {
    // Per line: 0.625 ¢ → 1 ¢ each → 3 ¢. Once: 6.25 % × 30 ¢ = 1.875 ¢ → 2 ¢.
    const lines = [1, 2, 3].map(() => line({ unitPriceCents: 10, taxable: true }));
    expect(buildInvoice(lines, shop, taxable).totals.taxCents).toBe(2);
  });

  it("bills only done lines; approved or in-progress lines are reported, others ignored", () => {
    const lines = [
      line({ state: "done", unitPriceCents: 1_000 }),
      line({ state: "approved", unitPriceCents: 2_000 }),
      line({ state: "in_progress", unitPriceCents: 4_000 }),
      line({ state: "declined", unitPriceCents: 8_000 }),
      line({ state: "held", unitPriceCents: 16_000 }),
      line({ state: "proposed", unitPriceCents: 32_000 }),
    ];
    const draft = buildInvoice(lines, shop, exempt);
    expect(draft.totals.totalCents).toBe(1_000);
    expect(draft.notDone.map((l) => l.state)).toEqual(["approved", "in_progress"]);
  });

  it("a core already returned is not charged", () => {
    const draft = buildInvoice([line({ coreChargeCents: 4_500, coreReturned: true })], shop, exempt);
    expect(draft.totals.coreCents).toBe(0);
    expect(draft.lines[0]?.coreChargeCents).toBe(0);
  });

  it("keeps the work order's line order", () => {
    const a = line({ position: 5, description: "second" });
    const b = line({ position: 1, description: "first" });
    expect(buildInvoice([a, b], shop, exempt).lines.map((l) => [l.description, l.position])).toEqual([
      ["first", 0],
      ["second", 1],
    ]);
  });
});
