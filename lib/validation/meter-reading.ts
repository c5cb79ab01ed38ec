import { z } from "zod";
import { METER_KINDS } from "@/lib/domain";

const checkbox = z.preprocess((v) => v === true || v === "on" || v === "true", z.boolean());

export const meterReadingInput = z.object({
  kind: z.enum(METER_KINDS),
  value: z.coerce
    .number({ error: "Enter the reading as a number." })
    .finite()
    .min(0, "A reading cannot be negative.")
    .max(9_999_999, "That reading is too large."),
  meterReplaced: checkbox.default(false),
  readAt: z.iso.datetime().optional(),
  note: z.string().trim().max(500).default(""),
});

export type MeterReadingInput = z.output<typeof meterReadingInput>;
