import { z } from "zod";
import { dollarsToCents } from "./estimate-line";
import { emailField, newPassword, personName } from "./people";

const shopFields = {
  shopName: z.string().trim().min(1, "The shop needs a name.").max(120),
  addressLine1: z.string().trim().min(1, "The street address prints on every invoice.").max(120),
  addressLine2: z.string().trim().max(120).default(""),
  phone: z.string().trim().min(1, "A phone number prints on every invoice.").max(40),
  shopEmail: z.preprocess((v) => (v === "" ? undefined : v), emailField.optional()),
  ownerName: personName,
  ownerEmail: emailField,
  password: newPassword,
};

const rateCents = z.number().int().min(1, "The labour rate must be more than zero.").max(10_000_000, "That rate is too high.");

/** POST /api/v1/setup: the labour rate in cents per hour, like all API money. */
export const setupApiInput = z.object({ ...shopFields, laborRateCents: rateCents });

/** The set-up form: the labour rate typed in dollars per hour. */
export const setupFormInput = z
  .object({ ...shopFields, laborRate: dollarsToCents.pipe(rateCents), confirmPassword: z.string().max(200) })
  .superRefine((v, ctx) => {
    if (v.password !== v.confirmPassword) ctx.addIssue({ code: "custom", path: ["confirmPassword"], message: "The two passwords differ." });
  })
  .transform(({ laborRate, confirmPassword: _c, ...v }) => ({ ...v, laborRateCents: laborRate }));

export type SetupInput = z.output<typeof setupApiInput>;
