import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  applyStandingAuthorisation,
  decideLines,
  fiscalYearOf,
  isApprovedState,
  reviseLine,
  type AccountSettings,
  type Caller,
  type Decision,
  type EstimateLine,
  type LineChange,
} from "@/lib/estimate";
import { lineAmountCents } from "@/lib/money";
import { shop } from "./fixtures";

// Invariants from /work/shared/product.md ("Authorised limits": no approver
// past their signing limit on a work order, no account past its repair budget
// for the fiscal year) and api-v1.md (a batch is all or none). Totals here are
// recomputed independently from the stored line fields, not with the module.
// Credits (negative lines) count as zero: the shop can withdraw a credit later,
// so room made by one would let approvals stand past the limit (a run with
// seed 302955271 found exactly that when credits counted).

const fiscalYear = fiscalYearOf("2026-12-01", 7);

type Step = { pick: number; decision: Decision; stale: boolean; anyLine: boolean; missing: boolean };
type Command =
  | { type: "decide"; approverIdx: number; steps: Step[] }
  | { type: "standing"; picks: number[] }
  | { type: "revise"; pick: number; priceCents: number }
  | { type: "advance"; pick: number }
  | { type: "reopen"; pick: number };

const rarely = fc.integer({ min: 0, max: 9 }).map((n) => n === 0);

const stepArb: fc.Arbitrary<Step> = fc.record({
  pick: fc.nat(),
  decision: fc.constantFrom<Decision>("approve", "approve", "approve", "approve", "decline", "hold"),
  stale: rarely,
  anyLine: rarely,
  missing: fc.integer({ min: 0, max: 49 }).map((n) => n === 0),
});

const commandArb: fc.Arbitrary<Command> = fc.oneof(
  {
    weight: 8,
    arbitrary: fc.record({
      type: fc.constant("decide" as const),
      approverIdx: fc.nat(3),
      steps: fc.array(stepArb, { minLength: 1, maxLength: 6 }),
    }),
  },
  { weight: 1, arbitrary: fc.record({ type: fc.constant("standing" as const), picks: fc.array(fc.nat(), { minLength: 1, maxLength: 3 }) }) },
  { weight: 2, arbitrary: fc.record({ type: fc.constant("revise" as const), pick: fc.nat(), priceCents: fc.integer({ min: 0, max: 150_000 }) }) },
  { weight: 1, arbitrary: fc.record({ type: fc.constant("advance" as const), pick: fc.nat() }) },
  { weight: 3, arbitrary: fc.record({ type: fc.constant("reopen" as const), pick: fc.nat() }) },
);

const setupArb = fc.record({
  lines: fc.array(
    fc.record({
      quantityMilli: fc.integer({ min: 1, max: 50 }).map((tenths) => tenths * 100),
      unitPriceCents: fc.integer({ min: -5_000, max: 100_000 }),
      draft: rarely,
    }),
    { minLength: 1, maxLength: 20 },
  ),
  limits: fc.array(fc.integer({ min: 0, max: 800_000 }), { minLength: 4, maxLength: 4 }),
  budget: fc.option(fc.integer({ min: 0, max: 2_000_000 }), { nil: null, freq: 4 }),
  otherWorkOrdersShare: fc.integer({ min: 0, max: 100 }),
  standing: fc.integer({ min: 0, max: 200_000 }),
  commands: fc.array(commandArb, { minLength: 5, maxLength: 40 }),
});

function approvedSum(lines: readonly EstimateLine[], keep: (l: EstimateLine) => boolean): number {
  return lines
    .filter((l) => isApprovedState(l.state) && keep(l))
    .reduce((t, l) => t + Math.max(0, l.approvedAmountCents ?? Number.NaN), 0);
}

function applyChanges(lines: EstimateLine[], changes: readonly LineChange[]): EstimateLine[] {
  const byId = new Map(changes.map((c) => [c.lineId, c]));
  return lines.map((l) => {
    const c = byId.get(l.id);
    if (!c) return l;
    const { state, version, approvedByUserId, byStanding, approvedAmountCents } = c;
    return { ...l, state, version, approvedByUserId, byStanding, approvedAmountCents };
  });
}

/** A simple model of what a valid batch (fresh versions, proposed lines, no repeats) must do. */
function expectedRefusal(
  steps: readonly { line?: EstimateLine | undefined; decision: Decision }[],
  caller: Caller,
  used: { signing: number; budget: number },
  budget: number | null,
) {
  let signing = used.signing;
  let spent = used.budget;
  for (const { line: l, decision } of steps) {
    if (!l || decision !== "approve") continue;
    const amount = lineAmountCents(l.quantityMilli, l.unitPriceCents);
    if (amount > 0 && signing + amount > caller.signingLimitCents) return { code: "signing_limit_exceeded", lineId: l.id };
    if (amount > 0 && budget !== null && spent + amount > budget) return { code: "budget_exceeded", lineId: l.id };
    signing += Math.max(0, amount);
    spent += Math.max(0, amount);
  }
  return null;
}

// Counts of what the random runs reached, checked at the end so the property
// cannot pass by only ever generating batches that are refused early.
const reached = { modelChecked: 0, multiApprovalBatches: 0, signingRefusals: 0, budgetRefusals: 0 };

describe("property: decisions never pass a signing limit or the repair budget", () => {
  it("holds over random lines, approvers, limits and batches; refused batches change nothing", () => {
    fc.assert(
      fc.property(setupArb, (setup) => {
        let lines: EstimateLine[] = setup.lines.map((l, i) => ({
          id: `L-${i}`,
          kind: "part",
          quantityMilli: l.quantityMilli,
          unitPriceCents: l.unitPriceCents,
          taxable: i % 2 === 0,
          coreChargeCents: 0,
          state: l.draft ? "draft" : "proposed",
          version: 1,
          approvedByUserId: null,
          byStanding: false,
          approvedAmountCents: null,
          isDiagnosis: false,
        }));
        const approvers: Caller[] = setup.limits.map((limit, i) => ({ id: `u-${i}`, signingLimitCents: limit }));
        const budget = setup.budget;
        const otherWorkOrders = budget === null ? 250_000 : Math.floor((budget * setup.otherWorkOrdersShare) / 100);
        const account: AccountSettings = {
          taxExempt: false, taxRateMilliPct: 6_250, shopSuppliesExempt: false,
          standingAuthorisationCents: setup.standing, repairBudgetCents: budget, fiscalYearStartMonth: 7,
          overrunPercentMilli: 10_000, overrunCapCents: 5_000, overrunFloorCents: 0,
        };
        const budgetUsed = () => otherWorkOrders + approvedSum(lines, () => true);
        const common = { workOrderNumber: "W-1", shop, account, fiscalYear };

        for (const cmd of setup.commands) {
          const snapshot = structuredClone(lines);
          if (cmd.type === "decide") {
            const caller = approvers[cmd.approverIdx]!;
            const proposed = lines.filter((l) => l.state === "proposed");
            const steps = cmd.steps.map((s) => {
              const pool = s.anyLine || proposed.length === 0 ? lines : proposed;
              return { ...s, line: s.missing ? undefined : pool[s.pick % pool.length] };
            });
            const decisions = steps.map((s, i) => ({
              lineId: s.line?.id ?? `L-missing-${i}`,
              decision: s.decision,
              expectedVersion: (s.line?.version ?? 1) - (s.stale ? 1 : 0),
            }));
            const valid =
              new Set(steps.map((s) => s.line?.id)).size === steps.length &&
              steps.every((s) => !s.stale && s.line?.state === "proposed");
            const used = { signing: approvedSum(lines, (l) => l.approvedByUserId === caller.id && !l.byStanding), budget: budgetUsed() };
            const r = decideLines({ ...common, lines, caller, budgetUsedCents: used.budget, decisions });
            expect(lines).toEqual(snapshot);
            if (valid) {
              const model = expectedRefusal(steps, caller, used, budget);
              reached.modelChecked += 1;
              expect(r.ok ? null : { code: r.code, lineId: r.lineId }).toEqual(model);
            }
            if (!r.ok) {
              expect(r).not.toHaveProperty("changes");
              if (r.code === "signing_limit_exceeded") reached.signingRefusals += 1;
              if (r.code === "budget_exceeded") reached.budgetRefusals += 1;
            } else {
              expect(r.changes).toHaveLength(steps.length);
              if (r.changes.filter((c) => c.state === "approved").length > 1) reached.multiApprovalBatches += 1;
              lines = applyChanges(lines, r.changes);
              expect(r.lines).toEqual(lines);
            }
          } else if (cmd.type === "standing") {
            const picked = new Set(cmd.picks.map((p) => lines[p % lines.length]!));
            const start = [...picked].map((l) => ({ lineId: l.id, expectedVersion: l.version }));
            const r = applyStandingAuthorisation({ ...common, lines, budgetUsedCents: budgetUsed(), start });
            expect(lines).toEqual(snapshot);
            if (r.ok) lines = applyChanges(lines, r.changes);
          } else {
            const l = lines[cmd.pick % lines.length]!;
            let next: EstimateLine = l;
            if (cmd.type === "revise") {
              const r = reviseLine({ line: l, quantityMilli: l.quantityMilli, unitPriceCents: cmd.priceCents, account });
              if (r.ok) next = r.line;
            } else if (cmd.type === "advance" && (l.state === "approved" || l.state === "in_progress")) {
              next = { ...l, state: l.state === "approved" ? "in_progress" : "done", version: l.version + 1 };
            } else if (cmd.type === "reopen" && (l.state === "declined" || l.state === "held" || l.state === "draft")) {
              next = { ...l, state: "proposed", version: l.version + 1 };
            }
            lines = lines.map((x) => (x.id === l.id ? next : x));
          }

          for (const a of approvers) {
            expect(approvedSum(lines, (l) => l.approvedByUserId === a.id && !l.byStanding)).toBeLessThanOrEqual(a.signingLimitCents);
          }
          expect(approvedSum(lines, (l) => l.byStanding)).toBeLessThanOrEqual(setup.standing);
          if (budget !== null) expect(budgetUsed()).toBeLessThanOrEqual(budget);
        }
      }),
      // Shrinking long command lists can take minutes; report the first counterexample as found.
      { numRuns: 300, endOnFailure: true },
    );
    // Typical over 300 runs: ~550 model checks, ~50 multi-approval batches, ~430 and ~270 refusals.
    expect(reached.modelChecked).toBeGreaterThan(50);
    expect(reached.multiApprovalBatches).toBeGreaterThan(10);
    expect(reached.signingRefusals).toBeGreaterThan(20);
    expect(reached.budgetRefusals).toBeGreaterThan(20);
  });
});
