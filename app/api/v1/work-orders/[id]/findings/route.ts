import { createFinding } from "@/db/queries/finding-writes";
import { findFinding, findingsForWorkOrder } from "@/db/queries/finding-reads";
import { CAN } from "@/lib/auth/policy";
import { env } from "@/lib/env";
import { calendarDate } from "@/lib/format";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { notFound } from "@/lib/http/problem";
import { findingInput } from "@/lib/validation/finding";

export const dynamic = "force-dynamic";

/** The work order's findings, Out of service first, with photo URLs and checked readings. */
export const GET = apiRoute({ roles: CAN.anyone, params: idParams }, async ({ user, params }) => {
  const findings = await findingsForWorkOrder(user, params.id);
  if (!findings) throw notFound("That work order");
  return { workOrderId: params.id, findings };
});

/** A technician's finding: title, severity, note, photos already uploaded, typed readings, proposed lines. */
export const POST = apiRoute({ roles: CAN.postFindings, params: idParams, body: findingInput }, async ({ user, params, body }) => {
  const created = await createFinding(user, params.id, body, calendarDate(new Date(), env().APP_TIME_ZONE));
  const finding = await findFinding(user, created.id);
  return Response.json({ ...finding, proposedLineIds: created.proposedLineIds }, { status: 201 });
});
