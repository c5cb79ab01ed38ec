import { addOccurrence, getOccurrence, listOccurrences } from "@/db/queries/occurrences";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { queueOccurrenceNotice } from "@/lib/server/notifications/occurrences";
import { occurrenceListQuery } from "@/lib/validation/api-queries";
import { occurrenceInput } from "@/lib/validation/occurrence";

export const dynamic = "force-dynamic";

/** The unit's occurrence log, newest first, with its intermittent concerns (api-v1.md). */
export const GET = apiRoute({ roles: CAN.logOccurrence, params: idParams, query: occurrenceListQuery }, async ({ user, params, query }) =>
  listOccurrences(user, params.id, query),
);

/** Logs one occurrence; the e-mail to the writer and the technician is queued with it. */
export const POST = apiRoute({ roles: CAN.logOccurrence, params: idParams, body: occurrenceInput }, async ({ user, params, body }) => {
  const created = await addOccurrence(user, params.id, body, (tx, row) => queueOccurrenceNotice(tx, row.id));
  return Response.json(await getOccurrence(user, params.id, created.id), { status: 201 });
});
