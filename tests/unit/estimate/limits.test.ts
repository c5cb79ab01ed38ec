import { describe, expect, it } from "vitest";
import {
  checkBudget,
  checkSigningLimit,
  checkStandingAuthorisation,
  limitsView,
  signingUsedCents,
  standingUsedCents,
} from "@/lib/estimate";
import { account, approvedLine, line } from "./fixtures";

// Limits from /work/shared/product.md ("Authorised limits") and the error
// codes and wording of /work/shared/api-v1.md ("Decision errors").

describe("signing limit", () => {
  it("refuses with the api-v1.md example wording and amounts", () => {
    // used $4,070.00 + new $1,240.00 = $5,310.00 > limit $5,000.00
    const v = checkSigningLimit({ workOrderNumber: "W-1042", usedCents: 407_000, newCents: 124_000, limitCents: 500_000 });
    expect(v).toEqual({
      ok: false,
      code: "signing_limit_exceeded",
      detail: "approving $1,240.00 would bring your approvals on W-1042 to $5,310.00; your signing limit is $5,000.00",
      amounts: { newCents: 124_000, usedCents: 407_000, afterCents: 531_000, limitCents: 500_000 },
    });
  });

  it("reaching the limit exactly is allowed", () => {
    // $3,760.00 + $1,240.00 = $5,000.00 = limit
    const v = checkSigningLimit({ workOrderNumber: "W-1042", usedCents: 376_000, newCents: 124_000, limitCents: 500_000 });
    expect(v).toEqual({
      ok: true,
      newCents: 124_000,
      usedCents: 376_000,
      afterCents: 500_000,
      limitCents: 500_000,
      remainingCents: 0,
    });
  });

  it("one cent over the limit is refused", () => {
    // $3,760.01 + $1,240.00 = $5,000.01 > $5,000.00
    const v = checkSigningLimit({ workOrderNumber: "W-1042", usedCents: 376_001, newCents: 124_000, limitCents: 500_000 });
    expect(v).toMatchObject({ ok: false, code: "signing_limit_exceeded", amounts: { afterCents: 500_001 } });
  });

  it("a credit is never refused, even over the limit", () => {
    expect(checkSigningLimit({ workOrderNumber: "W-1", usedCents: 600_000, newCents: -5_000, limitCents: 500_000 }).ok).toBe(true);
  });

  it("the caller's used total counts only their own approvals still standing, at the amount approved", () => {
    const lines = [
      approvedLine("u-ann", { unitPriceCents: 40_000, approvedAmountCents: 35_000 }), // revised after approval: $350 counts
      approvedLine("u-ann", { unitPriceCents: 10_000, state: "in_progress" }),
      approvedLine("u-ann", { unitPriceCents: 20_000, state: "done" }),
      approvedLine("u-ben", { unitPriceCents: 90_000 }),
      approvedLine(null, { unitPriceCents: 15_000 }), // standing authorisation
      line({ unitPriceCents: 70_000, approvedByUserId: "u-ann", state: "declined" }),
      line({ unitPriceCents: 70_000 }),
    ];
    // 350 + 100 + 200 = $650.00
    expect(signingUsedCents(lines, "u-ann")).toBe(65_000);
    expect(signingUsedCents(lines, "u-ben")).toBe(90_000);
    expect(standingUsedCents(lines)).toBe(15_000);
  });
});

describe("standing authorisation", () => {
  it("lets the shop start work up to the account's amount per work order", () => {
    // 1.0 h diagnosis at $142.50 inside $250.00
    expect(checkStandingAuthorisation({ workOrderNumber: "W-7", usedCents: 0, newCents: 14_250, limitCents: 25_000 }).ok).toBe(true);
    const v = checkStandingAuthorisation({ workOrderNumber: "W-7", usedCents: 14_250, newCents: 14_250, limitCents: 25_000 });
    expect(v).toMatchObject({ ok: false, code: "standing_authorisation_exceeded", amounts: { afterCents: 28_500 } });
    if (!v.ok) expect(v.detail).toContain("$285.00");
  });
});

describe("repair budget", () => {
  it("refuses an approval that would pass the fiscal-year budget", () => {
    // $49,500.00 used + $1,240.00 = $50,740.00 > $50,000.00; $500.00 left
    const v = checkBudget({ usedCents: 4_950_000, newCents: 124_000, budgetCents: 5_000_000, fiscalYearLabel: "FY 2026–27" });
    expect(v).toMatchObject({ ok: false, code: "budget_exceeded" });
    if (!v.ok) {
      expect(v.detail).toBe(
        "approving $1,240.00 would bring this account's approvals in FY 2026–27 to $50,740.00; the repair budget is $50,000.00 ($500.00 left)",
      );
    }
  });

  it("no budget means no limit", () => {
    expect(checkBudget({ usedCents: 9e12, newCents: 1e9, budgetCents: null, fiscalYearLabel: "FY 2026" })).toMatchObject({
      ok: true,
      limitCents: null,
      remainingCents: null,
    });
  });
});

describe("limitsView (api-v1.md work order `limits`)", () => {
  it("maps to the API fields, with the caller's own signing figures", () => {
    const lines = [approvedLine("u-ann", { unitPriceCents: 40_000 })];
    const caller = { id: "u-ann", signingLimitCents: 500_000 };
    expect(limitsView({ lines, account, caller, budgetUsedCents: 1_000_000 })).toEqual({
      standingAuthorisationCents: 25_000,
      signingLimitCents: 500_000,
      signingUsedCents: 40_000,
      budgetCents: 5_000_000,
      budgetRemainingCents: 4_000_000,
      overrunPercent: 10,
      overrunCapCents: 5_000,
    });
    expect(limitsView({ lines, account, caller: null, budgetUsedCents: 0 })).toMatchObject({
      signingLimitCents: null,
      signingUsedCents: null,
    });
  });
});
