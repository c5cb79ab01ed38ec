// The hot reads built once (db/prepared.ts) run on the caller's connection:
// inside a write transaction they see its uncommitted rows, outside it they do
// not; they answer as the same query built afresh does; and each account's
// scope still holds.
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb, writeTx } from "@/db/client";
import { statusEvents, workOrders } from "@/db/schema";
import { loadEstimateContext } from "@/db/queries/estimate-context";
import { findWorkOrder, loadTimeline } from "@/db/queries/work-order-detail";
import { sessionUser } from "./helpers/app";
import { workOrderByNumber } from "./helpers/work-orders";

const SUPERVISOR = "supervisor@brennan-twp.example";

describe("a prepared read", () => {
  it("answers as the query built each time does", async () => {
    const wo = await workOrderByNumber(1042);
    const built = await getDb().select().from(statusEvents).where(eq(statusEvents.workOrderId, wo.id));
    const timeline = await loadTimeline(wo.id);
    expect(timeline.map((e) => e.id).sort()).toEqual(built.map((e) => e.id).sort());
  });

  it("sees its transaction's own rows, which the pool does not until the commit", async () => {
    const wo = await workOrderByNumber(1042);
    const user = await sessionUser(SUPERVISOR);
    const before = (await loadEstimateContext(getDb(), user, wo.id)).wo.title;
    let seenInside = "";
    let seenOutside = "";
    await writeTx(async (tx) => {
      await tx.update(workOrders).set({ title: "Retitled inside" }).where(eq(workOrders.id, wo.id));
      seenInside = (await loadEstimateContext(tx, user, wo.id)).wo.title;
      seenOutside = (await loadEstimateContext(getDb(), user, wo.id)).wo.title;
      // Undo: the test changes nothing it keeps.
      await tx.update(workOrders).set({ title: before }).where(eq(workOrders.id, wo.id));
    });
    expect(seenInside).toBe("Retitled inside");
    expect(seenOutside).toBe(before);
  });

  it("keeps each account to its own work orders, and staff to all", async () => {
    const wo = await workOrderByNumber(1042);
    const own = await sessionUser(SUPERVISOR);
    const other = await sessionUser("transport@alder-falls-schools.example");
    const writer = await sessionUser("writer@quarry-road.example");
    expect((await findWorkOrder(own, wo.id))?.id).toBe(wo.id);
    expect((await findWorkOrder(writer, wo.id))?.id).toBe(wo.id);
    expect(await findWorkOrder({ ...own, accountId: "another-account" }, wo.id)).toBeNull();
    expect(await findWorkOrder(other, wo.id)).toBeNull();
    await expect(loadEstimateContext(getDb(), { role: "approver", accountId: "another-account" }, wo.id)).rejects.toMatchObject({ status: 404 });
  });
});
