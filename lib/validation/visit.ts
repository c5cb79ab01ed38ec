import { z } from "zod";
import { localDateTimeIso } from "@/lib/dates";
import { DEFAULT_TIME_ZONE } from "@/lib/format";

const id = z.string().min(1).max(64);
const blank = (v: unknown) => (v === "" ? undefined : v);
const reading = (label: string) =>
  z.preprocess((v) => {
    const b = blank(typeof v === "string" ? v.trim().replace(/,/g, "") : v);
    return typeof b === "string" ? Number(b) : b;
  }, z.number({ error: `${label} is a number.` }).finite().min(0, "A reading cannot be negative.").max(9_999_999).optional());

export const complaint = z.string().trim().min(1, "Write what the customer says is wrong.").max(1000);

/**
 * A promised-by time: an ISO instant from the API, or the wall-clock time a
 * person typed in a form (in the shop's time zone). Null clears it.
 */
const promisedAt = z.preprocess(
  (v) => {
    if (v === "" || v === null) return null;
    if (typeof v === "string" && /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/.test(v)) return localDateTimeIso(v, DEFAULT_TIME_ZONE) ?? v;
    return v;
  },
  z.iso.datetime({ offset: true, error: "Give the promised-by date and time." }).nullable().optional(),
);

const idList = z.preprocess((v) => (v === undefined ? [] : Array.isArray(v) ? v : [v]), z.array(id).max(100));

/** POST /api/v1/work-orders: a unit checked in. From a form, complaints come as repeated `complaint` fields. */
export const checkInInput = z.preprocess(
  (raw) => {
    if (!raw || typeof raw !== "object" || "concerns" in raw) return raw;
    const r = raw as Record<string, unknown>;
    const list = r.complaint === undefined ? [] : Array.isArray(r.complaint) ? r.complaint : [r.complaint];
    return { ...r, concerns: list.filter((c) => typeof c === "string" && c.trim() !== "").map((c) => ({ complaint: c })) };
  },
  z.object({
    unitId: id,
    concerns: z.array(z.object({ complaint })).max(30).default([]),
    assignedTechId: z.preprocess(blank, id.optional()),
    promisedAt,
    poNumber: z.preprocess(blank, z.string().trim().max(60).optional()),
    odometer: reading("The odometer"),
    engineHours: reading("Engine hours"),
    bringBackLineIds: idList.default([]),
    serviceRequestId: z.preprocess(blank, id.optional()),
    title: z.preprocess(blank, z.string().trim().max(160).optional()),
  }),
);
export type CheckInInput = z.output<typeof checkInInput>;

/** PATCH /api/v1/work-orders/:id: each change is a dated entry on the fleet's timeline. */
export const visitPatchInput = z
  .object({
    assignedTechId: z.preprocess((v) => (v === "" ? null : v), id.nullable().optional()),
    promisedAt,
    poNumber: z.preprocess((v) => (v === "" ? null : v), z.string().trim().max(60).nullable().optional()),
  })
  .strict();
export type VisitPatchInput = z.output<typeof visitPatchInput>;
export const visitFormInput = z.object({ workOrderId: id, assignedTechId: z.string().max(64).default(""), promisedAt: z.string().max(40).default(""), poNumber: z.string().max(60).default("") });

export const concernAddInput = z.object({ complaint });
export const concernPatchInput = z
  .object({ cause: z.string().trim().max(2000).optional(), correction: z.string().trim().max(2000).optional() })
  .strict()
  .refine((v) => v.cause !== undefined || v.correction !== undefined, "Send a cause, a correction or both.");
export const concernFormInput = z.object({ concernId: id, cause: z.string().trim().max(2000).default(""), correction: z.string().trim().max(2000).default("") });
