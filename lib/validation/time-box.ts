import { z } from "zod";
import { quantityMilli } from "./estimate-line";

/** More diagnosis hours asked of the customer: in tenths of an hour, as labour is billed. */
export const extensionInput = z.object({
  lineId: z.string().min(1).max(64),
  hours: quantityMilli.refine((m) => m % 100 === 0, "Ask in tenths of an hour, like 1.0 or 0.5.").refine((m) => m <= 40_000, "Ask for at most 40 hours at a time."),
  note: z.string().trim().max(500).default(""),
});
export type ExtensionInput = z.output<typeof extensionInput>;
