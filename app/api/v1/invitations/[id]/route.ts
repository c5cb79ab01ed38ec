import { withdrawInvitation } from "@/db/queries/invitations";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";

export const dynamic = "force-dynamic";

/** Withdraws an invitation: its link stops working. */
export const DELETE = apiRoute({ roles: CAN.manageAccounts, params: idParams }, async ({ user, params }) => {
  const invitation = await withdrawInvitation(user, params.id);
  return { id: invitation.id, email: invitation.email, withdrawnAt: invitation.withdrawnAt };
});
