import { desc, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { GET as visit } from "@/app/api/v1/units/[id]/visit/route";
import { POST as move } from "@/app/api/v1/work-orders/[id]/status/route";
import { GET as listOrders } from "@/app/api/v1/work-orders/route";
import { getDb } from "@/db/client";
import { auditLog, statusEvents } from "@/db/schema";
import { call } from "./helpers/app";
import { catchMail } from "./helpers/mail";
import { workOrderByNumber } from "./helpers/work-orders";

const mail = catchMail();

const post = (id: string, as: string | null, body: unknown) =>
  call<Record<string, unknown> & { code?: string; detail?: string; status: string }>(move, {
    path: `/api/v1/work-orders/${id}/status`,
    params: { id },
    as,
    body,
  });

interface Visit {
  workOrder: { id: string; status: string; lastNote: string } | null;
  timeline: { status: string; note: string; at: string; by: string | null }[];
}

describe("POST /api/v1/work-orders/:id/status", () => {
  it("lets the technician move a visit with a note; the move is a dated timeline entry the fleet reads at once", async () => {
    const wo = await workOrderByNumber(1043);
    const before = Date.now();
    const res = await post(wo.id, "tech@quarry-road.example", { status: "waiting_parts", note: "Battery cable ends corroded; new ends ordered." });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: wo.id, number: 1043, unitId: wo.unitId, accountId: wo.accountId, status: "waiting_parts" });

    const [event] = await getDb().select().from(statusEvents).where(eq(statusEvents.workOrderId, wo.id)).orderBy(desc(statusEvents.at)).limit(1);
    expect(event).toMatchObject({ status: "waiting_parts", note: "Battery cable ends corroded; new ends ordered." });
    expect(Date.parse(event!.at)).toBeGreaterThanOrEqual(before - 1000);

    // The road supervisor (same account) sees the new status, the note and the entry on the unit's page data.
    const seen = await call<Visit>(visit, { path: `/api/v1/units/${wo.unitId}/visit`, params: { id: wo.unitId }, as: "supervisor@brennan-twp.example" });
    expect(seen.status).toBe(200);
    expect(seen.body.workOrder).toMatchObject({ id: wo.id, status: "waiting_parts", lastNote: "Battery cable ends corroded; new ends ordered." });
    expect(seen.body.timeline[0]).toMatchObject({ status: "waiting_parts", by: "Luis Ferreira" });
    // … and on the fleet home's list, which also carries the latest note.
    const list = await call<{ workOrders: { id: string; status: string; lastNote: string }[] }>(listOrders, {
      path: "/api/v1/work-orders",
      as: "foreman@brennan-twp.example",
    });
    expect(list.body.workOrders.find((w) => w.id === wo.id)).toMatchObject({ status: "waiting_parts", lastNote: "Battery cable ends corroded; new ends ordered." });

    const audit = await getDb().select().from(auditLog).where(eq(auditLog.entityId, wo.id));
    expect(audit.some((a) => a.action === "work_order.status")).toBe(true);
  });

  it("allows an update in the same status only with a note", async () => {
    const wo = await workOrderByNumber(1045);
    const bare = await post(wo.id, "writer@quarry-road.example", { status: "repairing" });
    expect(bare.status).toBe(400);
    expect(bare.body.code).toBe("invalid_input");
    const update = await post(wo.id, "writer@quarry-road.example", { status: "repairing", note: "Service line replaced; leak-down retest after lunch." });
    expect(update.status).toBe(200);
  });

  it("refuses fleet people (403), nobody (401), unknown statuses and malformed bodies (400), and unknown ids (404)", async () => {
    const wo = await workOrderByNumber(1046);
    expect((await post(wo.id, "supervisor@brennan-twp.example", { status: "repairing" })).status).toBe(403);
    expect((await post(wo.id, null, { status: "repairing" })).status).toBe(401);
    const unknown = await post(wo.id, "owner@quarry-road.example", { status: "on_fire" });
    expect(unknown.status).toBe(400);
    expect(unknown.body.code).toBe("invalid_input");
    const malformed = await post(wo.id, "owner@quarry-road.example", "{not json");
    expect(malformed.status).toBe(400);
    expect(malformed.body.code).toBe("malformed_json");
    expect((await post("no-such-work-order", "owner@quarry-road.example", { status: "repairing" })).status).toBe(404);
    expect((await workOrderByNumber(1046)).status).toBe("waiting_parts");
  });

  it("Ready for pickup e-mails the account's approvers and viewers, linking to the fleet unit page", async () => {
    await mail.smtp().clear();
    const wo = await workOrderByNumber(1042);
    const res = await post(wo.id, "writer@quarry-road.example", { status: "ready", note: "Keys at the front counter." });
    expect(res.status).toBe(200);
    const expected = ["supervisor@brennan-twp.example", "trustee@brennan-twp.example", "foreman@brennan-twp.example"];
    const mails = await Promise.all(expected.map((to) => mail.smtp().waitFor((m) => m.to.includes(to) && m.subject.includes("T-14"))));
    for (const mail of mails) {
      expect(mail.subject).toBe("T-14 is ready for pickup (W-1042)");
      expect(mail.text).toContain(`http://localhost:3000/fleet/units/${wo.unitId}`);
      expect(mail.text).toContain("Keys at the front counter.");
    }
    // The clerk pays invoices; pickup is not theirs.
    expect((await mail.smtp().messages()).some((m) => m.to.includes("clerk@brennan-twp.example"))).toBe(false);
  });

  it("releasing sets releasedAt and closes the visit: it cannot be moved again (409)", async () => {
    const wo = await workOrderByNumber(1049);
    const released = await post(wo.id, "writer@quarry-road.example", { status: "released", note: "Picked up by the foreman." });
    expect(released.status).toBe(200);
    expect(typeof released.body.releasedAt).toBe("string");
    const row = await workOrderByNumber(1049);
    expect(row.status).toBe("released");
    expect(row.releasedAt).toBe(released.body.releasedAt);

    const again = await post(wo.id, "owner@quarry-road.example", { status: "repairing" });
    expect(again.status).toBe(409);
    expect(again.body.code).toBe("work_order_closed");
    expect(again.body.detail).toContain("W-1049 was released");
    // The unit is no longer in the shop for its fleet.
    const seen = await call<Visit>(visit, { path: `/api/v1/units/${wo.unitId}/visit`, params: { id: wo.unitId }, as: "supervisor@brennan-twp.example" });
    expect(seen.body.workOrder).toBeNull();
  });

  it("another account's unit is a 404 on the live visit read", async () => {
    const wo = await workOrderByNumber(1044); // Bus 22, the school district's
    const res = await call(visit, { path: `/api/v1/units/${wo.unitId}/visit`, params: { id: wo.unitId }, as: "supervisor@brennan-twp.example" });
    expect(res.status).toBe(404);
    expect(res.body.code).toBe("not_found");
  });
});
