import { z } from "zod";
import { checkIn } from "@/db/queries/check-in";
import { listOpenWorkOrders } from "@/db/queries/work-order-list";
import { CAN } from "@/lib/auth/policy";
import { WORK_ORDER_STATUSES } from "@/lib/domain";
import { apiRoute } from "@/lib/server/http/api-route";
import { pageQuery } from "@/lib/http/pagination";
import { checkedInNotice } from "@/lib/server/notifications/visits";
import { checkInInput } from "@/lib/validation/visit";

export const dynamic = "force-dynamic";

const day = z.iso.date("Write the date as YYYY-MM-DD.").optional();

/**
 * Open work orders by default; `all=true` reaches past visits. Filters:
 * `status`, `accountId`, `technicianId`, `openedFrom` / `openedTo` (calendar dates, the shop's zone).
 */
export const GET = apiRoute(
  {
    roles: CAN.anyone,
    query: pageQuery.extend({
      status: z.enum(WORK_ORDER_STATUSES).optional(),
      all: z.enum(["true", "false"]).optional().transform((v) => v === "true"),
      accountId: z.string().min(1).max(64).optional(),
      technicianId: z.string().min(1).max(64).optional(),
      openedFrom: day,
      openedTo: day,
    }),
  },
  ({ user, query }) => listOpenWorkOrders(user, query),
);

/** Check-in: opens a work order on a unit (201); 409 `unit_in_shop` with a link when it already has one open. */
export const POST = apiRoute({ roles: CAN.manageAccounts, body: checkInInput }, async ({ user, body }) => {
  const wo = await checkIn(user, body, checkedInNotice);
  return Response.json(wo, { status: 201 });
});
