import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { decideLines, describeLeftLines, fiscalYearOf, planApproveWhatFits, type EstimateLine } from "@/lib/estimate";
import { lineAmountCents } from "@/lib/money";
import { account, line, shop } from "./fixtures";

// product.md, "Authorised limits": the signing limit per approver per work order, the repair
// budget per account and fiscal year. Approving "all" offers what fits, in the order shown; the
// server's decideLines stays the judge, so every plan must be a batch it accepts.

const fy = fiscalYearOf("2026-12-02", 1);

describe("approve what fits", () => {
  it("the reported case: $4,690 left of the signing limit, 7 lines for $7,739 — approves what fits in order and names what is left", () => {
    const amounts = [186_40, 148_50, 74_25, 5_640_00, 541_50, 412_90, 730_90];
    const waiting = amounts.map((amountCents, i) => ({ id: `L${i}`, description: `Line ${i + 1}`, amountCents }));
    expect(amounts.reduce((s, a) => s + a, 0)).toBe(7_734_45);
    const plan = planApproveWhatFits({ waiting, signingLimitCents: 5_000_00, signingUsedCents: 310_00, budgetCents: null, budgetUsedCents: 0 });
    // $186.40 + $148.50 + $74.25 = $409.15; $5,640 would pass; then $541.50, $412.90, $730.90 fit ($2,094.45 in all).
    expect(plan.fits.map((l) => l.id)).toEqual(["L0", "L1", "L2", "L4", "L5", "L6"]);
    expect(plan.fitsCents).toBe(2_094_45);
    expect(plan.left).toEqual([{ line: waiting[3], reason: "signing_limit" }]);
    expect(describeLeftLines(plan, fy.label)).toEqual(["“Line 4” ($5,640.00) is more than the $2,595.55 your signing limit leaves on this work order after the lines that fit."]);
  });

  it("a line past the repair budget is left for the budget, in words", () => {
    const plan = planApproveWhatFits({
      waiting: [{ id: "a", description: "Brake shoes and drums", amountCents: 1_880_00 }],
      signingLimitCents: 2_500_00,
      signingUsedCents: 0,
      budgetCents: 48_000_00,
      budgetUsedCents: 46_500_00,
    });
    expect(plan.left[0]?.reason).toBe("budget");
    expect(describeLeftLines(plan, "FY 2026–27")[0]).toContain("would pass the repair budget: $1,500.00 is left in FY 2026–27");
  });

  it("property: the lines planned are always a batch decideLines approves; adding any line left makes it refuse", () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: -20_000, max: 400_000 }), { minLength: 1, maxLength: 9 }),
        fc.integer({ min: 0, max: 800_000 }),
        fc.integer({ min: 0, max: 300_000 }),
        fc.option(fc.integer({ min: 0, max: 1_000_000 }), { nil: null }),
        fc.integer({ min: 0, max: 600_000 }),
        (prices, limit, used, budget, budgetUsed) => {
          const lines: EstimateLine[] = prices.map((p, i) => line({ id: `P${i}`, unitPriceCents: p, quantityMilli: 1000 }));
          const waiting = lines.map((l) => ({ id: l.id, description: l.id, amountCents: lineAmountCents(l.quantityMilli, l.unitPriceCents) }));
          // The caller's earlier approvals on this work order: one approved line for `used`.
          const earlier = line({ id: "E", unitPriceCents: used, state: "approved", approvedByUserId: "me", approvedAmountCents: used });
          const plan = planApproveWhatFits({ waiting, signingLimitCents: limit, signingUsedCents: used, budgetCents: budget, budgetUsedCents: budgetUsed });
          const run = (ids: string[]) =>
            decideLines({
              workOrderNumber: "W-1",
              lines: [earlier, ...lines],
              caller: { id: "me", signingLimitCents: limit },
              shop,
              account: { ...account, repairBudgetCents: budget },
              budgetUsedCents: budgetUsed,
              fiscalYear: fy,
              decisions: ids.map((id) => ({ lineId: id, decision: "approve" as const, expectedVersion: 1 })),
            });
          if (plan.fits.length) expect(run(plan.fits.map((l) => l.id)).ok).toBe(true);
          for (const { line: l } of plan.left) {
            const order = waiting.map((w) => w.id).filter((id) => id === l.id || plan.fits.some((f) => f.id === id));
            expect(run(order).ok).toBe(false);
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});
