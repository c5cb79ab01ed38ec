import { z } from "zod";
import { cents, id, instant, named, nextCursor } from "../components";
import { decisionRecord, decisionValue, finding, lineKind, lineState, timelineEntry, totals, workOrderStatus } from "./common";

/**
 * An estimate line's own fields: what `lineFieldsOut` (lib/records/estimate-line.ts)
 * answers, held to it by tests/unit/api/record-shapes.test.ts.
 */
export const estimateLineFields = z.object({
  id,
  kind: lineKind,
  description: z.string(),
  quantity: z.number().describe("Hours for labour (one decimal), pieces otherwise."),
  unitPriceCents: cents,
  amountCents: cents.describe("Quantity × unit price; the core charge apart."),
  taxable: z.boolean(),
  coreChargeCents: cents,
  coreTotalCents: cents.describe("What the core costs if it does not come back."),
  coreReturnedAt: instant.nullable(),
  state: lineState,
  version: z.number().int().describe("Send as `expectedVersion` with a decision."),
  findingId: id.nullable(),
  concernId: id.nullable(),
  partNumber: z.string(),
  isDiagnosis: z.boolean(),
  byStanding: z.boolean().describe("Approved under the account's standing authorisation."),
  reopenReason: z.string().nullable(),
  deferredFromLineId: id.nullable(),
  extendsLineId: id.nullable(),
});

/** The latest decision on a line: `decisionOut` (lib/records/estimate-line.ts). */
export const lineDecision = named("LineDecision", decisionRecord.extend({ lineVersion: z.number().int().describe("The line's version the decision was made on.") }));

/** An estimate line, the one shape every route answers it in (`lineOut`): api-v1.md "Work order detail" `lines[]`, plus fields added since. */
export const estimateLine = named("EstimateLine", estimateLineFields.extend({ decision: lineDecision.nullable() }));

/** A work order's own fields: what `workOrderOut` (lib/records/work-order.ts) answers; every answer about one carries them. */
export const workOrderFields = z.object({
  id,
  number: z.number().int(),
  label: z.string().describe('As people read it: "W-" and the number.'),
  unitId: id,
  accountId: id,
  status: workOrderStatus,
  title: z.string(),
  promisedAt: instant.nullable(),
  updatedAt: instant,
});

export const limits = named(
  "Limits",
  z.object({
    standingAuthorisationCents: cents,
    signingLimitCents: cents.nullable().describe("The caller's own; null for staff."),
    signingUsedCents: cents.nullable().describe("The caller's approvals on this work order; null for staff."),
    budgetCents: cents.nullable(),
    budgetRemainingCents: cents.nullable(),
    budgetUsedCents: cents,
    fiscalYear: z.string(),
    overrunPercent: z.number(),
    overrunCapCents: cents.nullable(),
  }),
);

export const concern = named(
  "Concern",
  z.object({
    id,
    position: z.number().int(),
    complaint: z.string(),
    cause: z.string(),
    correction: z.string(),
    intermittent: z.boolean(),
    recordHint: z.string(),
    closedAt: instant.nullable(),
    conclusion: z.string(),
  }),
);

export const workOrderDetail = named(
  "WorkOrderDetail",
  workOrderFields.extend({
    poNumber: z.string().nullable(),
    unitNumber: z.string(),
    unitDescription: z.string(),
    accountName: z.string(),
    technicianName: z.string().nullable(),
    clockedTechName: z.string().nullable(),
    assignedTechId: id.nullable(),
    timeline: z.array(timelineEntry),
    concerns: z.array(concern),
    findings: z.array(finding),
    lines: z.array(estimateLine),
    totals,
    estimateTotals: z.object({ ifAllPendingApprovedCents: cents, coreCents: cents, draftCents: cents }),
    limits,
    decisionLog: z.array(
      z.object({ lineId: id, decision: decisionValue, by: z.string(), at: instant, amountCents: cents, lineVersion: z.number().int(), note: z.string() }),
    ),
  }),
);

export const workOrderSummary = named(
  "WorkOrderSummary",
  workOrderFields.extend({
    openedAt: instant,
    releasedAt: instant.nullable(),
    unitNumber: z.string(),
    unitDescription: z.string(),
    accountName: z.string(),
    technicianId: id.nullable(),
    technicianName: z.string().nullable(),
    clockedTechName: z.string().nullable(),
    lastNote: z.string(),
    outOfService: z.boolean(),
  }),
);

export const workOrderList = named("WorkOrderList", z.object({ workOrders: z.array(workOrderSummary), nextCursor }));

export const checkedInWorkOrder = named(
  "CheckedInWorkOrder",
  workOrderFields.extend({
    assignedTechId: id.nullable(),
    poNumber: z.string().nullable(),
    openedAt: instant,
    concerns: z.array(z.object({ complaint: z.string() })),
    serviceRequestId: id.nullable(),
  }),
);

export const movedWorkOrder = named(
  "MovedWorkOrder",
  workOrderFields.extend({
    releasedAt: instant.nullable(),
    lastNote: z.string(),
    event: timelineEntry.extend({ by: z.string() }),
  }),
);

export const lineDecisionResult = named("LineDecisionResult", z.object({ line: estimateLine, totals }));

export const batchDecisionResult = named(
  "BatchDecisionResult",
  z.object({
    lines: z.array(
      z.object({
        id,
        state: lineState,
        version: z.number().int(),
        decision: decisionValue,
        amountCents: cents,
        line: estimateLine,
      }),
    ),
    totals,
  }),
);

export const addedConcern = named("AddedConcern", z.object({ id, complaint: z.string(), cause: z.string(), correction: z.string(), position: z.number().int() }));

export const updatedConcern = named(
  "UpdatedConcern",
  z.object({ id, workOrderId: id.nullable(), cause: z.string(), correction: z.string(), changed: z.number().int().describe("How many fields changed.") }),
);

export const workOrderFindings = named("WorkOrderFindings", z.object({ workOrderId: id, findings: z.array(finding) }));
export const createdFinding = named("CreatedFinding", z.object({ ...finding.shape, workOrderId: id, proposedLineIds: z.array(id) }));
export const findingWithWorkOrder = named("FindingDetail", z.object({ ...finding.shape, workOrderId: id }));
