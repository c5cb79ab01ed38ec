import { z } from "zod";
import { parsePercent } from "@/lib/money";
import { dollarsToCents } from "./estimate-line";

const checkbox = z.preprocess((v) => v === true || v === "on" || v === "true", z.boolean());

export const shopSettingsInput = z.object({
  shopName: z.string().trim().min(1, "The shop needs a name.").max(120),
  addressLine1: z.string().trim().max(120).default(""),
  addressLine2: z.string().trim().max(120).default(""),
  phone: z.string().trim().max(40).default(""),
  email: z.string().trim().max(120).default(""),
  shopSuppliesRate: z.preprocess(
    (v) => (typeof v === "number" ? String(v) : v),
    z.string().transform((s, ctx) => {
      const milli = parsePercent(s);
      if (milli === null || milli < 0 || milli > 100_000) {
        ctx.addIssue({ code: "custom", message: "A percent from 0 to 100." });
        return z.NEVER;
      }
      return milli;
    }),
  ),
  shopSuppliesCap: dollarsToCents.pipe(z.number().int().min(0).max(100_000_000)),
  shopSuppliesTaxable: checkbox.default(false),
  taxLabor: checkbox.default(false),
  taxParts: checkbox.default(false),
  taxSublet: checkbox.default(false),
  taxFees: checkbox.default(false),
  invoiceFooter: z.string().trim().max(500).default(""),
});
export type ShopSettingsInput = z.output<typeof shopSettingsInput>;

export const laborRateInput = z.object({
  id: z.preprocess((v) => (v === "" ? undefined : v), z.string().min(1).max(64).optional()),
  name: z.string().trim().min(1, "Name the rate.").max(60),
  rate: dollarsToCents.pipe(z.number().int().min(0).max(10_000_000)),
  isDefault: checkbox.default(false),
  active: checkbox.default(true),
});
export type LaborRateInput = z.output<typeof laborRateInput>;
