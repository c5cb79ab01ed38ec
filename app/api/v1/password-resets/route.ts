import { publicRoute } from "@/lib/server/http/api-route";
import { requestResetWithMail } from "@/lib/server/notifications/people";
import { passwordResetRequestInput } from "@/lib/validation/people";

export const dynamic = "force-dynamic";

/** Always 202, whether or not anyone signs in with the address: the answer never says which. */
export const POST = publicRoute({ body: passwordResetRequestInput }, async ({ body }) => {
  await requestResetWithMail(body.email);
  return Response.json({ status: "accepted", detail: "If someone signs in with that address, a link is on its way. It works once, for one hour." }, { status: 202 });
});
