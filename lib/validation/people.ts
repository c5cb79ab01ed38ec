import { z } from "zod";
import { ROLES, isShopRole, type Role } from "@/lib/domain";
import { looksLikeLinkToken } from "@/lib/auth/tokens";
import { dollarsToCents } from "./estimate-line";

export const emailField = z.string().trim().toLowerCase().email("Enter an e-mail address.").max(200);
export const personName = z.string().trim().min(1, "Enter their name.").max(120);
const optionalId = z.preprocess((v) => (v === "" || v === null ? undefined : v), z.string().min(1).max(64).optional());
const optionalDollars = z.preprocess((v) => (v === "" || v === null ? undefined : v), dollarsToCents.pipe(z.number().int().min(0, "A limit cannot be negative.").max(10_000_000_000)).optional());

/** Long enough to resist guessing, short enough to type on a phone (NIST SP 800-63B asks for at least 8). */
export const PASSWORD_MIN = 10;
export const newPassword = z.string().min(PASSWORD_MIN, `At least ${PASSWORD_MIN} characters.`).max(200, "At most 200 characters.");

export const linkToken = z.string().refine(looksLikeLinkToken, "That link is not one Cotter sent.");

interface PersonShape {
  role: Role;
  accountId?: string | undefined;
  signingLimitCents?: number | undefined;
}

/** Shop staff have no account; fleet people belong to one; an approver needs a signing limit. */
function personRules(v: PersonShape, ctx: z.RefinementCtx, limitPath: string) {
  if (!isShopRole(v.role) && !v.accountId) ctx.addIssue({ code: "custom", path: ["accountId"], message: "Fleet people belong to an account." });
  if (isShopRole(v.role) && v.accountId) ctx.addIssue({ code: "custom", path: ["accountId"], message: "Shop staff have no fleet account." });
  if (v.role === "approver" && v.signingLimitCents === undefined) {
    ctx.addIssue({ code: "custom", path: [limitPath], message: "An approver needs a signing limit (the most they may approve on one work order)." });
  }
}

const invitationFields = { email: emailField, name: personName, role: z.enum(ROLES, { error: "Choose a role." }), accountId: optionalId };

/** POST /api/v1/invitations: money in cents, as everywhere in the API. */
export const invitationApiInput = z
  .object({ ...invitationFields, signingLimitCents: z.number().int().min(0).max(10_000_000_000).optional() })
  .superRefine((v, ctx) => personRules(v, ctx, "signingLimitCents"));

/** The invitation form: the signing limit typed in dollars. */
export const invitationFormInput = z
  .object({ ...invitationFields, signingLimit: optionalDollars })
  .transform(({ signingLimit, ...v }) => ({ ...v, signingLimitCents: signingLimit }))
  .superRefine((v, ctx) => personRules(v, ctx, "signingLimit"));

export type InvitationInput = z.output<typeof invitationApiInput>;

export const acceptInvitationInput = z.object({ token: linkToken, password: newPassword });
export const passwordResetRequestInput = z.object({ email: emailField });
export const passwordResetCompleteInput = z.object({ token: linkToken, password: newPassword });

/** The pages' forms ask for the new password twice. */
export const newPasswordFormInput = z
  .object({ token: linkToken, password: newPassword, confirmPassword: z.string().max(200) })
  .superRefine((v, ctx) => {
    if (v.password !== v.confirmPassword) ctx.addIssue({ code: "custom", path: ["confirmPassword"], message: "The two passwords differ." });
  });

export const changePasswordInput = z
  .object({
    currentPassword: z.string().min(1, "Enter your current password.").max(200),
    newPassword,
    confirmPassword: z.string().max(200),
  })
  .superRefine((v, ctx) => {
    if (v.newPassword !== v.confirmPassword) ctx.addIssue({ code: "custom", path: ["confirmPassword"], message: "The two new passwords differ." });
    if (v.newPassword === v.currentPassword) ctx.addIssue({ code: "custom", path: ["newPassword"], message: "Choose a password you have not used here just now." });
  });

/** What the owner may change about a person: name, role (on the same side), signing limit. */
export const personEditInput = z.object({
  userId: z.string().min(1).max(64),
  name: personName,
  role: z.enum(ROLES, { error: "Choose a role." }),
  signingLimit: optionalDollars,
});
export type PersonEditInput = z.output<typeof personEditInput>;

export const personActiveInput = z.object({ userId: z.string().min(1).max(64), active: z.enum(["true", "false"]).transform((v) => v === "true") });

export const invitationRefInput = z.object({ invitationId: z.string().min(1).max(64) });
