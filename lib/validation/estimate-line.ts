import { z } from "zod";
import { DECISIONS, LINE_KINDS } from "@/lib/domain";
import { parseDecimal, parseDollars } from "@/lib/money";

const checkbox = z.preprocess((v) => v === true || v === "on" || v === "true", z.boolean());
const optionalId = z.preprocess((v) => (v === "" || v === null ? undefined : v), z.string().min(1).max(64).optional());

/** A quantity typed by a person ("1.5", 2.375) to integer thousandths, refusing a fourth decimal. */
export const quantityMilli = z.preprocess(
  (v) => (typeof v === "number" ? String(v) : v),
  z
    .string({ error: "Enter a quantity." })
    .transform((s, ctx) => {
      const milli = parseDecimal(s, 3);
      if (milli === null) {
        ctx.addIssue({ code: "custom", message: "Enter a quantity with at most 3 decimals, like 1.5." });
        return z.NEVER;
      }
      return milli;
    })
    .pipe(z.number().int().positive("The quantity must be more than zero.").max(100_000_000, "That quantity is too large.")),
);

/** Dollars typed by a person ("1,240.50") to cents; integers already in cents pass through via `…Cents` fields. */
export const dollarsToCents = z.preprocess(
  (v) => (typeof v === "number" ? String(v) : v),
  z.string({ error: "Enter an amount." }).transform((s, ctx) => {
    const cents = parseDollars(s);
    if (cents === null) {
      ctx.addIssue({ code: "custom", message: "Enter an amount in dollars and cents, like 142.50." });
      return z.NEVER;
    }
    return cents;
  }),
);

const lineFields = {
  kind: z.enum(LINE_KINDS, { error: "Choose labour, part, sublet or fee." }),
  description: z.string().trim().min(1, "Describe the line.").max(300),
  partNumber: z.string().trim().max(80).default(""),
  quantity: quantityMilli,
  unitPrice: dollarsToCents.pipe(z.number().int().min(0, "The price cannot be negative.").max(100_000_000)),
  taxable: checkbox.default(false),
  coreCharge: z.preprocess((v) => (v === "" || v === undefined ? "0" : v), dollarsToCents.pipe(z.number().int().min(0).max(10_000_000))),
  concernId: optionalId,
  isDiagnosis: checkbox.default(false),
};

function tenthsForLabour<T extends { kind?: string; quantity?: number }>(value: T, ctx: z.RefinementCtx) {
  // Labour is billed in tenths of an hour (trade convention).
  if (value.kind === "labor" && value.quantity !== undefined && value.quantity % 100 !== 0) {
    ctx.addIssue({ code: "custom", path: ["quantity"], message: "Labour is in tenths of an hour, like 1.5 or 0.3." });
  }
}

export const newLineInput = z.object({ workOrderId: z.string().min(1).max(64), ...lineFields }).superRefine(tenthsForLabour);
export type NewLineInput = z.output<typeof newLineInput>;

export const editLineInput = z
  .object({ lineId: z.string().min(1).max(64), expectedVersion: z.coerce.number().int().min(1), ...lineFields })
  .superRefine(tenthsForLabour);
export type EditLineInput = z.output<typeof editLineInput>;

export const lineRefInput = z.object({ lineId: z.string().min(1).max(64), expectedVersion: z.coerce.number().int().min(1) });

export const decisionBody = z.object({
  decision: z.enum(DECISIONS, { error: "decision must be approve, decline or hold" }),
  note: z.string().trim().max(1000).optional(),
  expectedVersion: z.number({ error: "expectedVersion must be the line version you saw" }).int().min(1),
});

export const batchDecisionBody = z.object({
  decisions: z
    .array(
      z.object({
        lineId: z.string().min(1).max(64),
        decision: z.enum(DECISIONS, { error: "decision must be approve, decline or hold" }),
        expectedVersion: z.number().int().min(1),
        note: z.string().trim().max(1000).optional(),
      }),
    )
    .min(1, "Send at least one decision.")
    .max(500),
});
