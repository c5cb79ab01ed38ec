import { z } from "zod";
import { listServiceRequests } from "@/db/queries/service-requests";
import { CAN } from "@/lib/auth/policy";
import { SERVICE_REQUEST_STATUSES } from "@/lib/domain";
import { apiRoute } from "@/lib/server/http/api-route";
import { pageQuery } from "@/lib/http/pagination";

export const dynamic = "force-dynamic";

/** Defect reports, newest first: the shop sees every account's, a fleet person their own account's. */
export const GET = apiRoute(
  { roles: CAN.anyone, query: pageQuery.extend({ status: z.enum(SERVICE_REQUEST_STATUSES).optional(), unitId: z.string().min(1).max(64).optional() }) },
  ({ user, query }) => listServiceRequests(user, query),
);
