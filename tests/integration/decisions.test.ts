import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { POST as decideOne } from "@/app/api/v1/lines/[id]/decision/route";
import { GET as getWorkOrder } from "@/app/api/v1/work-orders/[id]/route";
import { POST as decideBatch } from "@/app/api/v1/work-orders/[id]/decisions/route";
import { GET as listWorkOrders } from "@/app/api/v1/work-orders/route";
import { getDb } from "@/db/client";
import { decisions, estimateLines } from "@/db/schema";
import { call, type Problem } from "./helpers/app";
import { lineByDescription, linesOf, workOrderByNumber } from "./helpers/work-orders";

const SUPERVISOR = "supervisor@brennan-twp.example";
type Line = { id: string; state: string; version: number; amountCents: number; description: string; decision: { by: string; decision: string; amountCents: number } | null };
type Detail = { lines: Line[]; totals: Record<string, number>; limits: Record<string, number | null>; findings: unknown[]; timeline: unknown[]; concerns: unknown[] };

describe("GET /api/v1/work-orders and /work-orders/:id (api-v1.md)", () => {
  it("lists open work orders scoped to the caller's account", async () => {
    const staff = await call<{ workOrders: { accountId: string; status: string }[] }>(listWorkOrders, { path: "/api/v1/work-orders", as: "writer@quarry-road.example" });
    expect(staff.status).toBe(200);
    expect(staff.body.workOrders.length).toBe(9);
    const fleet = await call<{ workOrders: { accountId: string; number: number }[] }>(listWorkOrders, { path: "/api/v1/work-orders", as: SUPERVISOR });
    expect(new Set(fleet.body.workOrders.map((w) => w.accountId)).size).toBe(1);
    const waiting = await call<{ workOrders: { status: string }[] }>(listWorkOrders, { path: "/api/v1/work-orders?status=waiting_approval", as: "owner@quarry-road.example" });
    expect(waiting.body.workOrders.every((w) => w.status === "waiting_approval")).toBe(true);
    expect((await call(listWorkOrders, { path: "/api/v1/work-orders?status=parked", as: SUPERVISOR })).status).toBe(400);
  });

  it("gives the detail with lines, totals and the caller's own limits; another account gets 404", async () => {
    const wo = await workOrderByNumber(1042);
    const res = await call<Detail & { number: number }>(getWorkOrder, { path: `/api/v1/work-orders/${wo.id}`, params: { id: wo.id }, as: SUPERVISOR });
    expect(res.status).toBe(200);
    expect(Object.keys(res.body)).toEqual(expect.arrayContaining(["id", "number", "unitId", "accountId", "status", "promisedAt", "timeline", "concerns", "findings", "lines", "totals", "limits"]));
    expect(Object.keys(res.body.totals).sort()).toEqual(["approvedCents", "declinedCents", "grandTotalCents", "heldCents", "pendingCents", "shopSuppliesCents", "taxCents"]);
    expect(res.body.limits).toMatchObject({ signingLimitCents: 500_000, signingUsedCents: 0, standingAuthorisationCents: 15_500, overrunPercent: 10, overrunCapCents: 5_000 });
    // Totals add up from the lines (worked from the seed: every pending line's amount).
    const pending = res.body.lines.filter((l) => l.state === "proposed").reduce((s, l) => s + l.amountCents, 0);
    expect(res.body.totals.pendingCents).toBe(pending);
    const staff = await call<Detail>(getWorkOrder, { path: `/api/v1/work-orders/${wo.id}`, params: { id: wo.id }, as: "writer@quarry-road.example" });
    expect(staff.body.limits.signingLimitCents).toBeNull();
    expect(staff.body.limits.signingUsedCents).toBeNull();

    const other = await call(getWorkOrder, { path: `/api/v1/work-orders/${wo.id}`, params: { id: wo.id }, as: "office@kettle-ridge.example" });
    expect(other.status).toBe(404);
    expect(other.body.code).toBe("not_found");
  });
});

describe("POST /api/v1/lines/:id/decision", () => {
  it("approves, declines and holds, recording who, when, amount and version", async () => {
    const wo = await workOrderByNumber(1042);
    const seal = await lineByDescription(wo.id, "seal kit");
    const res = await call<{ line: Line; totals: Record<string, number> }>(decideOne, {
      path: `/api/v1/lines/${seal.id}/decision`,
      params: { id: seal.id },
      as: SUPERVISOR,
      body: { decision: "approve", expectedVersion: seal.version, note: "Go ahead." },
    });
    expect(res.status).toBe(200);
    expect(res.body.line).toMatchObject({ id: seal.id, state: "approved", version: seal.version + 1, amountCents: 18_640 });
    expect(res.body.line.decision).toMatchObject({ by: "Gary Holm", decision: "approve", amountCents: 18_640 });
    const [record] = await getDb().select().from(decisions).where(eq(decisions.lineId, seal.id));
    expect(record).toMatchObject({ decision: "approve", amountCents: 18_640, lineVersion: seal.version, note: "Go ahead." });

    const align = await lineByDescription(wo.id, "alignment");
    const declined = await call<{ line: Line }>(decideOne, { path: `/api/v1/lines/${align.id}/decision`, params: { id: align.id }, as: SUPERVISOR, body: { decision: "decline", expectedVersion: align.version } });
    expect(declined.body.line.state).toBe("declined");
    const inspection = await lineByDescription(wo.id, "Annual inspection");
    const held = await call<{ line: Line }>(decideOne, { path: `/api/v1/lines/${inspection.id}/decision`, params: { id: inspection.id }, as: SUPERVISOR, body: { decision: "hold", expectedVersion: inspection.version } });
    expect(held.body.line.state).toBe("held");
  });

  it("refuses a line that would pass the approver's signing limit with 409 and the amounts in words", async () => {
    const wo = await workOrderByNumber(1042);
    const moldboard = await lineByDescription(wo.id, "Moldboard");
    const res = await call(decideOne, { path: `/api/v1/lines/${moldboard.id}/decision`, params: { id: moldboard.id }, as: SUPERVISOR, body: { decision: "approve", expectedVersion: moldboard.version } });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe("signing_limit_exceeded");
    // $186.40 already approved above + $5,640.00 = $5,826.40 > $5,000.00
    expect(res.body.detail).toMatch(/approving \$5,640\.00 would bring your approvals on W-1042 to \$5,826\.40; your signing limit is \$5,000\.00/i);
    const [after] = await getDb().select().from(estimateLines).where(eq(estimateLines.id, moldboard.id));
    expect(after).toMatchObject({ state: "proposed", version: moldboard.version });
    // The trustee, with a higher limit, can approve it.
    const trustee = await call<{ line: Line }>(decideOne, { path: `/api/v1/lines/${moldboard.id}/decision`, params: { id: moldboard.id }, as: "trustee@brennan-twp.example", body: { decision: "approve", expectedVersion: moldboard.version } });
    expect(trustee.status).toBe(200);
  });

  it("refuses stale versions and lines not waiting on a decision", async () => {
    const wo = await workOrderByNumber(1042);
    const rod = await lineByDescription(wo.id, "Tie-rod end");
    const stale = await call(decideOne, { path: `/api/v1/lines/${rod.id}/decision`, params: { id: rod.id }, as: SUPERVISOR, body: { decision: "approve", expectedVersion: rod.version - 1 } });
    expect(stale.status).toBe(409);
    expect(stale.body.code).toBe("stale_version");
    const diag = await lineByDescription(wo.id, "Diagnose plow drift");
    const done = await call(decideOne, { path: `/api/v1/lines/${diag.id}/decision`, params: { id: diag.id }, as: SUPERVISOR, body: { decision: "decline", expectedVersion: diag.version } });
    expect(done.status).toBe(409);
    expect(done.body.code).toBe("not_pending");
  });

  it("is 403 for clerk and viewer, 404 for another account's approver, 401 for nobody", async () => {
    const wo = await workOrderByNumber(1042);
    const rod = await lineByDescription(wo.id, "Tie-rod end");
    const body = { decision: "approve", expectedVersion: rod.version };
    for (const email of ["clerk@brennan-twp.example", "foreman@brennan-twp.example", "writer@quarry-road.example"]) {
      const res = await call(decideOne, { path: `/api/v1/lines/${rod.id}/decision`, params: { id: rod.id }, as: email, body });
      expect(res.status, email).toBe(403);
      expect(res.body.code).toBe("forbidden");
    }
    const other = await call(decideOne, { path: `/api/v1/lines/${rod.id}/decision`, params: { id: rod.id }, as: "office@kettle-ridge.example", body });
    expect(other.status).toBe(404);
    expect((await call(decideOne, { path: `/api/v1/lines/${rod.id}/decision`, params: { id: rod.id }, body })).status).toBe(401);
  });

  it("answers bad bodies with 400 field errors and changes nothing", async () => {
    const wo = await workOrderByNumber(1042);
    const rod = await lineByDescription(wo.id, "Tie-rod end");
    const before = await linesOf(wo.id);
    const bad: unknown[] = ["{oops", { decision: "maybe", expectedVersion: 1 }, { decision: "approve" }, { decision: "approve", expectedVersion: "two" }, []];
    for (const body of bad) {
      const res = await call(decideOne, { path: `/api/v1/lines/${rod.id}/decision`, params: { id: rod.id }, as: SUPERVISOR, body: typeof body === "string" ? body : body });
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(["invalid_input", "malformed_json"]).toContain(res.body.code);
    }
    const missing = await call(decideOne, { path: `/api/v1/lines/${rod.id}/decision`, params: { id: rod.id }, as: SUPERVISOR, body: { decision: "maybe" } });
    expect(missing.body.errors?.map((e) => e.path).sort()).toEqual(["decision", "expectedVersion"]);
    expect(await linesOf(wo.id)).toEqual(before);
  });
});

describe("POST /api/v1/work-orders/:id/decisions (all or none)", () => {
  it("writes nothing when one decision in the batch is refused", async () => {
    const wo = await workOrderByNumber(1044);
    const slack = await lineByDescription(wo.id, "slack adjuster, adjust");
    const part = await lineByDescription(wo.id, "Automatic slack adjuster");
    const shoes = await lineByDescription(wo.id, "shoes and drums");
    const before = await linesOf(wo.id);
    const res = await call<Problem>(decideBatch, {
      path: `/api/v1/work-orders/${wo.id}/decisions`,
      params: { id: wo.id },
      as: "transport@alder-falls-schools.example",
      body: { decisions: [slack, part, shoes].map((l) => ({ lineId: l.id, decision: "approve", expectedVersion: l.version })) },
    });
    // The school district has $1,100–$1,600 of budget left this fiscal year (demo data):
    // $213.75 + $164.20 fit, the $1,880.00 brake shoes do not.
    expect(res.status).toBe(409);
    expect(res.body.code).toBe("budget_exceeded");
    expect(res.body.detail).toMatch(/repair budget/);
    expect(await linesOf(wo.id)).toEqual(before);

    const ok = await call<{ lines: { id: string; state: string }[]; totals: Record<string, number> }>(decideBatch, {
      path: `/api/v1/work-orders/${wo.id}/decisions`,
      params: { id: wo.id },
      as: "transport@alder-falls-schools.example",
      body: { decisions: [slack, part].map((l) => ({ lineId: l.id, decision: "approve", expectedVersion: l.version })).concat([{ lineId: shoes.id, decision: "hold", expectedVersion: shoes.version }]) },
    });
    expect(ok.status).toBe(200);
    expect(ok.body.lines.map((l) => l.state)).toEqual(["approved", "approved", "held"]);
    // $77.50 standing diagnosis + $213.75 + $164.20 approved.
    expect(ok.body.totals.approvedCents).toBe(7_750 + 21_375 + 16_420);
    expect(ok.body.totals.heldCents).toBe(188_000);
  });
});

describe("repair budget used (the count the decision path checks)", () => {
  it("an approved credit makes no room in the budget", async () => {
    // Credits count as zero against limits: the shop may withdraw one later
    // (lib/estimate countedCents); the unit test shows the signing-limit side.
    const wo = await workOrderByNumber(1042);
    const remaining = async () =>
      (await call<Detail>(getWorkOrder, { path: `/api/v1/work-orders/${wo.id}`, params: { id: wo.id }, as: SUPERVISOR })).body.limits.budgetRemainingCents;
    const before = await remaining();
    expect(typeof before).toBe("number");
    const line = (await linesOf(wo.id)).find((l) => l.state === "proposed")!;
    await getDb()
      .update(estimateLines)
      .set({ state: "approved", unitPriceCents: -50_000, approvedAmountCents: -50_000, byStanding: true, approvedAt: new Date().toISOString() })
      .where(eq(estimateLines.id, line.id));
    expect(await remaining()).toBe(before);
  });
});
