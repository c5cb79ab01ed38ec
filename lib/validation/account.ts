import { z } from "zod";
import { parsePercent } from "@/lib/money";
import { dollarsToCents } from "./estimate-line";

const checkbox = z.preprocess((v) => v === true || v === "on" || v === "true", z.boolean());
const blankToNull = (v: unknown) => (v === "" || v === null || v === undefined ? null : v);

const percentMilli = (label: string) =>
  z.preprocess(
    (v) => (typeof v === "number" ? String(v) : v),
    z.string().transform((s, ctx) => {
      const milli = parsePercent(s);
      if (milli === null || milli < 0 || milli > 100_000) {
        ctx.addIssue({ code: "custom", message: `${label} is a percent from 0 to 100, with up to 3 decimals.` });
        return z.NEVER;
      }
      return milli;
    }),
  );

const money = dollarsToCents.pipe(z.number().int().min(0, "Amounts cannot be negative.").max(10_000_000_000));
const optionalMoney = z.preprocess(blankToNull, money.nullable());

/** What the owner or a writer may set on a fleet account. */
export const accountSettingsInput = z
  .object({
    accountId: z.string().min(1).max(64),
    standingAuthorisation: money,
    repairBudget: optionalMoney,
    fiscalYearStartMonth: z.coerce.number().int().min(1).max(12),
    overrunPercent: percentMilli("The overrun allowance"),
    overrunCap: optionalMoney,
    overrunFloor: z.preprocess((v) => (v === "" || v === undefined ? "0" : v), money),
    taxExempt: checkbox.default(false),
    taxExemptCertificate: z.string().trim().max(80).default(""),
    taxRate: percentMilli("The tax rate"),
    poRequired: checkbox.default(false),
    paymentTermsDays: z.coerce.number().int().min(0, "Terms cannot be negative.").max(365),
    shopSuppliesExempt: checkbox.default(false),
  })
  .superRefine((v, ctx) => {
    if (v.taxExempt && !v.taxExemptCertificate) {
      ctx.addIssue({ code: "custom", path: ["taxExemptCertificate"], message: "A tax-exempt account needs its certificate number on file." });
    }
    if (v.overrunCap !== null && v.overrunFloor > v.overrunCap) {
      ctx.addIssue({ code: "custom", path: ["overrunFloor"], message: "The floor cannot be above the cap." });
    }
  });
export type AccountSettingsInput = z.output<typeof accountSettingsInput>;

export const signingLimitInput = z.object({
  userId: z.string().min(1).max(64),
  signingLimit: money,
});
