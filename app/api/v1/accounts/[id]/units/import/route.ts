import { importUnits } from "@/db/queries/unit-writes";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { readTextBody } from "@/lib/server/http/read-body";

export const dynamic = "force-dynamic";

// 2,000 rows of a dozen short columns fit well inside this.
const MAX_CSV_BYTES = 1024 * 1024;

/** A `text/csv` body with a header row → `{ imported }`, or 400 listing `{ row, field, message }` and nothing imported. */
export const POST = apiRoute({ roles: CAN.manageAccounts, params: idParams }, async ({ user, params, request }) => {
  const text = await readTextBody(request, ["text/csv", "text/plain"], MAX_CSV_BYTES);
  return Response.json(await importUnits(user, params.id, text), { status: 201 });
});
