import { z } from "zod";
import { cents, id, instant, named, nextCursor } from "../components";
import { decisionRecord, decisionValue, finding, lineKind, lineState, timelineEntry, totals, workOrderStatus } from "./common";

/** An estimate line as the work order shows it: api-v1.md "Work order detail" `lines[]`, plus fields added since. */
export const estimateLine = named(
  "EstimateLine",
  z.object({
    id,
    kind: lineKind,
    description: z.string(),
    quantity: z.number().describe("Hours for labour (one decimal), pieces otherwise."),
    unitPriceCents: cents,
    amountCents: cents,
    taxable: z.boolean(),
    coreChargeCents: cents,
    coreTotalCents: cents,
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
    decision: decisionRecord.extend({ lineVersion: z.number().int() }).nullable(),
  }),
);

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
  z.object({
    id,
    number: z.number().int(),
    label: z.string(),
    unitId: id,
    accountId: id,
    status: workOrderStatus,
    promisedAt: instant.nullable(),
    updatedAt: instant,
    title: z.string(),
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
  z.object({
    id,
    number: z.number().int(),
    label: z.string(),
    unitId: id,
    accountId: id,
    status: workOrderStatus,
    promisedAt: instant.nullable(),
    openedAt: instant,
    releasedAt: instant.nullable(),
    updatedAt: instant,
    title: z.string(),
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

/** The work-order row as it is stored (check-in answers it). */
const workOrderRecord = {
  id,
  number: z.number().int(),
  unitId: id,
  accountId: id,
  status: workOrderStatus,
  title: z.string(),
  assignedTechId: id.nullable(),
  promisedAt: instant.nullable(),
  poNumber: z.string().nullable(),
  openedAt: instant,
  sentForApprovalAt: instant.nullable(),
  releasedAt: instant.nullable(),
  createdBy: id.nullable(),
  createdAt: instant,
  updatedAt: instant,
};

export const checkedInWorkOrder = named(
  "CheckedInWorkOrder",
  z.object({ ...workOrderRecord, label: z.string(), concerns: z.array(z.object({ complaint: z.string() })), serviceRequestId: id.nullable() }),
);

export const movedWorkOrder = named(
  "MovedWorkOrder",
  z.object({
    id,
    number: z.number().int(),
    unitId: id,
    accountId: id,
    status: workOrderStatus,
    title: z.string(),
    promisedAt: instant.nullable(),
    releasedAt: instant.nullable(),
    updatedAt: instant,
    lastNote: z.string(),
    event: timelineEntry.extend({ by: z.string() }),
  }),
);

/**
 * The line `POST /lines/:id/decision` answers: the contract's fields of a line
 * (api-v1.md "Work order detail"). It is open to more members because the
 * route builds its own, smaller shape today; issue 12's one mapper answers
 * the whole EstimateLine here.
 */
export const decidedLine = named(
  "DecidedLine",
  z.looseObject({
    id,
    kind: lineKind,
    description: z.string(),
    quantity: z.number(),
    unitPriceCents: cents,
    amountCents: cents,
    taxable: z.boolean(),
    coreChargeCents: cents,
    state: lineState,
    version: z.number().int(),
    findingId: id.nullable(),
    decision: decisionRecord.nullable(),
  }),
);

export const lineDecisionResult = named("LineDecisionResult", z.object({ line: decidedLine, totals }));

export const batchDecisionResult = named(
  "BatchDecisionResult",
  z.object({
    lines: z.array(z.object({ id, state: lineState, version: z.number().int(), decision: decisionValue, amountCents: cents })),
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
