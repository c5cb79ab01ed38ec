import "server-only";
import { createInvitation, resendInvitation } from "@/db/queries/invitations";
import { requestPasswordReset } from "@/db/queries/passwords";
import type { SessionUser } from "@/lib/auth/session-user";
import { queueInvitation, queuePasswordReset } from "@/lib/server/notifications/intake";
import type { InvitationInput } from "@/lib/validation/people";

/** Writes the invitation and queues its e-mail in the same transaction. */
export async function inviteWithMail(user: SessionUser, input: InvitationInput) {
  const { invitation } = await createInvitation(user, input, (tx, sent) => queueInvitation(tx, sent.invitation, sent.token, user.name));
  return invitation;
}

export async function resendWithMail(user: SessionUser, invitationId: string) {
  const { invitation } = await resendInvitation(user, invitationId, (tx, sent) => queueInvitation(tx, sent.invitation, sent.token, user.name));
  return invitation;
}

/** Always resolves the same way: whether a link went out is nobody's business but the mailbox's. */
export async function requestResetWithMail(email: string): Promise<void> {
  await requestPasswordReset(email, (tx, made) => queuePasswordReset(tx, made.user, made.token));
}
