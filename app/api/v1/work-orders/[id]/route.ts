import { updateVisit } from "@/db/queries/visit-writes";
import { workOrderView } from "@/db/queries/work-order-view";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { notFound } from "@/lib/http/problem";
import { visitPatchInput } from "@/lib/validation/visit";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ roles: CAN.anyone, params: idParams }, async ({ user, params }) => {
  const view = await workOrderView(user, params.id);
  if (!view) throw notFound("That work order");
  return view;
});

/** `{ assignedTechId?, promisedAt?, poNumber? }` (null clears); each change is a timeline entry the fleet sees. */
export const PATCH = apiRoute({ roles: CAN.manageAccounts, params: idParams, body: visitPatchInput }, async ({ user, params, body }) => {
  await updateVisit(user, params.id, body);
  const view = await workOrderView(user, params.id);
  if (!view) throw notFound("That work order");
  return view;
});
