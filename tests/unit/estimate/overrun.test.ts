import { describe, expect, it } from "vitest";
import {
  DEFAULT_OVERRUN_POLICY,
  checkOverrun,
  overrunAllowanceCents,
  reviseLine,
  type OverrunPolicy,
} from "@/lib/estimate";
import { account, approvedLine, line } from "./fixtures";

// Tolerance shapes from state consumer-repair laws, as summarised in
// /work/shared/reference-values.md ("Estimate tolerances written into state
// consumer-repair laws"). allowance = min(cap, max(floor, percent × approved)).

/** Florida Statutes 559.909(1)(b): $10 or 10 %, whichever is greater, never more than $50. */
const FLORIDA_559_909: OverrunPolicy = { percentMilli: 10_000, floorCents: 1_000, capCents: 5_000 };
/** Michigan Motor Vehicle Service and Repair Act, 1974 PA 300: $10 or 10 %, whichever is less. */
const MICHIGAN_1974_PA_300: OverrunPolicy = { percentMilli: 10_000, floorCents: 0, capCents: 1_000 };
/** Maryland Commercial Law 14-1002(b): 10 %. */
const MARYLAND_14_1002: OverrunPolicy = { percentMilli: 10_000, floorCents: 0, capCents: null };
/** Minnesota Statutes 325F.61(c): 10 %. */
const MINNESOTA_325F_61: OverrunPolicy = { percentMilli: 10_000, floorCents: 0, capCents: null };
/** California Business and Professions Code 9884.9(a): no amount over the estimate without consent. */
const CALIFORNIA_9884_9: OverrunPolicy = { percentMilli: 0, floorCents: 0, capCents: null };

describe("overrun allowance shapes, each named with its statute", () => {
  it("Florida Statutes 559.909(1)(b): floor $10, 10 %, cap $50", () => {
    expect(overrunAllowanceCents(5_000, FLORIDA_559_909)).toBe(1_000); // 10 % of $50 = $5 < $10 → $10
    expect(overrunAllowanceCents(30_000, FLORIDA_559_909)).toBe(3_000); // 10 % of $300 = $30
    expect(overrunAllowanceCents(100_000, FLORIDA_559_909)).toBe(5_000); // 10 % of $1,000 = $100 → cap $50
  });

  it("Michigan 1974 PA 300: $10 or 10 %, whichever is less", () => {
    expect(overrunAllowanceCents(5_000, MICHIGAN_1974_PA_300)).toBe(500); // 10 % of $50 = $5 < $10
    expect(overrunAllowanceCents(30_000, MICHIGAN_1974_PA_300)).toBe(1_000); // $30 > $10 → $10
  });

  it("Maryland Commercial Law 14-1002(b): 10 %, no dollar cap", () => {
    expect(overrunAllowanceCents(1_000_000, MARYLAND_14_1002)).toBe(100_000); // 10 % of $10,000 = $1,000
  });

  it("Minnesota Statutes 325F.61(c): 10 %", () => {
    expect(overrunAllowanceCents(32_775, MINNESOTA_325F_61)).toBe(3_278); // 10 % of $327.75 = $32.775 → $32.78
  });

  it("California B&P Code 9884.9(a): nothing over the estimate without consent", () => {
    expect(overrunAllowanceCents(1_000_000, CALIFORNIA_9884_9)).toBe(0);
    expect(checkOverrun({ approvedCents: 10_000, revisedCents: 10_001, policy: CALIFORNIA_9884_9 }).ok).toBe(false);
    expect(checkOverrun({ approvedCents: 10_000, revisedCents: 10_000, policy: CALIFORNIA_9884_9 }).ok).toBe(true);
  });

  it("default for a new account: the Florida shape with its floor — the greater of $10 or 10 %, never more than $50 (reference-values.md)", () => {
    expect(DEFAULT_OVERRUN_POLICY).toEqual(FLORIDA_559_909);
    expect(overrunAllowanceCents(8_000, DEFAULT_OVERRUN_POLICY)).toBe(1_000); // $80 line → $10 (10 % would be $8)
    expect(overrunAllowanceCents(30_000, DEFAULT_OVERRUN_POLICY)).toBe(3_000); // $300 line → $30
    expect(overrunAllowanceCents(100_000, DEFAULT_OVERRUN_POLICY)).toBe(5_000); // $1,000 line → $50 cap
  });

  it("the default is not Michigan's shape (the lesser of $10 or 10 %) nor California's (nothing without consent)", () => {
    expect(overrunAllowanceCents(8_000, MICHIGAN_1974_PA_300)).toBe(800);
    expect(overrunAllowanceCents(30_000, MICHIGAN_1974_PA_300)).toBe(1_000);
    expect(overrunAllowanceCents(8_000, CALIFORNIA_9884_9)).toBe(0);
    expect(DEFAULT_OVERRUN_POLICY).not.toEqual(MICHIGAN_1974_PA_300);
  });
});

describe("checkOverrun", () => {
  it("holds up to approved + allowance inclusive, refuses one cent more, with the amounts in the detail", () => {
    // Florida shape on $300.00: allowance $30.00 → ceiling $330.00
    expect(checkOverrun({ approvedCents: 30_000, revisedCents: 33_000, policy: FLORIDA_559_909 }).ok).toBe(true);
    const over = checkOverrun({ approvedCents: 30_000, revisedCents: 33_001, policy: FLORIDA_559_909 });
    expect(over).toMatchObject({ ok: false, code: "overrun_exceeded" });
    if (over.ok) return;
    expect(over.amounts).toEqual({
      approvedCents: 30_000,
      revisedCents: 33_001,
      allowanceCents: 3_000,
      ceilingCents: 33_000,
      overCents: 3_001,
    });
    expect(over.detail).toBe(
      "the revised amount $330.01 is $30.01 over the approved $300.00; the overrun allowance is $30.00, so the line needs approval again",
    );
  });

  it("a revision downward always holds, even with no allowance", () => {
    expect(checkOverrun({ approvedCents: 30_000, revisedCents: 100, policy: CALIFORNIA_9884_9 }).ok).toBe(true);
  });
});

describe("reviseLine", () => {
  const wheelSeal = () => approvedLine("u-approver", { kind: "part", quantityMilli: 1000, unitPriceCents: 30_000 });

  it("within the allowance the approval holds and the amount at approval is kept", () => {
    // approved $300.00; default 10 % = $30.00; revised to $325.00 ≤ $330.00
    const r = reviseLine({ line: wheelSeal(), quantityMilli: 1000, unitPriceCents: 32_500, account });
    expect(r).toMatchObject({ ok: true, outcome: "approval_holds", amountCents: 32_500, reason: null });
    if (!r.ok) return;
    expect(r.line).toMatchObject({ state: "approved", approvedAmountCents: 30_000, version: 2, approvedByUserId: "u-approver" });
  });

  it("past the allowance the line goes back to proposed with overrun_exceeded", () => {
    // $300.00 → 1.2 × $300.00 = $360.00 > $330.00
    const r = reviseLine({ line: wheelSeal(), quantityMilli: 1200, unitPriceCents: 30_000, account });
    expect(r).toMatchObject({ ok: true, outcome: "back_to_proposed", reason: { code: "overrun_exceeded" } });
    if (!r.ok) return;
    expect(r.line).toMatchObject({ state: "proposed", approvedByUserId: null, approvedAmountCents: null, version: 2 });
  });

  it("the allowance is measured from the amount at approval, so small steps cannot creep past it", () => {
    // approved $300.00, already revised to $325.00 (held); $335.00 is still > $330.00
    const first = reviseLine({ line: wheelSeal(), quantityMilli: 1000, unitPriceCents: 32_500, account });
    if (!first.ok) throw new Error("first revision refused");
    const second = reviseLine({ line: first.line, quantityMilli: 1000, unitPriceCents: 33_500, account });
    expect(second).toMatchObject({ ok: true, outcome: "back_to_proposed" });
  });

  it("a revision downward always holds", () => {
    const r = reviseLine({ line: wheelSeal(), quantityMilli: 500, unitPriceCents: 30_000, account });
    expect(r).toMatchObject({ ok: true, outcome: "approval_holds" });
  });

  it("more hours on an approved diagnosis line always go back to the customer (the time box)", () => {
    // 1.0 h → 1.1 h at $142.50: +$14.25, inside the $50 allowance, but the customer extends the box
    const diag = approvedLine("u-approver", { kind: "labor", quantityMilli: 1000, unitPriceCents: 14_250, isDiagnosis: true });
    const r = reviseLine({ line: diag, quantityMilli: 1100, unitPriceCents: 14_250, account });
    expect(r).toMatchObject({ ok: true, outcome: "back_to_proposed", reason: { code: "time_box_extension" } });
  });

  it("lines not yet approved are simply edited; unchanged values write nothing; stale versions are refused", () => {
    const draft = line({ state: "draft", version: 3 });
    expect(reviseLine({ line: draft, quantityMilli: 2000, unitPriceCents: 100, account })).toMatchObject({
      ok: true,
      outcome: "edited",
      line: { state: "draft", version: 4, quantityMilli: 2000 },
    });
    expect(
      reviseLine({ line: draft, quantityMilli: draft.quantityMilli, unitPriceCents: draft.unitPriceCents, account }),
    ).toMatchObject({ ok: true, outcome: "unchanged", line: { version: 3 } });
    expect(reviseLine({ line: draft, quantityMilli: 1, unitPriceCents: 1, expectedVersion: 2, account })).toMatchObject({
      ok: false,
      code: "stale_version",
    });
  });
});
