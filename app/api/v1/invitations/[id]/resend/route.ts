import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { resendWithMail } from "@/lib/server/notifications/people";

export const dynamic = "force-dynamic";

/** A fresh link and a fresh seven days; the old link stops working. */
export const POST = apiRoute({ roles: CAN.manageAccounts, params: idParams }, async ({ user, params }) => {
  const invitation = await resendWithMail(user, params.id);
  return { id: invitation.id, email: invitation.email, role: invitation.role, expiresAt: invitation.expiresAt };
});
