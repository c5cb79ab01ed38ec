// A part's old core coming back (product.md, computation rules: "Core charges
// are shown apart, not taxed, and credited when the core is returned"). The
// core leaves the totals and the invoice; an issued invoice never changes
// (a credit note goes against it instead).
import { and, eq, gt, isNull } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { setCoreReturned } from "@/db/queries/core-returns";
import { decide } from "@/db/queries/decisions";
import { workOrderView } from "@/db/queries/work-order-view";
import { getDb } from "@/db/client";
import { estimateLines, invoices } from "@/db/schema";
import { sessionUser } from "./helpers/app";
import { lineByDescription, workOrderByNumber } from "./helpers/work-orders";

const writer = () => sessionUser("writer@quarry-road.example");
const supervisor = () => sessionUser("supervisor@brennan-twp.example");

describe("a core comes back", () => {
  it("is refused on a line not yet approved, then credits the core and tells the fleet", async () => {
    const wo = await workOrderByNumber(1042);
    const drag = await lineByDescription(wo.id, "Drag link"); // $412.90, core $25.00 (demo data)
    await expect(setCoreReturned(await writer(), drag.id, true)).rejects.toMatchObject({ status: 409, code: "not_approved" });

    await decide(await supervisor(), wo.id, [{ lineId: drag.id, decision: "approve", expectedVersion: drag.version }]);
    const before = (await workOrderView(await supervisor(), wo.id))!;
    expect(before.estimateTotals.coreCents).toBeGreaterThanOrEqual(2_500);

    expect(await setCoreReturned(await writer(), drag.id, true)).toEqual({ workOrderId: wo.id, changed: true, creditNote: null });
    const after = (await workOrderView(await supervisor(), wo.id))!;
    // The approved cores drop by exactly the $25.00 core; the line still shows what the core was.
    expect(before.estimateTotals.coreCents - after.estimateTotals.coreCents).toBe(2_500);
    const line = after.lines.find((l) => l.id === drag.id)!;
    expect(line.coreTotalCents).toBe(2_500);
    expect(line.coreReturnedAt).not.toBeNull();
    expect(after.timeline.map((t) => t.note)).toContain("Core came back for “Drag link, adjustable”: $25.00 credited.");
    // Saying it twice changes nothing; taking it back charges the core again.
    expect(await setCoreReturned(await writer(), drag.id, true)).toMatchObject({ changed: false });
    await setCoreReturned(await writer(), drag.id, false);
    expect((await workOrderView(await supervisor(), wo.id))!.estimateTotals.coreCents).toBe(before.estimateTotals.coreCents);
  });

  it("is refused on a line without a core charge, and another account's line is not found", async () => {
    const wo = await workOrderByNumber(1042);
    const labour = (await getDb().select().from(estimateLines).where(and(eq(estimateLines.workOrderId, wo.id), eq(estimateLines.kind, "labor"))))[0]!;
    await expect(setCoreReturned(await writer(), labour.id, true)).rejects.toMatchObject({ status: 409, code: "no_core_charge" });
    const drag = await lineByDescription(wo.id, "Drag link");
    await expect(setCoreReturned(await sessionUser("transport@alder-falls-schools.example"), drag.id, true)).rejects.toMatchObject({ status: 404 });
  });

  it("on an invoice paid in full, leaves everything as it was and says why (a refund is settled outside)", async () => {
    // Credits on an open invoice: tests/integration/credit-notes.test.ts.
    const [row] = await getDb()
      .select({ lineId: estimateLines.id, number: invoices.number })
      .from(estimateLines)
      .innerJoin(invoices, eq(invoices.workOrderId, estimateLines.workOrderId))
      .where(and(gt(estimateLines.coreChargeCents, 0), isNull(estimateLines.coreReturnedAt), eq(invoices.status, "paid")))
      .limit(1);
    expect(row).toBeDefined();
    const untouched = await getDb().select().from(estimateLines).where(eq(estimateLines.id, row!.lineId));
    const error = await setCoreReturned(await writer(), row!.lineId, true).catch((e: unknown) => e);
    expect(error).toMatchObject({ status: 409, code: "credit_refused" });
    expect(String((error as Error).message)).toMatch(/paid in full/);
    expect(await getDb().select().from(estimateLines).where(eq(estimateLines.id, row!.lineId))).toEqual(untouched);
  });
});
