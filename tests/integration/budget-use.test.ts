// The repair budget's running total (account_budget_use) against the full recount
// it replaces on the decision path: after every step of a random sequence of the
// changes that can move what an account has approved in a fiscal year, each stored
// row equals the recount for its account and bounds.
import { and, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb, writeTx } from "@/db/client";
import { updateAccount } from "@/db/queries/account-writes";
import { budgetUsedCents, budgetUsedForWrite, moveBudgetUse, recountBudgetUsed } from "@/db/queries/budget-use";
import { decide } from "@/db/queries/decisions";
import { currentFiscalYear } from "@/db/queries/estimate-context";
import { addLine, deleteLine, editLine, setLineProgress } from "@/db/queries/estimate-lines";
import { sendEstimate, startUnderStanding } from "@/db/queries/estimate-send";
import { moveStatus } from "@/db/queries/status-writes";
import { accountBudgetUse, accounts, estimateLines, units, workOrders } from "@/db/schema";
import { HttpError } from "@/lib/http/problem";
import { sessionUser } from "./helpers/app";

/** mulberry32: the same sequence for a seed, so a failure can be replayed. */
function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
  };
}

async function expectTotalsEqualRecount(accountId: string) {
  const rows = await getDb().select().from(accountBudgetUse).where(eq(accountBudgetUse.accountId, accountId));
  expect(rows.length).toBeGreaterThan(0);
  for (const r of rows) {
    expect({ fiscalYear: r.fiscalYear, used: r.usedCents }).toEqual({ fiscalYear: r.fiscalYear, used: await recountBudgetUsed(getDb(), accountId, { fromIso: r.fromAt, toIso: r.toAt }) });
  }
}

/** Refusals (limits, versions, states) are part of the sequence: they must leave the totals as they were. */
async function tolerate(step: Promise<unknown>): Promise<void> {
  await step.catch((e: unknown) => {
    if (!(e instanceof HttpError) || e.status >= 500) throw e;
  });
}

describe("the repair budget's running total", () => {
  it("equals a full recount after every step of random decisions, standing starts, revisions, progress, removals and a release", async () => {
    const db = getDb();
    const trustee = await sessionUser("trustee@brennan-twp.example");
    const writer = await sessionUser("writer@quarry-road.example");
    const [unit] = await db.select().from(units).where(eq(units.unitNumber, "T-17")).limit(1);
    const accountId = unit!.accountId;
    // Room for everything, so approvals go through and the totals move; the limits are tested elsewhere.
    await db.update(accounts).set({ repairBudgetCents: null, standingAuthorisationCents: 300_000 }).where(eq(accounts.id, accountId));

    // A line approved in the previous fiscal year, and that year's row: revising it back must move last year, not this one.
    const [account] = await db.select().from(accounts).where(eq(accounts.id, accountId));
    const thisYear = currentFiscalYear(account!);
    const lastYear = currentFiscalYear(account!, new Date(Date.parse(thisYear.fromIso) - 86_400_000));

    for (const seed of [1, 2, 3]) {
      const random = rng(seed);
      const pick = <T>(xs: readonly T[]): T | undefined => xs[Math.floor(random() * xs.length)];
      const [wo] = await db
        .insert(workOrders)
        .values({ number: 9100 + seed, unitId: unit!.id, accountId, status: "waiting_approval", title: `Budget walk ${seed}`, openedAt: new Date().toISOString() })
        .returning();
      const amount = () => (random() < 0.15 ? -Math.round(random() * 5_000) : Math.round(random() * 90_000)); // a credit now and then
      await db.insert(estimateLines).values(
        Array.from({ length: 10 }, (_, i) => ({ workOrderId: wo!.id, position: i, kind: "part" as const, description: `Part ${seed}.${i}`, quantityMilli: 1000, unitPriceCents: amount(), state: "proposed" as const, version: 2 })),
      );
      // Written as the app writes an approval: the row made (or read), the line, then the total moved.
      const old = new Date(Date.parse(lastYear.fromIso) + 30 * 86_400_000).toISOString();
      await writeTx(async (tx) => {
        await budgetUsedForWrite(tx, accountId, { ...lastYear, label: lastYear.fy.label });
        const [row] = await tx
          .insert(estimateLines)
          .values({
            workOrderId: wo!.id, position: 10, kind: "part", description: `Approved last year ${seed}`, quantityMilli: 1000, unitPriceCents: 40_000,
            state: "approved", version: 3, approvedByUserId: trustee.id, approvedAmountCents: 40_000, approvedAt: old,
          })
          .returning();
        await moveBudgetUse(tx, accountId, [{ before: { state: "proposed", approvedAt: null, approvedAmountCents: null }, after: row! }]);
      });

      for (let step = 0; step < 36; step++) {
        const lines = await db.select().from(estimateLines).where(eq(estimateLines.workOrderId, wo!.id));
        const by = (...states: string[]) => lines.filter((l) => states.includes(l.state));
        const roll = random();
        if (roll < 0.3) {
          const batch = by("proposed").filter(() => random() < 0.5);
          if (batch.length) {
            const decisions = batch.map((l) => ({ lineId: l.id, expectedVersion: l.version, decision: pick(["approve", "approve", "decline", "hold"] as const)! }));
            await tolerate(decide(trustee, wo!.id, decisions));
          }
        } else if (roll < 0.4) {
          const l = pick(by("draft", "proposed"));
          if (l) await tolerate(startUnderStanding(writer, wo!.id, [l.id]));
        } else if (roll < 0.6) {
          const l = pick(by("approved", "in_progress", "done", "proposed", "draft"));
          if (l) {
            // Up a little (the approval holds), up a lot (back for approval), or down.
            const factor = pick([1.05, 3, 0.5])!;
            await tolerate(editLine(writer, {
              lineId: l.id, expectedVersion: l.version, kind: l.kind, description: l.description, partNumber: "",
              quantity: l.quantityMilli, unitPrice: Math.round(l.unitPriceCents * factor) + 1, taxable: l.taxable, coreCharge: 0, isDiagnosis: false,
            }));
          }
        } else if (roll < 0.7) {
          const l = pick(by("approved", "in_progress"));
          if (l) await tolerate(setLineProgress(writer, l.id, l.state === "approved" ? "in_progress" : "done"));
        } else if (roll < 0.8) {
          const added = await addLine(writer, { workOrderId: wo!.id, kind: "part", description: `Added ${seed}.${step}`, partNumber: "", quantity: 1000, unitPrice: amount(), taxable: true, coreCharge: 0, isDiagnosis: false });
          if (random() < 0.6) await tolerate(sendEstimate(writer, wo!.id));
          else if (random() < 0.5) await tolerate(deleteLine(writer, added.id, added.version));
        } else if (roll < 0.85) {
          const l = pick(by("draft", "proposed"));
          if (l) await tolerate(deleteLine(writer, l.id, l.version));
        } else if (roll < 0.9) {
          // The account's fiscal year moves: new bounds, a new row made from the recount on the next write.
          await tolerate(updateAccount(writer, accountId, { fields: { fiscalYearStartMonth: pick([1, 4, 7, 10])! } }));
        } else {
          const l = pick(by("proposed"));
          if (l) await tolerate(decide(trustee, wo!.id, [{ lineId: l.id, expectedVersion: l.version, decision: "approve" }]));
        }
        await expectTotalsEqualRecount(accountId);
      }
      // Release with the rest held: nothing approved moves.
      await tolerate(moveStatus(writer, wo!.id, { status: "released", note: "", pendingLines: "hold", pendingNote: "" }));
      await expectTotalsEqualRecount(accountId);
    }
    const [now] = await db.select().from(accounts).where(eq(accounts.id, accountId));
    const bounds = currentFiscalYear(now!);
    expect(await budgetUsedCents(db, accountId, bounds)).toBe(await recountBudgetUsed(db, accountId, bounds));
    // The previous year's row was moved by revisions of its line, and still matches.
    const [last] = await db.select().from(accountBudgetUse).where(and(eq(accountBudgetUse.accountId, accountId), eq(accountBudgetUse.fromAt, lastYear.fromIso)));
    expect(last).toBeDefined();
  });
});
