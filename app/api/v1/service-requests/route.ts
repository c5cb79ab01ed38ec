import { listServiceRequests } from "@/db/queries/service-requests";
import { CAN } from "@/lib/auth/policy";
import { apiRoute } from "@/lib/server/http/api-route";
import { serviceRequestListQuery } from "@/lib/validation/api-queries";

export const dynamic = "force-dynamic";

/** Defect reports, newest first: the shop sees every account's, a fleet person their own account's. */
export const GET = apiRoute(
  { roles: CAN.anyone, query: serviceRequestListQuery },
  ({ user, query }) => listServiceRequests(user, query),
);
