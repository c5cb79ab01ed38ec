import { workOrderView } from "@/db/queries/work-order-view";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/http/api-route";
import { notFound } from "@/lib/http/problem";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ roles: CAN.anyone, params: idParams }, async ({ user, params }) => {
  const view = await workOrderView(user, params.id);
  if (!view) throw notFound("That work order");
  return view;
});
