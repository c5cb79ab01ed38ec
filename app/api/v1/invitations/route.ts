import { pendingInvitations } from "@/db/queries/invitations";
import { CAN } from "@/lib/auth/policy";
import { apiRoute } from "@/lib/server/http/api-route";
import { inviteWithMail } from "@/lib/server/notifications/people";
import { invitationListQuery } from "@/lib/validation/api-queries";
import { invitationApiInput } from "@/lib/validation/people";

export const dynamic = "force-dynamic";

/** Invitations still waiting (not accepted, not withdrawn), optionally of one account. Shop staff who invite. */
export const GET = apiRoute({ roles: CAN.manageAccounts, query: invitationListQuery }, async ({ query }) => ({
  invitations: await pendingInvitations(query.accountId),
}));

/** The owner invites anyone; a writer, a fleet account's people. The e-mail carries a single-use link. */
export const POST = apiRoute({ roles: CAN.manageAccounts, body: invitationApiInput }, async ({ user, body }) => {
  const invitation = await inviteWithMail(user, body);
  return Response.json({ id: invitation.id, email: invitation.email, role: invitation.role, expiresAt: invitation.expiresAt }, { status: 201 });
});
