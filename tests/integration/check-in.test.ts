import { and, eq, ne } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { PATCH as patchConcern } from "@/app/api/v1/concerns/[id]/route";
import { POST as addConcern } from "@/app/api/v1/work-orders/[id]/concerns/route";
import { GET as getWo, PATCH as patchWo } from "@/app/api/v1/work-orders/[id]/route";
import { POST as moveStatus } from "@/app/api/v1/work-orders/[id]/status/route";
import { GET as listWos, POST as checkIn } from "@/app/api/v1/work-orders/route";
import { getDb } from "@/db/client";
import { auditLog, concerns, estimateLines, meterReadings, units, workOrders } from "@/db/schema";
import { call, userByEmail } from "./helpers/app";
import { catchMail } from "./helpers/mail";

const mail = catchMail();
const WRITER = "writer@quarry-road.example";
const TECH = "tech@quarry-road.example";

async function unit(number: string) {
  const [u] = await getDb().select().from(units).where(eq(units.unitNumber, number));
  return u!;
}
async function openWoOf(unitId: string) {
  return getDb().select().from(workOrders).where(and(eq(workOrders.unitId, unitId), ne(workOrders.status, "released")));
}

type Wo = { id: string; number: number; status: string; unitId: string; concerns: { complaint: string }[] };
type View = { id: string; status: string; promisedAt: string | null; poNumber: string | null; technicianName: string | null; timeline: { note: string; status: string }[]; concerns: { id: string; complaint: string; cause: string; correction: string }[] };

describe("check-in: a writer opens a work order on a unit", () => {
  it("opens the visit with its complaints, readings, technician, promised-by time and PO; the approvers are e-mailed", async () => {
    const t17 = await unit("T-17");
    const tech = await userByEmail(TECH);
    const promisedAt = new Date(Date.now() + 2 * 86_400_000).toISOString();
    const res = await call<Wo>(checkIn, {
      path: "/api/v1/work-orders",
      as: WRITER,
      body: { unitId: t17.id, concerns: [{ complaint: "Wing plow will not raise." }, { complaint: "Left mirror cracked." }], assignedTechId: tech.id, promisedAt, poNumber: "BT-2026-0500", odometer: 61_900, engineHours: 4_260 },
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: "checked_in", unitId: t17.id, concerns: [{ complaint: "Wing plow will not raise." }, { complaint: "Left mirror cracked." }] });
    const view = await call<View>(getWo, { path: `/api/v1/work-orders/${res.body.id}`, as: "supervisor@brennan-twp.example", params: { id: res.body.id } });
    // The fleet sees the new visit at once, with the shop's first timeline entry.
    expect(view.status).toBe(200);
    expect(view.body).toMatchObject({ status: "checked_in", promisedAt, poNumber: "BT-2026-0500", technicianName: tech.name });
    expect(view.body.timeline[0]!.note).toMatch(/Checked in for 2 concerns; Luis Ferreira assigned; promised by/);
    const readings = await getDb().select().from(meterReadings).where(eq(meterReadings.workOrderId, res.body.id));
    expect(readings.map((r) => [r.kind, r.value]).sort()).toEqual([["engine_hours", 4_260], ["odometer", 61_900]]);
    const m = await mail.smtp().waitFor((x) => x.to.includes("supervisor@brennan-twp.example") && x.subject.includes("checked in"));
    expect(m.text).toContain(`/fleet/units/${t17.id}`);
    expect(m.text).toContain("Wing plow will not raise.");
    await mail.smtp().waitFor((x) => x.to.includes("trustee@brennan-twp.example") && x.subject.includes("checked in"));
    // Clerks and viewers are not approvers: no "checked in" mail for them.
    expect((await mail.smtp().messages()).some((x) => x.to.includes("clerk@brennan-twp.example") && x.subject.includes("checked in"))).toBe(false);
  });

  it("a second open work order on the same unit is 409 unit_in_shop with a link to the open one", async () => {
    const t17 = await unit("T-17");
    const [open] = await openWoOf(t17.id);
    const res = await call<{ code: string; detail: string; workOrderId: string; href: string }>(checkIn, {
      path: "/api/v1/work-orders",
      as: WRITER,
      body: { unitId: t17.id, concerns: [{ complaint: "Again" }] },
    });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe("unit_in_shop");
    expect(res.body.workOrderId).toBe(open!.id);
    expect(res.body.href).toBe(`/work-orders/${open!.id}`);
    expect(res.body.detail).toContain(`W-${open!.number}`);
  });

  it("two check-ins of one unit at the same moment: exactly one wins, the other is told where the visit is", async () => {
    const g2 = await unit("G-2");
    const body = { unitId: g2.id, concerns: [{ complaint: "Blade float not holding." }] };
    const results = await Promise.all([1, 2, 3].map(() => call<{ code?: string }>(checkIn, { path: "/api/v1/work-orders", as: WRITER, body })));
    expect(results.map((r) => r.status).sort()).toEqual([201, 409, 409]);
    expect(results.filter((r) => r.status === 409).every((r) => r.body.code === "unit_in_shop")).toBe(true);
    expect(await openWoOf(g2.id)).toHaveLength(1);
  });

  it("behind the check, the partial unique index work_orders_one_open_per_unit refuses a second open visit written any other way", async () => {
    const g2 = await unit("G-2");
    const [open] = await openWoOf(g2.id);
    const write = getDb().insert(workOrders).values({ number: 999_001, unitId: g2.id, accountId: g2.accountId, status: "diagnosing", openedAt: new Date().toISOString() });
    // The message check-in turns into 409 unit_in_shop when another process wins the race.
    await expect(write).rejects.toThrow();
    await write.catch((e: Error) => expect(`${e.message} ${String(e.cause)}`).toMatch(/UNIQUE constraint failed: work_orders\.unit_id/));
    expect((await openWoOf(g2.id)).map((w) => w.id)).toEqual([open!.id]);
  });

  it("the lower-reading rule applies at check-in; bad input is a 400 and writes nothing", async () => {
    const t5 = await unit("T-5");
    const before = (await getDb().select().from(workOrders)).length;
    const lower = await call(checkIn, { path: "/api/v1/work-orders", as: WRITER, body: { unitId: t5.id, concerns: [{ complaint: "x" }], odometer: 10 } });
    expect(lower.status).toBe(400);
    expect(lower.body.errors?.[0]?.path).toBe("odometer");
    const cases: [Record<string, unknown>, string][] = [
      [{ unitId: t5.id, concerns: [] }, "concerns"],
      [{ unitId: t5.id, concerns: [{ complaint: "" }] }, "concerns.0.complaint"],
      [{ unitId: t5.id, concerns: [{ complaint: "x" }], promisedAt: "next week" }, "promisedAt"],
      [{ unitId: t5.id, concerns: [{ complaint: "x" }], assignedTechId: (await userByEmail("foreman@brennan-twp.example")).id }, "assignedTechId"],
      [{ unitId: t5.id, concerns: [{ complaint: "x" }], engineHours: -1 }, "engineHours"],
    ];
    for (const [body, field] of cases) {
      const res = await call(checkIn, { path: "/api/v1/work-orders", as: WRITER, body });
      expect(res.status, field).toBe(400);
      expect(res.body.errors?.map((e) => e.path), field).toContain(field);
    }
    expect((await getDb().select().from(workOrders)).length).toBe(before);
    expect((await call(checkIn, { path: "/api/v1/work-orders", as: WRITER, body: { unitId: "nope", concerns: [{ complaint: "x" }] } })).status).toBe(404);
    for (const who of [TECH, "supervisor@brennan-twp.example", "clerk@brennan-twp.example", "foreman@brennan-twp.example"]) {
      expect((await call(checkIn, { path: "/api/v1/work-orders", as: who, body: { unitId: t5.id, concerns: [{ complaint: "x" }] } })).status, who).toBe(403);
    }
  });

  it("the unit's deferred work is brought back at check-in as draft lines (the estimate editor's own bring-back)", async () => {
    const t14 = await unit("T-14");
    const [w1042] = await openWoOf(t14.id);
    // W-1042 still has lines waiting for the township: the writer holds them for the next visit as it is released.
    const released = await call(moveStatus, { path: `/api/v1/work-orders/${w1042!.id}/status`, as: WRITER, params: { id: w1042!.id }, body: { status: "released", note: "Picked up.", pendingLines: "hold" } });
    expect(released.status).toBe(200);
    const deferred = await getDb().select().from(estimateLines).where(eq(estimateLines.description, "Sandblast and repaint dump body"));
    const res = await call<Wo>(checkIn, { path: "/api/v1/work-orders", as: WRITER, body: { unitId: t14.id, concerns: [{ complaint: "Body repaint, as deferred." }], bringBackLineIds: [deferred[0]!.id] } });
    expect(res.status).toBe(201);
    const lines = await getDb().select().from(estimateLines).where(eq(estimateLines.workOrderId, res.body.id));
    expect(lines).toEqual([expect.objectContaining({ description: "Sandblast and repaint dump body", state: "draft", deferredFromLineId: deferred[0]!.id })]);
    // Offered once: the same line cannot come back twice.
    const [w5] = [await unit("Water 1")];
    const again = await call(checkIn, { path: "/api/v1/work-orders", as: WRITER, body: { unitId: w5.id, concerns: [{ complaint: "x" }], bringBackLineIds: [deferred[0]!.id] } });
    expect(again.status).toBe(404);
    expect(await openWoOf(w5.id)).toHaveLength(0);
  });
});

describe("the visit as it goes", () => {
  it("reassigning the technician, moving promised-by and the PO are each a timeline entry the fleet sees", async () => {
    const [wo] = await openWoOf((await unit("T-17")).id);
    const tech2 = await userByEmail("tech2@quarry-road.example");
    const promisedAt = new Date(Date.now() + 5 * 86_400_000).toISOString();
    const res = await call<View>(patchWo, { path: `/api/v1/work-orders/${wo!.id}`, as: WRITER, method: "PATCH", params: { id: wo!.id }, body: { assignedTechId: tech2.id, promisedAt, poNumber: "BT-2026-0501" } });
    expect(res.status).toBe(200);
    const notes = res.body.timeline.map((e) => e.note);
    expect(notes).toEqual(expect.arrayContaining([
      "Jo Lindqvist is now the technician (was Luis Ferreira).",
      expect.stringMatching(/^Promised by .+ \(was .+\)\.$/),
      "PO number BT-2026-0501 (was BT-2026-0500).",
    ]));
    const fleet = await call<View>(getWo, { path: `/api/v1/work-orders/${wo!.id}`, as: "foreman@brennan-twp.example", params: { id: wo!.id } });
    expect(fleet.body.timeline.map((e) => e.note)).toContain("Jo Lindqvist is now the technician (was Luis Ferreira).");
    const [audit] = await getDb().select().from(auditLog).where(and(eq(auditLog.entityId, wo!.id), eq(auditLog.action, "work_order.edited")));
    expect(audit!.detail).toMatchObject({ technician: { from: "Luis Ferreira", to: "Jo Lindqvist" } });
    // Nothing changed: no entry.
    const same = await call<View>(patchWo, { path: `/api/v1/work-orders/${wo!.id}`, as: WRITER, method: "PATCH", params: { id: wo!.id }, body: { poNumber: "BT-2026-0501" } });
    expect(same.body.timeline.length).toBe(res.body.timeline.length);
    // Another account's approver, a technician, a bad id.
    expect((await call(patchWo, { path: `/api/v1/work-orders/${wo!.id}`, as: TECH, method: "PATCH", params: { id: wo!.id }, body: { poNumber: "X" } })).status).toBe(403);
    expect((await call(patchWo, { path: "/api/v1/work-orders/nope", as: WRITER, method: "PATCH", params: { id: "nope" }, body: { poNumber: "X" } })).status).toBe(404);
    expect((await call(patchWo, { path: `/api/v1/work-orders/${wo!.id}`, as: WRITER, method: "PATCH", params: { id: wo!.id }, body: { promisedAt: "soon" } })).status).toBe(400);
  });

  it("a concern found later is added; cause and correction are written by the technician; the fleet reads all three Cs", async () => {
    const [wo] = await openWoOf((await unit("T-17")).id);
    const added = await call<{ id: string }>(addConcern, { path: `/api/v1/work-orders/${wo!.id}/concerns`, as: TECH, params: { id: wo!.id }, body: { complaint: "Found: hydraulic hose chafed at the wing mount." } });
    expect(added.status).toBe(201);
    const written = await call<{ cause: string; correction: string }>(patchConcern, {
      path: `/api/v1/concerns/${added.body.id}`,
      as: TECH,
      method: "PATCH",
      params: { id: added.body.id },
      body: { cause: "Hose rubbing on the mount bracket.", correction: "Replaced the hose and added a clamp." },
    });
    expect(written.status).toBe(200);
    const fleet = await call<View>(getWo, { path: `/api/v1/work-orders/${wo!.id}`, as: "supervisor@brennan-twp.example", params: { id: wo!.id } });
    expect(fleet.body.concerns.at(-1)).toMatchObject({ complaint: "Found: hydraulic hose chafed at the wing mount.", cause: "Hose rubbing on the mount bracket.", correction: "Replaced the hose and added a clamp." });
    expect(fleet.body.timeline.map((e) => e.note)).toContain("Another concern: Found: hydraulic hose chafed at the wing mount.");

    // Fleet people, another account's ids, bad input.
    expect((await call(patchConcern, { path: `/api/v1/concerns/${added.body.id}`, as: "supervisor@brennan-twp.example", method: "PATCH", params: { id: added.body.id }, body: { cause: "x" } })).status).toBe(403);
    expect((await call(addConcern, { path: `/api/v1/work-orders/${wo!.id}/concerns`, as: "foreman@brennan-twp.example", params: { id: wo!.id }, body: { complaint: "x" } })).status).toBe(403);
    expect((await call(patchConcern, { path: `/api/v1/concerns/${added.body.id}`, as: TECH, method: "PATCH", params: { id: added.body.id }, body: {} })).status).toBe(400);
    expect((await call(addConcern, { path: `/api/v1/work-orders/${wo!.id}/concerns`, as: TECH, params: { id: wo!.id }, body: { complaint: "" } })).status).toBe(400);
    expect((await call(patchConcern, { path: "/api/v1/concerns/nope", as: TECH, method: "PATCH", params: { id: "nope" }, body: { cause: "x" } })).status).toBe(404);
    const [c] = await getDb().select().from(concerns).where(eq(concerns.id, added.body.id));
    expect(c!.cause).toBe("Hose rubbing on the mount bracket.");
  });

  it("a released visit takes no more changes (409)", async () => {
    const [w1042] = await getDb().select().from(workOrders).where(eq(workOrders.number, 1042));
    const [c] = await getDb().select().from(concerns).where(eq(concerns.workOrderId, w1042!.id));
    expect((await call(patchWo, { path: `/api/v1/work-orders/${w1042!.id}`, as: WRITER, method: "PATCH", params: { id: w1042!.id }, body: { poNumber: "X" } })).status).toBe(409);
    expect((await call(addConcern, { path: `/api/v1/work-orders/${w1042!.id}/concerns`, as: WRITER, params: { id: w1042!.id }, body: { complaint: "x" } })).status).toBe(409);
    expect((await call(patchConcern, { path: `/api/v1/concerns/${c!.id}`, as: WRITER, method: "PATCH", params: { id: c!.id }, body: { cause: "x" } })).status).toBe(409);
  });

  it("the shop's work-order list reaches past visits, with filters", async () => {
    type List = { workOrders: { number: number; status: string; accountId: string; technicianId: string | null; openedAt: string }[]; nextCursor: string | null };
    const open = await call<List>(listWos, { path: "/api/v1/work-orders?limit=200", as: WRITER });
    expect(open.body.workOrders.every((w) => w.status !== "released")).toBe(true);
    const all = await call<List>(listWos, { path: "/api/v1/work-orders?all=true&limit=200", as: WRITER });
    expect(all.body.workOrders.some((w) => w.status === "released")).toBe(true);
    const released = await call<List>(listWos, { path: "/api/v1/work-orders?status=released&limit=5", as: WRITER });
    expect(released.body.workOrders).toHaveLength(5);
    expect(released.body.nextCursor).not.toBeNull();
    const tech = await userByEmail(TECH);
    const mine = await call<List>(listWos, { path: `/api/v1/work-orders?all=true&technicianId=${tech.id}&limit=200`, as: WRITER });
    expect(mine.body.workOrders.every((w) => w.technicianId === tech.id)).toBe(true);
    const today = new Date().toISOString().slice(0, 10);
    const recent = await call<List>(listWos, { path: `/api/v1/work-orders?all=true&openedFrom=${today}&limit=200`, as: WRITER });
    expect(recent.body.workOrders.length).toBeGreaterThan(0);
    expect(recent.body.workOrders.every((w) => w.openedAt >= new Date(Date.now() - 2 * 86_400_000).toISOString())).toBe(true);
    expect((await call(listWos, { path: "/api/v1/work-orders?openedFrom=yesterday", as: WRITER })).status).toBe(400);
    // A fleet person still sees only their own account's, past visits included.
    const fleet = await call<List>(listWos, { path: "/api/v1/work-orders?all=true&limit=200", as: "office@kettle-ridge.example" });
    expect(new Set(fleet.body.workOrders.map((w) => w.accountId)).size).toBe(1);
  });
});
