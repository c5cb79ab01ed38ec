import { and, eq, inArray, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { POST as decideOne } from "@/app/api/v1/lines/[id]/decision/route";
import { POST as decideBatch } from "@/app/api/v1/work-orders/[id]/decisions/route";
import { getDb } from "@/db/client";
import { budgetUsedCents, recountBudgetUsed } from "@/db/queries/budget-use";
import { currentFiscalYear } from "@/db/queries/estimate-context";
import { accounts, decisions, estimateLines, units, workOrders } from "@/db/schema";
import { call, userByEmail } from "./helpers/app";

const SUPERVISOR = "supervisor@brennan-twp.example"; // signing limit $5,000
const TRUSTEE = "trustee@brennan-twp.example"; // signing limit $25,000

async function openWorkOrderWithLines(count: number, amountCents: number) {
  const db = getDb();
  const [unit] = await db.select().from(units).where(eq(units.unitNumber, "T-17")).limit(1);
  const [wo] = await db
    .insert(workOrders)
    .values({ number: 9001, unitId: unit!.id, accountId: unit!.accountId, status: "waiting_approval", title: "Race test", openedAt: new Date().toISOString() })
    .returning();
  const lines = await db
    .insert(estimateLines)
    .values(
      Array.from({ length: count }, (_, i) => ({
        workOrderId: wo!.id,
        position: i,
        kind: "part" as const,
        description: `Part ${i + 1}`,
        quantityMilli: 1000,
        unitPriceCents: amountCents,
        state: "proposed" as const,
        version: 2,
      })),
    )
    .returning();
  return { wo: wo!, lines, accountId: unit!.accountId };
}

describe("limits hold under concurrent decisions (one transaction per decision)", () => {
  it("never passes the repair budget or a signing limit, and answers every request with 200 or a reasoned 409", async () => {
    const { wo, lines, accountId } = await openWorkOrderWithLines(28, 100_000);
    // Leave exactly $9,500.00 of budget this fiscal year: room for nine $1,000.00 lines.
    const [account] = await getDb().select().from(accounts).where(eq(accounts.id, accountId));
    const bounds = currentFiscalYear(account!);
    const used = await recountBudgetUsed(getDb(), accountId, bounds);
    await getDb().update(accounts).set({ repairBudgetCents: used + 950_000 }).where(eq(accounts.id, accountId));

    const singles = lines.slice(0, 24).map((line, i) =>
      call(decideOne, {
        path: `/api/v1/lines/${line.id}/decision`,
        params: { id: line.id },
        as: i % 2 === 0 ? SUPERVISOR : TRUSTEE,
        body: { decision: "approve", expectedVersion: line.version },
      }),
    );
    const batch = call(decideBatch, {
      path: `/api/v1/work-orders/${wo.id}/decisions`,
      params: { id: wo.id },
      as: TRUSTEE,
      body: { decisions: lines.slice(24).map((l) => ({ lineId: l.id, decision: "approve", expectedVersion: l.version })) },
    });
    // A second batch races for lines the singles also want.
    const overlapping = call(decideBatch, {
      path: `/api/v1/work-orders/${wo.id}/decisions`,
      params: { id: wo.id },
      as: SUPERVISOR,
      body: { decisions: lines.slice(0, 2).map((l) => ({ lineId: l.id, decision: "approve", expectedVersion: l.version })) },
    });
    const results = await Promise.all([...singles, batch, overlapping]);

    expect(results.length).toBeGreaterThanOrEqual(20);
    for (const r of results) {
      expect([200, 409]).toContain(r.status);
      if (r.status === 409) {
        expect(["budget_exceeded", "signing_limit_exceeded", "stale_version", "not_pending"]).toContain(r.body.code);
        expect(r.body.detail.length).toBeGreaterThan(10);
      }
    }

    const approved = await getDb()
      .select()
      .from(estimateLines)
      .where(and(eq(estimateLines.workOrderId, wo.id), eq(estimateLines.state, "approved")));
    const total = approved.reduce((s, l) => s + (l.approvedAmountCents ?? 0), 0);
    expect(total).toBeLessThanOrEqual(950_000);
    expect(total).toBe(900_000); // the budget is used as far as it goes
    // The running total the decisions kept is the full recount.
    expect(await recountBudgetUsed(getDb(), accountId, bounds)).toBe(used + 900_000);
    expect(await budgetUsedCents(getDb(), accountId, bounds)).toBe(used + 900_000);
    const supervisor = await userByEmail(SUPERVISOR);
    const bySupervisor = approved.filter((l) => l.approvedByUserId === supervisor.id).reduce((s, l) => s + (l.approvedAmountCents ?? 0), 0);
    expect(bySupervisor).toBeLessThanOrEqual(500_000);

    // Exactly one decision record per approved line; refused requests left no trace.
    const [records] = await getDb()
      .select({ n: sql<number>`count(*)` })
      .from(decisions)
      .where(inArray(decisions.lineId, lines.map((l) => l.id)));
    expect(Number(records!.n)).toBe(approved.length);
  });
});
