// A page says what is true of the visit (issue "What a week of use turned up", item 3).
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { getDb } from "@/db/client";
import { listOpenWorkOrders } from "@/db/queries/work-order-list";
import { workOrderView } from "@/db/queries/work-order-view";
import { estimateLines, timeEntries, workOrders } from "@/db/schema";
import { technicianLabel } from "@/lib/format";
import { sessionUser } from "./helpers/app";
import { workOrderByNumber } from "./helpers/work-orders";

describe("the technician on a visit", () => {
  it("a visit nobody was assigned to, with a technician clocked on it, names that technician", async () => {
    const wo = await workOrderByNumber(1047); // Bus 9: checked in, no technician assigned
    expect(wo.assignedTechId).toBeNull();
    const tech = await sessionUser("tech2@quarry-road.example");
    const [line] = await getDb()
      .insert(estimateLines)
      .values({ workOrderId: wo.id, kind: "labor", description: "Check heater blower", quantityMilli: 500, unitPriceCents: 14_250, state: "approved" })
      .returning();
    await getDb().insert(timeEntries).values({ lineId: line!.id, workOrderId: wo.id, techId: tech.id, startedAt: new Date().toISOString() });

    const view = await workOrderView(await sessionUser("writer@quarry-road.example"), wo.id);
    expect(view).toMatchObject({ technicianName: null, clockedTechName: tech.name });
    expect(technicianLabel(view!.technicianName, view!.clockedTechName)).toBe(`${tech.name} (clocked on it, not assigned)`);
    const floor = await listOpenWorkOrders(await sessionUser("writer@quarry-road.example"), { limit: 50 });
    expect(floor.workOrders.find((w) => w.id === wo.id)).toMatchObject({ technicianName: null, clockedTechName: tech.name });
  });

  it("an assigned technician is named as assigned; nobody at all reads “not assigned”", async () => {
    expect(technicianLabel("Dana Okafor", "Someone Else")).toBe("Dana Okafor");
    expect(technicianLabel(null, null)).toBe("not assigned");
    const [released] = await getDb().select().from(workOrders).where(eq(workOrders.number, 1001));
    expect(released!.status).toBe("released");
  });
});
