import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  LINE_KINDS,
  LINE_STATES,
  priceEstimate,
  shopSuppliesCents,
  taxCents,
  type AccountSettings,
  type EstimateLine,
  type ShopSettings,
} from "@/lib/estimate";
import { account, line, shop } from "./fixtures";

// Rules from /work/shared/product.md, "Computation rules"; the arithmetic is
// worked by hand in the comments and the code must agree to the cent.

describe("line amounts (product.md: quantity × unit price, half up to the cent)", () => {
  it("labour 2.3 h × $142.50 = $327.75 exactly", () => {
    // 2.3 × 142.50 = 327.75
    const p = priceEstimate([line({ kind: "labor", quantityMilli: 2300, unitPriceCents: 14_250 })], shop, account);
    expect(p.lines[0]?.amountCents).toBe(32_775);
  });

  it("fluid 2.5 gal × $18.99 = $47.475, rounded half up to $47.48", () => {
    // 2.5 × 18.99 = 47.475 → the half cent goes up → 47.48
    const p = priceEstimate([line({ quantityMilli: 2500, unitPriceCents: 1_899 })], shop, account);
    expect(p.lines[0]?.amountCents).toBe(4_748);
  });

  it("core total = quantity × core charge, kept out of the line amount and the tax", () => {
    // 2 × $45.00 core = $90.00; 2 × $210.00 = $420.00; tax 6.25 % of $420.00 = $26.25 (not of $510.00)
    const p = priceEstimate(
      [line({ quantityMilli: 2000, unitPriceCents: 21_000, coreChargeCents: 4_500, taxable: true, state: "approved" })],
      shop,
      account,
    );
    expect(p.lines[0]).toMatchObject({ amountCents: 42_000, coreTotalCents: 9_000 });
    expect(p.approved).toMatchObject({ taxCents: 2_625, coreCents: 9_000, totalCents: 44_625, totalWithCoresCents: 53_625 });
    expect(p.totals.grandTotalCents).toBe(44_625);
  });
});

describe("shop supplies (product.md: percent of labour, capped; exempt accounts pay none)", () => {
  it("8 % of $1,234.50 = $98.76, capped at $50.00", () => {
    // 6.0 h × $205.75 = $1,234.50; 0.08 × 1,234.50 = 98.76 > 50.00 → 50.00
    const labour = line({ kind: "labor", quantityMilli: 6000, unitPriceCents: 20_575, state: "approved" });
    expect(priceEstimate([labour], shop, account).totals.shopSuppliesCents).toBe(5_000);
    expect(shopSuppliesCents(123_450, { ...shop, shopSuppliesCapCents: 1_000_000 }, account)).toBe(9_876);
  });

  it("under the cap: 8 % of $142.56 = $11.4048 → $11.40", () => {
    expect(shopSuppliesCents(14_256, shop, account)).toBe(1_140);
  });

  it("zero for an account exempt from shop supplies", () => {
    expect(shopSuppliesCents(123_450, shop, { ...account, shopSuppliesExempt: true })).toBe(0);
  });

  it("counts labour only, not parts", () => {
    const p = priceEstimate([line({ kind: "part", unitPriceCents: 100_000, state: "approved" })], shop, account);
    expect(p.totals.shopSuppliesCents).toBe(0);
  });
});

describe("tax (product.md: rate × taxable subtotal, rounded half up once on the subtotal)", () => {
  it("6.25 % on two $12.08 parts is $1.51 on the subtotal, not $1.52 from per-line rounding", () => {
    // per line: 0.0625 × 12.08 = 0.755 → 0.76, twice = 1.52 (wrong)
    // once:     0.0625 × 24.16 = 1.51 exactly (right)
    const parts = [1, 2].map(() => line({ quantityMilli: 1000, unitPriceCents: 1_208, taxable: true, state: "approved" }));
    const p = priceEstimate(parts, shop, account);
    expect(p.approved.taxableCents).toBe(2_416);
    expect(p.totals.taxCents).toBe(151);
  });

  it("zero for a tax-exempt account", () => {
    const parts = [line({ unitPriceCents: 50_000, taxable: true, state: "approved" })];
    const p = priceEstimate(parts, shop, { ...account, taxExempt: true });
    expect(p.approved).toMatchObject({ taxableCents: 0, taxCents: 0, totalCents: 50_000 });
    expect(taxCents(50_000, { ...account, taxExempt: true })).toBe(0);
  });

  it("shop supplies join the taxable subtotal only when the shop says they are taxable", () => {
    // labour 2.3 h × $142.50 = $327.75 (untaxed); supplies 8 % = $26.22
    const lines = [line({ kind: "labor", quantityMilli: 2300, unitPriceCents: 14_250, state: "approved" })];
    expect(priceEstimate(lines, shop, account).approved.taxCents).toBe(0);
    // 0.0625 × 26.22 = 1.63875 → 1.64
    expect(priceEstimate(lines, { ...shop, shopSuppliesTaxable: true }, account).approved.taxCents).toBe(164);
  });
});

describe("a whole work order, worked by hand", () => {
  const taxedSupplies: ShopSettings = { ...shop, shopSuppliesTaxable: true };
  const lines: EstimateLine[] = [
    line({ kind: "labor", quantityMilli: 2300, unitPriceCents: 14_250, state: "approved" }), // 327.75
    line({ kind: "part", quantityMilli: 2500, unitPriceCents: 1_899, taxable: true, state: "in_progress" }), // 47.48
    line({ kind: "part", unitPriceCents: 21_000, coreChargeCents: 4_500, taxable: true, state: "done" }), // 210.00 + core 45.00
    line({ kind: "labor", quantityMilli: 1500, unitPriceCents: 14_250 }), // pending 213.75
    line({ kind: "part", quantityMilli: 2000, unitPriceCents: 1_208, taxable: true }), // pending 24.16
    line({ kind: "sublet", unitPriceCents: 38_000, state: "declined" }), // 380.00
    line({ kind: "part", quantityMilli: 4000, unitPriceCents: 6_495, taxable: true, state: "held" }), // 259.80
    line({ kind: "fee", unitPriceCents: 2_500, taxable: true, state: "draft" }), // 25.00
  ];

  it("reports approved, pending, declined and held totals and the grand total", () => {
    // approved lines 327.75 + 47.48 + 210.00 = 585.23
    // supplies 0.08 × 327.75 = 26.22; taxable 47.48 + 210.00 + 26.22 = 283.70
    // tax 0.0625 × 283.70 = 17.73125 → 17.73; grand 585.23 + 26.22 + 17.73 = 629.18
    const p = priceEstimate(lines, taxedSupplies, account);
    expect(p.totals).toEqual({
      approvedCents: 58_523,
      pendingCents: 23_791, // 213.75 + 24.16
      declinedCents: 38_000,
      heldCents: 25_980, // 4 × 64.95
      shopSuppliesCents: 2_622,
      taxCents: 1_773,
      grandTotalCents: 62_918,
    });
    expect(p.byState.draft.amountCents).toBe(2_500);
    expect(p.approved).toMatchObject({ taxableCents: 28_370, coreCents: 4_500 });
    expect(p.approved.byKind).toEqual({ labor: 32_775, part: 25_748, sublet: 0, fee: 0 });
  });

  it("shows what the estimate would come to if every pending line were approved", () => {
    // lines 585.23 + 213.75 + 24.16 = 823.14; labour 327.75 + 213.75 = 541.50
    // supplies 0.08 × 541.50 = 43.32; taxable 257.48 + 24.16 + 43.32 = 324.96
    // tax 0.0625 × 324.96 = 20.31; total 823.14 + 43.32 + 20.31 = 886.77
    const p = priceEstimate(lines, taxedSupplies, account);
    expect(p.ifAllPendingApproved).toMatchObject({
      linesCents: 82_314,
      shopSuppliesCents: 4_332,
      taxableCents: 32_496,
      taxCents: 2_031,
      totalCents: 88_677,
    });
  });
});

const lineArb = fc.record({
  id: fc.uuid(),
  kind: fc.constantFrom(...LINE_KINDS),
  quantityMilli: fc.integer({ min: 0, max: 200_000 }),
  unitPriceCents: fc.integer({ min: -100_000, max: 2_000_000 }),
  taxable: fc.boolean(),
  coreChargeCents: fc.integer({ min: 0, max: 100_000 }),
  state: fc.constantFrom(...LINE_STATES),
  version: fc.nat(50),
  approvedByUserId: fc.constant(null),
  byStanding: fc.constant(false),
  approvedAmountCents: fc.constant(null),
  isDiagnosis: fc.boolean(),
});

const shopArb: fc.Arbitrary<ShopSettings> = fc.record({
  shopSuppliesRateMilliPct: fc.integer({ min: 0, max: 20_000 }),
  shopSuppliesCapCents: fc.integer({ min: 0, max: 100_000 }),
  shopSuppliesTaxable: fc.boolean(),
});

const accountArb: fc.Arbitrary<AccountSettings> = fc.record({
  taxExempt: fc.boolean(),
  taxRateMilliPct: fc.integer({ min: 0, max: 15_000 }),
  shopSuppliesExempt: fc.boolean(),
  standingAuthorisationCents: fc.nat(100_000),
  repairBudgetCents: fc.option(fc.nat(10_000_000)),
  fiscalYearStartMonth: fc.integer({ min: 1, max: 12 }),
  overrunPercentMilli: fc.nat(20_000),
  overrunCapCents: fc.option(fc.nat(10_000)),
  overrunFloorCents: fc.nat(2_000),
});

describe("property: totals always equal the sum of their parts", () => {
  it("per state, per kind, cores, and grand total", () => {
    fc.assert(
      fc.property(fc.array(lineArb, { maxLength: 40 }), shopArb, accountArb, (lines, s, a) => {
        const p = priceEstimate(lines, s, a);
        const sumLines = p.lines.reduce((t, l) => t + l.amountCents, 0);
        const sumCores = p.lines.reduce((t, l) => t + l.coreTotalCents, 0);
        const t = p.totals;
        expect(t.approvedCents + t.pendingCents + t.declinedCents + t.heldCents + p.byState.draft.amountCents).toBe(sumLines);
        for (const bucket of Object.values(p.byState)) {
          const { labor, part, sublet, fee } = bucket.byKind;
          expect(labor + part + sublet + fee).toBe(bucket.amountCents);
        }
        expect(Object.values(p.byState).reduce((c, b) => c + b.coreCents, 0)).toBe(sumCores);
        expect(t.grandTotalCents).toBe(t.approvedCents + t.shopSuppliesCents + t.taxCents);
        expect(p.ifAllPendingApproved.linesCents).toBe(t.approvedCents + t.pendingCents);
        const w = p.ifAllPendingApproved;
        expect(w.totalCents).toBe(w.linesCents + w.shopSuppliesCents + w.taxCents);
        expect(t.shopSuppliesCents).toBeGreaterThanOrEqual(0);
        expect(t.shopSuppliesCents).toBeLessThanOrEqual(s.shopSuppliesCapCents);
      }),
    );
  });

  it("every rounding is to the nearest cent (within half a cent of the exact product)", () => {
    fc.assert(
      fc.property(fc.array(lineArb, { maxLength: 20 }), accountArb, (lines, a) => {
        const p = priceEstimate(lines, shop, a);
        lines.forEach((l, i) => {
          const exactTimes1000 = l.quantityMilli * l.unitPriceCents;
          expect(Math.abs((p.lines[i]?.amountCents ?? NaN) * 1000 - exactTimes1000)).toBeLessThanOrEqual(500);
        });
        const exactTaxTimes100k = a.taxExempt ? 0 : p.approved.taxableCents * a.taxRateMilliPct;
        expect(Math.abs(p.approved.taxCents * 100_000 - exactTaxTimes100k)).toBeLessThanOrEqual(50_000);
      }),
    );
  });
});
