// Closed visits stay closed (issue 9): nothing on a released work order waits
// for a decision, releasing with lines still waiting asks what becomes of them,
// every line write is audited, and a replaced meter is the shop's to record.
import { and, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { POST as decideLine } from "@/app/api/v1/lines/[id]/decision/route";
import { POST as addReading } from "@/app/api/v1/units/[id]/meter-readings/route";
import { POST as move } from "@/app/api/v1/work-orders/[id]/status/route";
import { getDb } from "@/db/client";
import { moveLine } from "@/db/queries/estimate-lines";
import { auditLog, decisions, estimateLines, units, workOrders } from "@/db/schema";
import { call, sessionUser } from "./helpers/app";
import { linesOf, workOrderByNumber } from "./helpers/work-orders";

const release = (id: string, as: string, extra: Record<string, string> = {}) =>
  call<{ code?: string; detail?: string; lines?: { id: string; description: string; amountCents: number }[]; status: string }>(move, {
    path: `/api/v1/work-orders/${id}/status`,
    params: { id },
    as,
    body: { status: "released", note: "Picked up.", ...extra },
  });

describe("a decision on a released work order", () => {
  it("is 409 not_pending, and nothing is approved", async () => {
    const wo = await workOrderByNumber(1044);
    const line = (await linesOf(wo.id)).find((l) => l.state === "proposed")!;
    // A visit released while a line still waited (as the app allowed before).
    await getDb().update(workOrders).set({ status: "released", releasedAt: new Date().toISOString() }).where(eq(workOrders.id, wo.id));
    const res = await call(decideLine, {
      path: `/api/v1/lines/${line.id}/decision`,
      params: { id: line.id },
      as: "transport@alder-falls-schools.example",
      body: { decision: "approve", expectedVersion: line.version },
    });
    expect([res.status, res.body.code]).toEqual([409, "not_pending"]);
    expect(res.body.detail).toContain("W-1044 was released");
    const [after] = await getDb().select().from(estimateLines).where(eq(estimateLines.id, line.id));
    expect(after).toMatchObject({ state: "proposed", version: line.version, approvedAmountCents: null });
    expect(await getDb().select().from(decisions).where(eq(decisions.lineId, line.id))).toHaveLength(0);
  });
});

describe("releasing with lines still waiting for the customer", () => {
  it("asks what becomes of them, lets only the owner or a writer choose, and holds them for the next visit in the release's transaction", async () => {
    const wo = await workOrderByNumber(1050);
    const waiting = (await linesOf(wo.id)).filter((l) => l.state === "proposed");
    expect(waiting.length).toBeGreaterThan(0);

    const asked = await release(wo.id, "writer@quarry-road.example");
    expect([asked.status, asked.body.code]).toEqual([409, "lines_pending"]);
    expect(asked.body.detail).toMatch(new RegExp(`^${waiting.length} lines? on W-1050 \\(\\$[\\d,.]+\\) still wait for the customer's decision`));
    expect(asked.body.lines?.map((l) => l.id).sort()).toEqual(waiting.map((l) => l.id).sort());

    const tech = await release(wo.id, "tech@quarry-road.example", { pendingLines: "hold" });
    expect(tech.status).toBe(403);
    const noReason = await release(wo.id, "writer@quarry-road.example", { pendingLines: "decline" });
    expect(noReason.status).toBe(400);
    // Nothing moved on any of the refusals.
    expect((await workOrderByNumber(1050)).status).toBe(wo.status);

    const held = await release(wo.id, "writer@quarry-road.example", { pendingLines: "hold" });
    expect([held.status, held.body.status]).toEqual([200, "released"]);
    const after = await linesOf(wo.id);
    for (const l of waiting) expect(after.find((a) => a.id === l.id)).toMatchObject({ state: "held", version: l.version + 1 });
    const writer = await sessionUser("writer@quarry-road.example");
    const rows = await getDb().select().from(decisions).where(and(eq(decisions.workOrderId, wo.id), eq(decisions.decision, "hold")));
    expect(rows.filter((r) => r.byUserId === writer.id)).toHaveLength(waiting.length);
    expect(rows[0]?.note).toBe("Held for the next visit when W-1050 was released.");
    const [audit] = await getDb().select().from(auditLog).where(and(eq(auditLog.entityId, wo.id), eq(auditLog.action, "work_order.release_held")));
    expect(audit?.detail).toMatchObject({ lineIds: expect.arrayContaining(waiting.map((l) => l.id)) });
  });

  it("or declines them with the writer's note", async () => {
    const wo = await workOrderByNumber(1042);
    const waiting = (await linesOf(wo.id)).filter((l) => l.state === "proposed");
    const res = await release(wo.id, "owner@quarry-road.example", { pendingLines: "decline", pendingNote: "Township decided to do it in-house." });
    expect(res.status).toBe(200);
    const after = await linesOf(wo.id);
    for (const l of waiting) expect(after.find((a) => a.id === l.id)?.state).toBe("declined");
    const rows = await getDb().select().from(decisions).where(and(eq(decisions.workOrderId, wo.id), eq(decisions.decision, "decline")));
    expect(rows.filter((r) => r.note === "Township decided to do it in-house.")).toHaveLength(waiting.length);
  });
});

describe("every line write is audited", () => {
  it("moving a line up or down writes an audit row; a closed visit's lines do not move", async () => {
    const writer = await sessionUser("writer@quarry-road.example");
    const open = await workOrderByNumber(1045);
    const lines = await linesOf(open.id);
    expect(lines.length).toBeGreaterThan(1);
    await moveLine(writer, lines[0]!.id, "down");
    const [audit] = await getDb().select().from(auditLog).where(and(eq(auditLog.entityId, lines[0]!.id), eq(auditLog.action, "line.moved")));
    expect(audit?.detail).toEqual({ direction: "down", from: 1, to: 2 });
    expect((await linesOf(open.id))[1]?.id).toBe(lines[0]!.id);

    const closed = await workOrderByNumber(1050);
    const closedLines = await linesOf(closed.id);
    await expect(moveLine(writer, closedLines[0]!.id, "down")).rejects.toMatchObject({ status: 409, code: "work_order_closed" });
  });
});

describe("a replaced meter", () => {
  it("is recorded by the shop only; a fleet person is refused and nothing is written", async () => {
    const [unit] = await getDb().select().from(units).where(eq(units.unitNumber, "T-14")).limit(1);
    const body = { kind: "odometer", value: 12, meterReplaced: true, note: "New cluster" };
    const viewer = await call(addReading, { path: "/x", params: { id: unit!.id }, as: "foreman@brennan-twp.example", body });
    expect([viewer.status, viewer.body.code]).toEqual([403, "forbidden"]);
    const approver = await call(addReading, { path: "/x", params: { id: unit!.id }, as: "supervisor@brennan-twp.example", body });
    expect(approver.status).toBe(403);
    const writer = await call(addReading, { path: "/x", params: { id: unit!.id }, as: "writer@quarry-road.example", body });
    expect(writer.status).toBe(201);
  });
});
