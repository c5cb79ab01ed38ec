import { checkIn } from "@/db/queries/check-in";
import { listOpenWorkOrders } from "@/db/queries/work-order-list";
import { CAN } from "@/lib/auth/policy";
import { apiRoute } from "@/lib/server/http/api-route";
import { checkedInNotice } from "@/lib/server/notifications/visits";
import { workOrderListQuery } from "@/lib/validation/api-queries";
import { checkInInput } from "@/lib/validation/visit";

export const dynamic = "force-dynamic";

/**
 * Open work orders by default; `all=true` reaches past visits. Filters:
 * `status`, `accountId`, `technicianId`, `openedFrom` / `openedTo` (calendar dates, the shop's zone).
 */
export const GET = apiRoute(
  {
    roles: CAN.anyone,
    query: workOrderListQuery,
  },
  ({ user, query }) => listOpenWorkOrders(user, query),
);

/** Check-in: opens a work order on a unit (201); 409 `unit_in_shop` with a link when it already has one open. */
export const POST = apiRoute({ roles: CAN.manageAccounts, body: checkInInput }, async ({ user, body }) => {
  const wo = await checkIn(user, body, checkedInNotice);
  return Response.json(wo, { status: 201 });
});
