// The records' one shapes on the way out (lib/records) and the schemas the API
// description gives them (lib/api-schema) are the same shape: the types are
// compared by tsc (expectTypeOf), the values by the document's JSON Schema.
import { describe, expect, expectTypeOf, it } from "vitest";
import type { z } from "zod";
import { buildOpenApiDocument } from "@/lib/api-schema/document";
import type { invoiceFields } from "@/lib/api-schema/responses/accounts";
import type { deferredLine } from "@/lib/api-schema/responses/units";
import type { estimateLine, lineDecision, workOrderFields } from "@/lib/api-schema/responses/work-orders";
import { decisionOut, lineFieldsOut, lineOut, type DecisionOut, type LineFields, type LineOut } from "@/lib/records/estimate-line";
import { invoiceOut, type InvoiceOut } from "@/lib/records/invoice";
import { workOrderOut, type WorkOrderOut } from "@/lib/records/work-order";
import { responseChecker } from "@/tests/support/openapi-responses";

const line: LineFields = {
  id: "ln_1",
  kind: "part",
  description: "Slack adjuster, right rear",
  quantityMilli: 2000,
  unitPriceCents: 6450,
  taxable: true,
  coreChargeCents: 1500,
  coreReturnedAt: null,
  state: "approved",
  version: 3,
  findingId: "fd_1",
  concernId: null,
  partNumber: "SA-220",
  isDiagnosis: false,
  byStanding: false,
  reopenReason: null,
  deferredFromLineId: null,
  extendsLineId: null,
};
const decision = decisionOut("Dana Approver", "2026-03-02T15:04:05.000Z", { decision: "approve", amountCents: 12900, note: null, lineVersion: 2 });

describe("the records' shapes and their schemas", () => {
  it("are the same types", () => {
    expectTypeOf<LineOut>().toEqualTypeOf<z.output<typeof estimateLine>>();
    expectTypeOf<DecisionOut>().toEqualTypeOf<z.output<typeof lineDecision>>();
    expectTypeOf<WorkOrderOut>().toEqualTypeOf<z.output<typeof workOrderFields>>();
    expectTypeOf<InvoiceOut>().toEqualTypeOf<z.output<typeof invoiceFields>>();
    type Deferred = ReturnType<typeof lineFieldsOut> & { workOrderId: string; updatedAt: string };
    expectTypeOf<{ [K in keyof Deferred]: Deferred[K] }>().toEqualTypeOf<z.output<typeof deferredLine>>();
  });

  const checker = responseChecker(buildOpenApiDocument());

  it("an estimate line from lineOut is an EstimateLine of the document, with or without its decision", () => {
    const validate = checker.component("EstimateLine");
    expect(validate(lineOut(line, decision)), JSON.stringify(validate.errors)).toBe(true);
    expect(validate(lineOut(line, null)), JSON.stringify(validate.errors)).toBe(true);
    // and the schema is not so loose that anything passes
    expect(validate({ ...lineOut(line, null), surprise: 1 })).toBe(false);
    expect(validate({ ...lineOut(line, null), amountCents: 12.5 })).toBe(false);
  });

  it("a work order from workOrderOut has every field the document's work orders start with", () => {
    const out = workOrderOut({ id: "wo_1", number: 1042, unitId: "un_1", accountId: "ac_1", status: "repairing", title: "Brakes", promisedAt: null, updatedAt: "2026-03-02T15:04:05.000Z" });
    const moved = { ...out, releasedAt: null, lastNote: "", event: { id: "ev_1", status: "repairing", note: "", at: out.updatedAt, by: "Sam" } };
    const validate = checker.component("MovedWorkOrder");
    expect(validate(moved), JSON.stringify(validate.errors)).toBe(true);
    expect(out.label).toBe("W-1042");
  });

  it("an invoice from invoiceOut, with the list's unit number, is an InvoiceSummary of the document", () => {
    const out = invoiceOut({
      id: "in_1",
      number: 2031,
      accountId: "ac_1",
      accountName: "Brennan Township",
      workOrderId: "wo_1",
      workOrderNumber: 1042,
      status: "open",
      issuedAt: "2026-03-02T15:04:05.000Z",
      dueOn: "2026-04-01",
      poNumber: null,
      totalCents: 10_000,
      paidCents: 2_500,
      creditedCents: 0,
    });
    const validate = checker.component("InvoiceSummary");
    expect(validate({ ...out, unitNumber: "T-14" }), JSON.stringify(validate.errors)).toBe(true);
    expect(validate(out)).toBe(false);
  });
});
