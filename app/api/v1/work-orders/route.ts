import { z } from "zod";
import { listOpenWorkOrders } from "@/db/queries/work-order-list";
import { CAN } from "@/lib/auth/policy";
import { WORK_ORDER_STATUSES } from "@/lib/domain";
import { apiRoute } from "@/lib/http/api-route";
import { pageQuery } from "@/lib/http/pagination";

export const dynamic = "force-dynamic";

export const GET = apiRoute(
  { roles: CAN.anyone, query: pageQuery.extend({ status: z.enum(WORK_ORDER_STATUSES).optional() }) },
  ({ user, query }) => listOpenWorkOrders(user, query),
);
