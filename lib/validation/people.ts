import { z } from "zod";
import { ROLES, isShopRole } from "@/lib/domain";
import { dollarsToCents } from "./estimate-line";

export const newPersonInput = z
  .object({
    name: z.string().trim().min(1, "Enter their name.").max(120),
    email: z.string().trim().toLowerCase().email("Enter an e-mail address."),
    role: z.enum(ROLES, { error: "Choose a role." }),
    accountId: z.preprocess((v) => (v === "" ? undefined : v), z.string().min(1).max(64).optional()),
    signingLimit: z.preprocess((v) => (v === "" || v === undefined ? "0" : v), dollarsToCents.pipe(z.number().int().min(0))),
    password: z.string().min(10, "At least 10 characters.").max(200),
  })
  .superRefine((v, ctx) => {
    if (!isShopRole(v.role) && !v.accountId) ctx.addIssue({ code: "custom", path: ["accountId"], message: "Fleet people belong to an account." });
    if (isShopRole(v.role) && v.accountId) ctx.addIssue({ code: "custom", path: ["accountId"], message: "Shop staff have no fleet account." });
  });
export type NewPersonInput = z.output<typeof newPersonInput>;

export const personActiveInput = z.object({ userId: z.string().min(1).max(64), active: z.enum(["true", "false"]).transform((v) => v === "true") });
