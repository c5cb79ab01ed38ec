import { z } from "zod";
import { SYMPTOMS } from "@/lib/occurrences/symptoms";
import { AMBIENT_MAX_C, AMBIENT_MAX_F, AMBIENT_MIN_C, AMBIENT_MIN_F, celsiusFromFahrenheit } from "@/lib/occurrences/temperature";

/** A phone's clock may run a little ahead; more than this is a mistake, not skew. */
export const FUTURE_TOLERANCE_MS = 5 * 60_000;
export const MAX_HOURS_PARKED = 8_760;
export const MIN_VOLTS = 0;
export const MAX_VOLTS = 30;
const EARLIEST = Date.parse("2000-01-01T00:00:00Z");

const TEMP_C_MESSAGE = `Outside temperature must be between −60 °C and 60 °C (−76 °F and 140 °F).`;
const TEMP_F_MESSAGE = `Outside temperature must be between −76 °F and 140 °F (−60 °C and 60 °C).`;
const VOLTS_MESSAGE = `Battery voltage must be between ${MIN_VOLTS} V and ${MAX_VOLTS} V.`;

const fields = {
  occurredAt: z.iso.datetime({ offset: true, error: "Give when it happened as a date and time (ISO 8601)." }),
  hoursParked: z
    .number({ error: "Hours parked must be a number." })
    .min(0, "Hours parked cannot be negative.")
    .max(MAX_HOURS_PARKED, "Hours parked must be less than a year (8,760 h).")
    .nullable(),
  ambientC: z.number({ error: "Temperature must be a number." }).min(AMBIENT_MIN_C, TEMP_C_MESSAGE).max(AMBIENT_MAX_C, TEMP_C_MESSAGE).nullable(),
  ambientF: z.number({ error: "Temperature must be a number." }).min(AMBIENT_MIN_F, TEMP_F_MESSAGE).max(AMBIENT_MAX_F, TEMP_F_MESSAGE).nullable(),
  symptom: z.enum(SYMPTOMS, { error: `Choose what it did: one of ${SYMPTOMS.join(", ")}.` }),
  symptomText: z.string({ error: "Must be text." }).trim().max(200, "Keep it under 200 characters."),
  batteryVolts: z.number({ error: "Battery voltage must be a number." }).min(MIN_VOLTS, VOLTS_MESSAGE).max(MAX_VOLTS, VOLTS_MESSAGE).nullable(),
  recovered: z.boolean({ error: "Say true, false or null." }).nullable(),
  note: z.string({ error: "Must be text." }).trim().max(1000, "Keep the note under 1,000 characters."),
  concernId: z.string().min(1).max(64).nullable(),
  // A photo the caller uploaded through the upload route's occurrencePhoto endpoint; null takes it off.
  photoId: z.string({ error: "Give the photo's id as the upload returned it." }).min(1).max(64).nullable(),
};

type Raw = { occurredAt?: string; ambientC?: number | null; ambientF?: number | null; symptom?: string; symptomText?: string };

function refine(clock: () => number) {
  return (value: Raw, ctx: z.RefinementCtx) => {
    if (value.occurredAt !== undefined) {
      const at = Date.parse(value.occurredAt);
      if (at > clock() + FUTURE_TOLERANCE_MS) {
        ctx.addIssue({ code: "custom", path: ["occurredAt"], message: "That time is in the future. Give when it happened." });
      } else if (at < EARLIEST) {
        ctx.addIssue({ code: "custom", path: ["occurredAt"], message: "That date is too far back." });
      }
    }
    if (value.ambientC != null && value.ambientF != null) {
      ctx.addIssue({ code: "custom", path: ["ambientF"], message: "Send the temperature once: ambientC or ambientF." });
    }
    if (value.symptom === "other" && !value.symptomText) {
      ctx.addIssue({ code: "custom", path: ["symptomText"], message: "Say in a few words what it did." });
    }
  };
}

/** Stored in °C whatever unit was sent. */
function celsiusOf(ambientC: number | null | undefined, ambientF: number | null | undefined): number | null | undefined {
  if (ambientC !== undefined) return ambientC;
  if (ambientF === undefined) return undefined;
  return ambientF === null ? null : celsiusFromFahrenheit(ambientF);
}

const utc = (iso: string) => new Date(iso).toISOString();

/**
 * POST /api/v1/units/:id/occurrences: { occurredAt, hoursParked?, ambientC?, symptom,
 * batteryVolts?, note? } per api-v1.md, plus optional ambientF, symptomText, recovered, concernId, photoId.
 */
export function makeOccurrenceInput(clock: () => number = Date.now) {
  return z
    .object({
      occurredAt: fields.occurredAt,
      hoursParked: fields.hoursParked.optional(),
      ambientC: fields.ambientC.optional(),
      ambientF: fields.ambientF.optional(),
      symptom: fields.symptom,
      symptomText: fields.symptomText.default(""),
      batteryVolts: fields.batteryVolts.optional(),
      recovered: fields.recovered.optional(),
      note: fields.note.default(""),
      concernId: fields.concernId.optional(),
      photoId: fields.photoId.optional(),
    })
    .superRefine(refine(clock))
    .transform((v) => ({
      occurredAt: utc(v.occurredAt),
      hoursParked: v.hoursParked ?? null,
      ambientC: celsiusOf(v.ambientC, v.ambientF) ?? null,
      symptom: v.symptom,
      symptomText: v.symptomText,
      batteryVolts: v.batteryVolts ?? null,
      recovered: v.recovered ?? null,
      note: v.note,
      concernId: v.concernId ?? null,
      photoId: v.photoId ?? null,
    }));
}

/** PATCH: any of the same fields; the author or the shop may correct an entry. A new photoId replaces the photo, null removes it. */
export function makeOccurrencePatch(clock: () => number = Date.now) {
  return z
    .object({
      occurredAt: fields.occurredAt.optional(),
      hoursParked: fields.hoursParked.optional(),
      ambientC: fields.ambientC.optional(),
      ambientF: fields.ambientF.optional(),
      symptom: fields.symptom.optional(),
      symptomText: fields.symptomText.optional(),
      batteryVolts: fields.batteryVolts.optional(),
      recovered: fields.recovered.optional(),
      note: fields.note.optional(),
      photoId: fields.photoId.optional(),
    })
    .superRefine((v, ctx) => {
      if (Object.values(v).every((x) => x === undefined)) {
        ctx.addIssue({ code: "custom", path: [], message: "Send at least one field to change." });
      }
      // "other" needs words, but they may already be on the entry: checked against the merged row.
      refine(clock)({ ...v, symptom: undefined }, ctx);
    })
    .transform(({ ambientF, ambientC, occurredAt, ...rest }) => {
      const celsius = celsiusOf(ambientC, ambientF);
      return {
        ...rest,
        ...(occurredAt === undefined ? {} : { occurredAt: utc(occurredAt) }),
        ...(celsius === undefined ? {} : { ambientC: celsius }),
      };
    });
}

export const occurrenceInput = makeOccurrenceInput();
export const occurrencePatch = makeOccurrencePatch();
export type OccurrenceInput = z.output<typeof occurrenceInput>;
export type OccurrencePatch = z.output<typeof occurrencePatch>;
