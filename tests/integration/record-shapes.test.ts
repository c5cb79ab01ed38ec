// One shape per record on the way out (issue 12): the decision route answers
// with the same estimate line the work-order view shows after it, field for
// field; a unit's deferred lines and past visits carry the same fields as the
// detail's lines and the work-order list; an invoice in the list is its detail's
// own fields (lib/records/invoice.ts).
import { describe, expect, it } from "vitest";
import { POST as decideOne } from "@/app/api/v1/lines/[id]/decision/route";
import { GET as getInvoice } from "@/app/api/v1/invoices/[id]/route";
import { GET as listInvoices } from "@/app/api/v1/invoices/route";
import { GET as getUnit } from "@/app/api/v1/units/[id]/route";
import { GET as getWorkOrder } from "@/app/api/v1/work-orders/[id]/route";
import { POST as decideBatch } from "@/app/api/v1/work-orders/[id]/decisions/route";
import { GET as listWorkOrders } from "@/app/api/v1/work-orders/route";
import { call } from "./helpers/app";
import { lineByDescription, workOrderByNumber } from "./helpers/work-orders";

const SUPERVISOR = "supervisor@brennan-twp.example";
type Line = Record<string, unknown> & { id: string };

describe("one shape per record", () => {
  it("answers a decision with the line exactly as the work order then shows it", async () => {
    const wo = await workOrderByNumber(1042);
    const seal = await lineByDescription(wo.id, "seal kit");
    const decided = await call<{ line: Line }>(decideOne, {
      path: `/api/v1/lines/${seal.id}/decision`,
      params: { id: seal.id },
      as: SUPERVISOR,
      body: { decision: "approve", expectedVersion: seal.version, note: "Go ahead." },
    });
    expect(decided.status).toBe(200);
    const view = await call<{ lines: Line[] }>(getWorkOrder, { path: `/api/v1/work-orders/${wo.id}`, params: { id: wo.id }, as: SUPERVISOR });
    expect(decided.body.line).toEqual(view.body.lines.find((l) => l.id === seal.id));
    // api-v1.md's fields are all there.
    expect(Object.keys(decided.body.line)).toEqual(expect.arrayContaining(["id", "kind", "description", "quantity", "unitPriceCents", "amountCents", "taxable", "coreChargeCents", "state", "version", "findingId", "decision"]));
    expect(decided.body.line.decision).toEqual({ by: "Gary Holm", at: expect.any(String), decision: "approve", amountCents: 18_640, note: "Go ahead.", lineVersion: seal.version });
  });

  it("answers a batch of decisions with each line in the same shape, beside the fields the batch route always gave", async () => {
    const wo = await workOrderByNumber(1042);
    const inspection = await lineByDescription(wo.id, "Annual inspection");
    const res = await call<{ lines: (Record<string, unknown> & { line: Line })[] }>(decideBatch, {
      path: `/api/v1/work-orders/${wo.id}/decisions`,
      params: { id: wo.id },
      as: SUPERVISOR,
      body: { decisions: [{ lineId: inspection.id, decision: "decline", expectedVersion: inspection.version }] },
    });
    expect(res.status).toBe(200);
    expect(res.body.lines[0]).toMatchObject({ id: inspection.id, state: "declined", version: inspection.version + 1, decision: "decline" });
    const view = await call<{ lines: Line[] }>(getWorkOrder, { path: `/api/v1/work-orders/${wo.id}`, params: { id: wo.id }, as: SUPERVISOR });
    expect(res.body.lines[0]!.line).toEqual(view.body.lines.find((l) => l.id === inspection.id));
  });

  it("gives a unit's deferred lines and past visits the fields of the detail's lines and of the list", async () => {
    const wo = await workOrderByNumber(1042);
    // A held line is deferred work of the unit.
    const align = await lineByDescription(wo.id, "alignment");
    expect((await call(decideOne, { path: `/api/v1/lines/${align.id}/decision`, params: { id: align.id }, as: SUPERVISOR, body: { decision: "hold", expectedVersion: align.version } })).status).toBe(200);
    const view = await call<{ lines: Line[]; unitId: string }>(getWorkOrder, { path: `/api/v1/work-orders/${wo.id}`, params: { id: wo.id }, as: SUPERVISOR });
    const unit = await call<{ deferredLines: Line[]; workOrders: Line[] }>(getUnit, { path: `/api/v1/units/${view.body.unitId}`, params: { id: view.body.unitId }, as: SUPERVISOR });
    expect(unit.status).toBe(200);
    const lineKeys = Object.keys(view.body.lines[0]!).filter((k) => k !== "decision").sort();
    expect(unit.body.deferredLines.map((l) => l.id)).toContain(align.id);
    for (const l of unit.body.deferredLines) expect(Object.keys(l).filter((k) => k !== "workOrderId" && k !== "updatedAt").sort()).toEqual(lineKeys);
    const list = await call<{ workOrders: Line[] }>(listWorkOrders, { path: "/api/v1/work-orders?all=true", as: SUPERVISOR });
    const listed = list.body.workOrders.find((w) => w.id === wo.id)!;
    const past = unit.body.workOrders.find((w) => w.id === wo.id)!;
    for (const key of ["id", "number", "label", "unitId", "accountId", "status", "title", "promisedAt", "updatedAt"]) expect(past[key]).toEqual(listed[key]);
  });

  it("gives each invoice in the list the fields of its detail, with the same values", async () => {
    const list = await call<{ invoices: Line[] }>(listInvoices, { path: "/api/v1/invoices?limit=100", as: SUPERVISOR });
    expect(list.status).toBe(200);
    // The demo has open, part-paid, paid and void invoices for the account (demo-invoices.test.ts).
    expect(new Set(list.body.invoices.map((i) => i.paymentState)).size).toBeGreaterThanOrEqual(3);
    for (const listed of list.body.invoices) {
      const detail = await call<Line>(getInvoice, { path: `/api/v1/invoices/${listed.id}`, params: { id: listed.id }, as: SUPERVISOR });
      expect(detail.status).toBe(200);
      const { unitNumber: _unitNumber, ...own } = listed;
      expect(detail.body).toMatchObject(own);
    }
  });
});
