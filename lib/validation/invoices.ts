import { z } from "zod";
import { isCalendarDate } from "@/lib/dates";
import { parseDollars } from "@/lib/money";

const id = z.string().min(1).max(64);
const calendarDate = z.string().refine(isCalendarDate, "Enter a date as YYYY-MM-DD.");

export const poNumber = z
  .string()
  .trim()
  .max(60, "A PO number is at most 60 characters.")
  .regex(/^[^\r\n]*$/, "A PO number is one line.");

export const issueInvoiceInput = z.object({ workOrderId: id, poNumber: poNumber.optional() });

export const markLinesDoneInput = z.object({
  workOrderId: id,
  lineIds: z.preprocess((v) => (typeof v === "string" ? [v] : v), z.array(id).min(1, "Tick at least one line.").max(200)),
});

export const setPoNumberInput = z.object({ workOrderId: id, poNumber: poNumber.min(1, "Enter the PO number.") });

const dollars = z.string().transform((text, ctx) => {
  const cents = parseDollars(text);
  if (cents === null || cents <= 0) {
    ctx.addIssue({ code: "custom", message: "Enter an amount in dollars, e.g. 1,240.50." });
    return z.NEVER;
  }
  return cents;
});

export const recordPaymentInput = z
  .object({
    invoiceId: id,
    method: z.enum(["cheque", "transfer", "cash"], { error: "Choose how the money arrived." }),
    amount: dollars,
    reference: z.string().trim().max(120).default(""),
    receivedOn: calendarDate,
    note: z.string().trim().max(500).default(""),
  })
  .superRefine((v, ctx) => {
    if (v.method === "cheque" && !v.reference) ctx.addIssue({ code: "custom", path: ["reference"], message: "Enter the cheque number." });
    if (v.method === "transfer" && !v.reference) ctx.addIssue({ code: "custom", path: ["reference"], message: "Enter the transfer reference." });
  });

export const voidInvoiceInput = z.object({
  invoiceId: id,
  reason: z.string().trim().min(3, "Say why the invoice is void.").max(500),
});

export const creditNoteInput = z.object({
  invoiceId: id,
  amount: dollars,
  reason: z.string().trim().min(3, "Say what the credit is for.").max(300),
});

export const resolvePaymentInput = z.object({ paymentId: id, resolution: z.enum(["applied", "returned"]) });

/** ?from=&to= calendar dates, both optional, from not after to. */
export const periodQuery = z
  .object({ from: calendarDate.optional(), to: calendarDate.optional() })
  .refine((v) => !v.from || !v.to || v.from <= v.to, { path: ["from"], message: "from must not be after to." });

export const exportQuery = z
  .object({ from: calendarDate, to: calendarDate })
  .refine((v) => v.from <= v.to, { path: ["from"], message: "from must not be after to." });
