"use server";
import "server-only";

import { revalidatePath } from "next/cache";
import { withdrawInvitation } from "@/db/queries/invitations";
import { changeOwnPassword } from "@/db/queries/passwords";
import { setPersonActive, updatePerson } from "@/db/queries/people";
import { guardedAction } from "@/lib/server/auth/guarded-action";
import { CAN } from "@/lib/auth/policy";
import { inviteWithMail, resendWithMail } from "@/lib/server/notifications/people";
import { changePasswordInput, invitationFormInput, invitationRefInput, personActiveInput, personEditInput } from "@/lib/validation/people";

function refresh(accountId?: string | null) {
  revalidatePath("/settings/people");
  if (accountId) revalidatePath(`/accounts/${accountId}`);
}

export const inviteAction = guardedAction({ roles: CAN.manageAccounts, input: invitationFormInput }, async ({ user, input }) => {
  const invitation = await inviteWithMail(user, input);
  refresh(invitation.accountId);
  return { email: invitation.email, expiresAt: invitation.expiresAt };
});

export const resendInvitationAction = guardedAction({ roles: CAN.manageAccounts, input: invitationRefInput }, async ({ user, input }) => {
  const invitation = await resendWithMail(user, input.invitationId);
  refresh(invitation.accountId);
  return { email: invitation.email, expiresAt: invitation.expiresAt };
});

export const withdrawInvitationAction = guardedAction({ roles: CAN.manageAccounts, input: invitationRefInput }, async ({ user, input }) => {
  const invitation = await withdrawInvitation(user, input.invitationId);
  refresh(invitation.accountId);
  return { email: invitation.email };
});

export const updatePersonAction = guardedAction({ roles: CAN.manageShop, input: personEditInput }, async ({ user, input }) => {
  const result = await updatePerson(user, input);
  refresh();
  return result;
});

export const personActiveAction = guardedAction({ roles: CAN.manageShop, input: personActiveInput }, async ({ user, input }) => {
  await setPersonActive(user, input.userId, input.active);
  refresh();
  return null;
});

/** Everyone's own password; the browser signs in again with the new one, since older sessions end. */
export const changePasswordAction = guardedAction({ roles: CAN.anyone, input: changePasswordInput }, async ({ user, input }) =>
  changeOwnPassword(user, input.currentPassword, input.newPassword),
);
