import { z } from "zod";
import { LINE_KINDS, SEVERITIES } from "@/lib/domain";
import { READING_KINDS, type FieldSpec, type ReadingInput, type ReadingKind } from "@/lib/specs";
import { PHOTOS_PER_FINDING } from "@/lib/uploads/photo-rules";

export const READING_KIND_LIST = Object.keys(READING_KINDS) as [ReadingKind, ...ReadingKind[]];
export const MAX_READINGS = 12;
export const MAX_PROPOSED_LINES = 10;
export const NOTE_MAX_CHARS = 4000;

function fieldSchema(field: FieldSpec): z.ZodType {
  let schema: z.ZodType;
  switch (field.type) {
    case "number":
      schema = z
        .number({ error: `${field.label}: enter a number.` })
        .finite()
        .min(field.min ?? -1_000_000, `${field.label} is too small.`)
        .max(1_000_000, `${field.label} is too large.`);
      break;
    case "select": {
      const values = field.options.map((o) => o.value);
      schema = z
        .union([z.string(), z.number()], { error: `${field.label}: choose one of the options.` })
        .refine((v) => values.includes(v), `${field.label}: choose one of the options.`);
      break;
    }
    case "date":
      schema = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, `${field.label}: give a date as YYYY-MM-DD.`);
      break;
  }
  return field.optional ? schema.optional() : schema;
}

/** One object schema per reading kind, built from the same field list the form is built from. */
const schemaByKind = new Map<ReadingKind, z.ZodType>(
  READING_KIND_LIST.map((kind) => {
    const fields = READING_KINDS[kind].fields as readonly FieldSpec[];
    const shape: Record<string, z.ZodType> = { kind: z.literal(kind) };
    for (const field of fields) shape[field.name] = fieldSchema(field);
    return [kind, z.object(shape)];
  }),
);

export type ReadingEntry = { input: ReadingInput; location: string };

/**
 * A reading as typed on the phone: `{ kind, location?, …fields }`. Only the
 * typed input is kept; a verdict sent by the client is dropped (the server
 * works it out with checkReading).
 */
export const readingEntry = z
  .looseObject({ kind: z.enum(READING_KIND_LIST, { error: "Choose what was measured." }), location: z.string().trim().max(60).default("") })
  .transform((value, ctx): ReadingEntry => {
    const { location, ...rest } = value;
    const parsed = schemaByKind.get(value.kind)?.safeParse(rest);
    if (!parsed?.success) {
      for (const issue of parsed?.error.issues ?? []) ctx.addIssue({ code: "custom", message: issue.message, path: issue.path });
      return z.NEVER;
    }
    // The schema was built from READING_KINDS, whose field names are typed as this kind's input keys.
    return { input: parsed.data as ReadingInput, location };
  });

export const proposedLine = z
  .object({
    description: z.string().trim().min(1, "Describe the line.").max(200),
    kind: z.enum(LINE_KINDS, { error: "Choose labour, part, sublet or fee." }),
    quantity: z.number({ error: "Enter a quantity." }).positive("Quantity must be more than zero.").max(10_000),
  })
  .superRefine((line, ctx) => {
    const tenths = line.quantity * 10;
    // Labour is billed in tenths of an hour (trade convention); parts may be fractional (fluids).
    if (line.kind === "labor" && Math.abs(tenths - Math.round(tenths)) > 1e-9) {
      ctx.addIssue({ code: "custom", path: ["quantity"], message: "Labour is in tenths of an hour (e.g. 1.5)." });
    }
    const milli = line.quantity * 1000;
    if (Math.abs(milli - Math.round(milli)) > 1e-6) {
      ctx.addIssue({ code: "custom", path: ["quantity"], message: "Use at most three decimals." });
    }
  });

export const findingInput = z.object({
  title: z.string().trim().min(1, "Give the finding a short title.").max(120, "Keep the title under 120 characters."),
  severity: z.enum(SEVERITIES, { error: "Choose how serious it is." }),
  noteMarkdown: z.string().max(NOTE_MAX_CHARS, `Keep the note under ${NOTE_MAX_CHARS} characters.`).default(""),
  concernId: z.string().min(1).max(64).nullish(),
  photoIds: z
    .array(z.string().min(1).max(64))
    .max(PHOTOS_PER_FINDING, `A finding takes at most ${PHOTOS_PER_FINDING} photos.`)
    .refine((ids) => new Set(ids).size === ids.length, "The same photo is listed twice.")
    .default([]),
  readings: z.array(readingEntry).max(MAX_READINGS, `At most ${MAX_READINGS} readings on one finding.`).default([]),
  proposedLines: z.array(proposedLine).max(MAX_PROPOSED_LINES, `At most ${MAX_PROPOSED_LINES} proposed lines.`).default([]),
});

export type FindingInput = z.output<typeof findingInput>;
