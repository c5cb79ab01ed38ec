import { describe, expect, it } from "vitest";
import {
  applyStandingAuthorisation,
  decideLines,
  fiscalYearOf,
  type DecideInput,
  type EstimateLine,
} from "@/lib/estimate";
import { account, approvedLine, line, shop } from "./fixtures";

// Behaviour from /work/shared/product.md ("Estimates and decisions",
// "Authorised limits") and /work/shared/api-v1.md (batch is all or none;
// 409 codes signing_limit_exceeded, budget_exceeded, stale_version, not_pending).

const fiscalYear = fiscalYearOf("2026-12-01", 7);
const ann = { id: "u-ann", signingLimitCents: 500_000 };

function input(lines: EstimateLine[], decisions: DecideInput["decisions"], over: Partial<DecideInput> = {}): DecideInput {
  return { workOrderNumber: "W-1042", lines, caller: ann, shop, account, budgetUsedCents: 0, fiscalYear, decisions, ...over };
}

describe("decideLines", () => {
  it("approves, declines and holds, bumping versions and recording each decision", () => {
    const a = line({ kind: "labor", quantityMilli: 2300, unitPriceCents: 14_250 }); // $327.75
    const b = line({ unitPriceCents: 38_000, version: 4 });
    const c = line({ unitPriceCents: 25_980 });
    const r = decideLines(
      input([a, b, c], [
        { lineId: a.id, decision: "approve", expectedVersion: 1, note: "PO 7781" },
        { lineId: b.id, decision: "decline", expectedVersion: 4 },
        { lineId: c.id, decision: "hold", expectedVersion: 1 },
      ]),
    );
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.changes.map((ch) => [ch.state, ch.version, ch.approvedAmountCents])).toEqual([
      ["approved", 2, 32_775],
      ["declined", 5, null],
      ["held", 2, null],
    ]);
    expect(r.changes[0]?.record).toEqual({
      lineId: a.id,
      decision: "approve",
      amountCents: 32_775,
      lineVersion: 1,
      note: "PO 7781",
      byUserId: "u-ann",
      byStanding: false,
    });
    // approved $327.75 labour: supplies 8 % = $26.22, untaxed; grand $353.97
    expect(r.totals).toEqual({
      approvedCents: 32_775,
      pendingCents: 0,
      declinedCents: 38_000,
      heldCents: 25_980,
      shopSuppliesCents: 2_622,
      taxCents: 0,
      grandTotalCents: 35_397,
    });
  });

  it("counts a batch's approvals together against the signing limit: all or none", () => {
    // $2,000 + $2,000 = $4,000 ≤ $5,000, the third brings it to $6,000 > $5,000
    const lines = [1, 2, 3].map(() => line({ unitPriceCents: 200_000 }));
    const before = structuredClone(lines);
    const r = decideLines(input(lines, lines.map((l) => ({ lineId: l.id, decision: "approve" as const, expectedVersion: 1 }))));
    expect(r).toMatchObject({
      ok: false,
      code: "signing_limit_exceeded",
      lineId: lines[2]?.id,
      amounts: { newCents: 200_000, usedCents: 400_000, afterCents: 600_000, limitCents: 500_000 },
    });
    expect(r).not.toHaveProperty("changes");
    expect(lines).toEqual(before);
  });

  it("counts the caller's earlier approvals on this work order, not other approvers'", () => {
    const lines = [
      approvedLine("u-ann", { unitPriceCents: 407_000 }),
      approvedLine("u-ben", { unitPriceCents: 900_000 }),
      line({ unitPriceCents: 124_000 }),
    ];
    const target = lines[2]!;
    const r = decideLines(input(lines, [{ lineId: target.id, decision: "approve", expectedVersion: 1 }]));
    expect(r).toMatchObject({ ok: false, code: "signing_limit_exceeded" });
    if (!r.ok) expect(r.detail).toBe("approving $1,240.00 would bring your approvals on W-1042 to $5,310.00; your signing limit is $5,000.00");
    // a second approver with a higher limit can approve it
    const ben = { id: "u-ben", signingLimitCents: 2_000_000 };
    expect(decideLines(input(lines, [{ lineId: target.id, decision: "approve", expectedVersion: 1 }], { caller: ben })).ok).toBe(true);
  });

  it("refuses approvals that would pass the account's repair budget for the fiscal year", () => {
    const lines = [line({ unitPriceCents: 30_000 }), line({ unitPriceCents: 30_000 })];
    // used $49,500.00; +$300 = $49,800; +$300 = $50,100 > $50,000
    const r = decideLines(
      input(lines, lines.map((l) => ({ lineId: l.id, decision: "approve" as const, expectedVersion: 1 })), { budgetUsedCents: 4_950_000 }),
    );
    expect(r).toMatchObject({ ok: false, code: "budget_exceeded", lineId: lines[1]?.id, amounts: { afterCents: 5_010_000 } });
    if (!r.ok) expect(r.detail).toContain("FY 2026–27");
  });

  it("declines and holds are never limited", () => {
    const big = line({ unitPriceCents: 90_000_000 });
    const r = decideLines(input([big], [{ lineId: big.id, decision: "hold", expectedVersion: 1 }], { budgetUsedCents: 5_000_000 }));
    expect(r.ok).toBe(true);
  });

  it("stale_version, not_pending and not_found, each naming the line", () => {
    const p = line({ version: 3 });
    const done = approvedLine("u-ann", { state: "done" });
    expect(decideLines(input([p], [{ lineId: p.id, decision: "approve", expectedVersion: 2 }]))).toMatchObject({
      ok: false,
      code: "stale_version",
      lineId: p.id,
      amounts: { expectedVersion: 2, currentVersion: 3 },
    });
    expect(decideLines(input([done], [{ lineId: done.id, decision: "decline", expectedVersion: 1 }]))).toMatchObject({
      ok: false,
      code: "not_pending",
      detail: "this line is already done, so it cannot be decided now",
    });
    expect(decideLines(input([p], [{ lineId: "L-nope", decision: "approve", expectedVersion: 1 }]))).toMatchObject({
      ok: false,
      code: "not_found",
      lineId: "L-nope",
    });
  });

  it("a line named twice in one batch meets its own new version", () => {
    const p = line();
    const r = decideLines(
      input([p], [
        { lineId: p.id, decision: "approve", expectedVersion: 1 },
        { lineId: p.id, decision: "decline", expectedVersion: 1 },
      ]),
    );
    expect(r).toMatchObject({ ok: false, code: "stale_version", lineId: p.id });
  });

  it("a credit makes no room under a signing limit or the budget (it may be withdrawn later)", () => {
    // Found by the property test (seed 302955271): an approver at $5,000.00
    // approves a -$1,000.00 credit, then $5,500.00 of work; when the shop later
    // revises the credit back to proposed, $5,500.00 stood against a $5,000.00 limit.
    const credit = approvedLine("u-ann", { unitPriceCents: -100_000 });
    const work = line({ unitPriceCents: 550_000 });
    const r = decideLines(input([credit, work], [{ lineId: work.id, decision: "approve", expectedVersion: 1 }]));
    expect(r).toMatchObject({ ok: false, code: "signing_limit_exceeded", amounts: { usedCents: 0, afterCents: 550_000 } });

    // Nor inside one batch: the credit first, then work that fits only in its room.
    const newCredit = line({ unitPriceCents: -100_000 });
    const batch = [newCredit, work].map((l) => ({ lineId: l.id, decision: "approve" as const, expectedVersion: 1 }));
    expect(decideLines(input([newCredit, work], batch))).toMatchObject({ ok: false, code: "signing_limit_exceeded" });
    const big = { id: "u-ben", signingLimitCents: 10_000_000 };
    // $49,600.00 used of $50,000.00: $400.00 left, and the credit adds none.
    const budget = decideLines(input([newCredit, work], batch, { caller: big, budgetUsedCents: 4_960_000 }));
    expect(budget).toMatchObject({ ok: false, code: "budget_exceeded", lineId: work.id });
  });
});

describe("applyStandingAuthorisation", () => {
  const diag = () => line({ kind: "labor", quantityMilli: 1000, unitPriceCents: 14_250, isDiagnosis: true, state: "draft" });

  it("starts lines inside the standing authorisation, recorded as decided by it", () => {
    // 1.0 h × $142.50 = $142.50 ≤ $250.00
    const d = diag();
    const r = applyStandingAuthorisation({
      workOrderNumber: "W-1042", lines: [d], shop, account, budgetUsedCents: 0, fiscalYear,
      start: [{ lineId: d.id, expectedVersion: 1 }],
    });
    expect(r).toMatchObject({
      ok: true,
      changes: [{ state: "approved", byStanding: true, approvedByUserId: null, approvedAmountCents: 14_250, version: 2 }],
    });
    if (r.ok) expect(r.changes[0]?.record).toMatchObject({ decision: "approve", byUserId: null, byStanding: true });
  });

  it("refuses past the standing authorisation, counting what was already started", () => {
    // $142.50 started + $142.50 = $285.00 > $250.00
    const started = approvedLine(null, { kind: "labor", quantityMilli: 1000, unitPriceCents: 14_250 });
    const d = diag();
    const r = applyStandingAuthorisation({
      workOrderNumber: "W-1042", lines: [started, d], shop, account, budgetUsedCents: 0, fiscalYear,
      start: [{ lineId: d.id, expectedVersion: 1 }],
    });
    expect(r).toMatchObject({ ok: false, code: "standing_authorisation_exceeded", amounts: { afterCents: 28_500 } });
  });

  it("counts against the repair budget too", () => {
    const d = diag();
    const r = applyStandingAuthorisation({
      workOrderNumber: "W-1042", lines: [d], shop, account, budgetUsedCents: 4_990_000, fiscalYear,
      start: [{ lineId: d.id, expectedVersion: 1 }],
    });
    expect(r).toMatchObject({ ok: false, code: "budget_exceeded" });
  });
});
