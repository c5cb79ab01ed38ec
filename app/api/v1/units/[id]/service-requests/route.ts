import { createServiceRequest } from "@/db/queries/service-requests";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { defectReportedNotice } from "@/lib/server/notifications/visits";
import { serviceRequestInput } from "@/lib/validation/service-request";

export const dynamic = "force-dynamic";

/** A driver's or foreman's defect report on one of their units (49 CFR 396.11): 201 with the report. */
export const POST = apiRoute({ roles: CAN.logOccurrence, params: idParams, body: serviceRequestInput }, async ({ user, params, body }) => {
  const row = await createServiceRequest(user, params.id, body, defectReportedNotice);
  return Response.json(row, { status: 201 });
});
