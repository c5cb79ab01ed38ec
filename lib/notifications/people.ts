import { createInvitation, resendInvitation } from "@/db/queries/invitations";
import { requestPasswordReset } from "@/db/queries/passwords";
import type { SessionUser } from "@/lib/auth/session-user";
import { deliverLater } from "@/lib/mail/deliver";
import { sendInvitation, sendPasswordReset } from "@/lib/mail/intake-notices";
import type { InvitationInput } from "@/lib/validation/people";

/** Writes the invitation, then e-mails its link once the write has committed. */
export async function inviteWithMail(user: SessionUser, input: InvitationInput) {
  const { invitation, token } = await createInvitation(user, input);
  await deliverLater(() => sendInvitation(invitation, token, user.name));
  return invitation;
}

export async function resendWithMail(user: SessionUser, invitationId: string) {
  const { invitation, token } = await resendInvitation(user, invitationId);
  await deliverLater(() => sendInvitation(invitation, token, user.name));
  return invitation;
}

/** Always resolves the same way: whether a link went out is nobody's business but the mailbox's. */
export async function requestResetWithMail(email: string): Promise<void> {
  const made = await requestPasswordReset(email);
  if (made) await deliverLater(() => sendPasswordReset(made.user, made.token));
}
