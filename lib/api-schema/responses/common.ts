import { z } from "zod";
import { DECISIONS, LINE_KINDS, LINE_STATES, METER_KINDS, ROLES, SEVERITIES, VERDICTS, WORK_ORDER_STATUSES } from "@/lib/domain";
import { PROBLEM_CODES } from "../problem-codes";
import { cents, id, instant, named } from "../components";

export const role = named("Role", z.enum(ROLES));
export const workOrderStatus = named("WorkOrderStatus", z.enum(WORK_ORDER_STATUSES));
export const lineKind = named("LineKind", z.enum(LINE_KINDS));
export const lineState = named("LineState", z.enum(LINE_STATES));
export const decisionValue = named("Decision", z.enum(DECISIONS));
export const severity = named("Severity", z.enum(SEVERITIES));
export const verdict = named("Verdict", z.enum(VERDICTS));
export const meterKind = named("MeterKind", z.enum(METER_KINDS));
export const problemCode = named("ProblemCode", z.enum(PROBLEM_CODES), "A stable code; new codes may be added, none renamed.");

/** RFC 9457; a refusal may carry more members (`lineId`, `amounts`, `workOrderId`, `href`, …). */
export const problem = named(
  "Problem",
  z.looseObject({
    type: z.string(),
    title: z.string(),
    status: z.number().int(),
    detail: z.string(),
    code: problemCode,
    errors: z
      .array(z.looseObject({ path: z.string(), message: z.string(), row: z.number().int().optional(), field: z.string().optional() }))
      .optional()
      .describe("Field problems, for `invalid_input`."),
  }),
  "An RFC 9457 problem document (application/problem+json).",
);

export const totals = named(
  "Totals",
  z.object({
    approvedCents: cents,
    pendingCents: cents,
    declinedCents: cents,
    heldCents: cents,
    shopSuppliesCents: cents,
    taxCents: cents,
    grandTotalCents: cents.describe("Approved lines + shop supplies + tax on them."),
  }),
);

export const photoRef = named("PhotoRef", z.object({ id, name: z.string(), url: z.string(), thumbUrl: z.string(), width: z.number().int().nullable(), height: z.number().int().nullable() }));

export const reading = named(
  "Reading",
  z.object({
    id,
    kind: z.string(),
    location: z.string(),
    value: z.number(),
    unit: z.string(),
    verdict,
    limit: z.string(),
    limitValue: z.number().nullable(),
    source: z.string(),
    sourceKind: z.string(),
    note: z.string(),
    input: z.unknown().describe("The values as typed, per reading kind."),
  }),
);

export const finding = named(
  "Finding",
  z.object({
    id,
    concernId: id.nullable(),
    title: z.string(),
    severity,
    noteMarkdown: z.string(),
    createdAt: instant,
    createdBy: z.string().nullable(),
    photos: z.array(photoRef),
    readings: z.array(reading),
  }),
);

export const timelineEntry = named("TimelineEntry", z.object({ id, status: workOrderStatus, note: z.string(), at: instant, by: z.string().nullable() }));

export const meterReading = named(
  "MeterReading",
  z.object({
    id,
    unitId: id,
    workOrderId: id.nullable(),
    kind: meterKind,
    value: z.number(),
    meterReplaced: z.boolean(),
    readAt: instant,
    note: z.string(),
    recordedBy: id.nullable(),
    createdAt: instant,
  }),
);

export const decisionRecord = z.object({ by: z.string(), at: instant, decision: decisionValue, amountCents: cents, note: z.string() });
