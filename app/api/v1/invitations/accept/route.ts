import { acceptInvitation } from "@/db/queries/invitations";
import { publicRoute } from "@/lib/server/http/api-route";
import { acceptInvitationInput } from "@/lib/validation/people";

export const dynamic = "force-dynamic";

/** The invited person sets their own password: 201, or 409 `invitation_used`, 410 `invitation_expired` / `invitation_withdrawn`. */
export const POST = publicRoute({ body: acceptInvitationInput }, async ({ body }) => {
  const user = await acceptInvitation(body.token, body.password);
  return Response.json({ id: user.id, email: user.email, role: user.role, accountId: user.accountId }, { status: 201 });
});
