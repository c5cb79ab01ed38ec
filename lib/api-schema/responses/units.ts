import { z } from "zod";
import { INSPECTION_BASES, SERVICE_REQUEST_STATUSES } from "@/lib/domain";
import { SYMPTOMS } from "@/lib/occurrences/symptoms";
import { calendarDate, id, instant, named, nextCursor } from "../components";
import { finding, meterKind, timelineEntry, workOrderStatus } from "./common";
import { estimateLineFields, workOrderFields } from "./work-orders";

const inspectionBasis = z.enum(INSPECTION_BASES).nullable();

export const unitSummary = named(
  "UnitSummary",
  z.object({
    id,
    unitNumber: z.string(),
    vin: z.string().nullable(),
    serialNumber: z.string().nullable(),
    year: z.number().int().nullable(),
    plate: z.string(),
    description: z.string(),
    accountId: id,
    accountName: z.string(),
    retired: z.boolean(),
    status: workOrderStatus.nullable().describe("The open work order's status; null when the unit is not in the shop."),
    workOrderId: id.nullable(),
    workOrderNumber: z.number().int().nullable(),
    updatedAt: instant,
  }),
);

export const unitList = named("UnitList", z.object({ units: z.array(unitSummary), nextCursor }));

/** The fields of a unit both the stored record and the detail carry. */
const unitFields = {
  id,
  accountId: id,
  unitNumber: z.string(),
  vin: z.string().nullable(),
  serialOnly: z.boolean(),
  serialNumber: z.string().nullable(),
  year: z.number().int().nullable(),
  description: z.string(),
  plate: z.string(),
  lastInspectionOn: calendarDate.nullable(),
  inspectionBasis,
  inspectionDueOn: calendarDate.nullable(),
  keyOffDrainLimitMa: z.number().nullable(),
  retiredAt: instant.nullable(),
  updatedAt: instant,
};

/** The unit as stored: what POST and PATCH answer. */
export const unitRecord = named("Unit", z.object({ ...unitFields, notes: z.string(), createdAt: instant }));

/** A past or current visit in a unit's history: the work order's own fields and when it came and went. */
const visitSummary = workOrderFields.extend({
  openedAt: instant,
  releasedAt: instant.nullable(),
  technicianName: z.string().nullable(),
});

export const deferredLine = named(
  "DeferredLine",
  estimateLineFields.extend({ workOrderId: id, updatedAt: instant }),
  "A held or declined line of an earlier visit, to bring back: the fields of an estimate line, its work order and when it last changed.",
);

export const unitDetail = named(
  "UnitDetail",
  z.object({
    ...unitFields,
    accountName: z.string(),
    status: workOrderStatus.nullable(),
    workOrderId: id.nullable(),
    meterReadings: z.array(z.object({ id, kind: meterKind, value: z.number(), meterReplaced: z.boolean(), readAt: instant, note: z.string() })),
    deferredLines: z.array(deferredLine),
    workOrders: z.array(visitSummary),
  }),
);

export const currentVisit = named(
  "CurrentVisit",
  z.object({
    unitId: id,
    workOrder: z
      .object({
        id,
        number: z.number().int(),
        label: z.string(),
        status: workOrderStatus,
        title: z.string(),
        promisedAt: instant.nullable(),
        updatedAt: instant,
        lastNote: z.string(),
        lastNoteAt: instant.nullable(),
      })
      .nullable()
      .describe("Null when the unit is not in the shop."),
    timeline: z.array(timelineEntry),
    findings: z.array(finding),
  }),
);

export const importResult = named("UnitImportResult", z.object({ imported: z.number().int() }));

export const occurrence = named(
  "Occurrence",
  z.object({
    id,
    unitId: id,
    concernId: id.nullable(),
    occurredAt: instant,
    hoursParked: z.number().nullable(),
    ambientC: z.number().nullable(),
    symptom: z.enum(SYMPTOMS),
    symptomText: z.string(),
    batteryVolts: z.number().nullable(),
    recovered: z.boolean().nullable(),
    note: z.string(),
    createdAt: instant,
    updatedAt: instant,
    createdBy: z.object({ id, name: z.string() }).nullable(),
    photo: z.object({ id, url: z.string(), thumbUrl: z.string() }).nullable(),
    canEdit: z.boolean().describe("Whether the caller may correct this entry."),
  }),
);

export const occurrenceList = named(
  "OccurrenceList",
  z.object({
    unit: z.object({ id, unitNumber: z.string() }),
    occurrences: z.array(occurrence),
    nextCursor,
    concerns: z.array(
      z.object({
        id,
        unitId: id,
        workOrderId: id.nullable(),
        workOrderNumber: z.number().int().nullable(),
        complaint: z.string(),
        intermittent: z.boolean(),
        recordHint: z.string(),
        closedAt: instant.nullable(),
        conclusion: z.string(),
        createdAt: instant,
      }),
    ),
  }),
);

const serviceRequestStatus = z.enum(SERVICE_REQUEST_STATUSES);

export const serviceRequestRecord = named(
  "ServiceRequest",
  z.object({
    id,
    accountId: id,
    unitId: id,
    status: serviceRequestStatus,
    workOrderId: id.nullable(),
    note: z.string(),
    odometer: z.number().nullable(),
    engineHours: z.number().nullable(),
    reportedBy: id.nullable(),
    reporterName: z.string(),
    scheduledAt: instant.nullable(),
    closedAt: instant.nullable(),
    createdAt: instant,
    updatedAt: instant,
  }),
);

export const serviceRequestSummary = named(
  "ServiceRequestSummary",
  z.object({
    id,
    accountId: id,
    accountName: z.string(),
    unitId: id,
    unitNumber: z.string(),
    unitDescription: z.string(),
    status: serviceRequestStatus,
    reporterName: z.string(),
    odometer: z.number().nullable(),
    engineHours: z.number().nullable(),
    note: z.string(),
    workOrderId: id.nullable(),
    workOrderNumber: z.number().int().nullable(),
    workOrderLabel: z.string().nullable(),
    outOfService: z.boolean(),
    defects: z.array(z.object({ area: z.string(), description: z.string(), outOfService: z.boolean() })),
    photos: z.array(z.object({ url: z.string(), thumbUrl: z.string() })),
    createdAt: instant,
    scheduledAt: instant.nullable(),
    closedAt: instant.nullable(),
  }),
);

export const serviceRequestList = named("ServiceRequestList", z.object({ serviceRequests: z.array(serviceRequestSummary), nextCursor }));
