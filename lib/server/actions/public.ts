"use server";
import "server-only";

import { acceptInvitation } from "@/db/queries/invitations";
import { completePasswordReset } from "@/db/queries/passwords";
import { runFirstSetup } from "@/db/queries/setup";
import { publicAction } from "@/lib/server/auth/guarded-action";
import { requestResetWithMail } from "@/lib/server/notifications/people";
import { newPasswordFormInput, passwordResetRequestInput } from "@/lib/validation/people";
import { setupFormInput } from "@/lib/validation/setup";

/** The forms of people who are not signed in yet. Each is authorised by its token or by the empty database. */

export const setupAction = publicAction({ input: setupFormInput }, async ({ input }) => {
  const owner = await runFirstSetup(input);
  return { email: owner.email };
});

export const acceptInvitationAction = publicAction({ input: newPasswordFormInput }, async ({ input }) => {
  const user = await acceptInvitation(input.token, input.password);
  return { email: user.email };
});

export const requestResetAction = publicAction({ input: passwordResetRequestInput }, async ({ input }) => {
  await requestResetWithMail(input.email);
  return null;
});

export const completeResetAction = publicAction({ input: newPasswordFormInput }, async ({ input }) => completePasswordReset(input.token, input.password));
