import { currentVisit } from "@/db/queries/finding-reads";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { notFound } from "@/lib/http/problem";

export const dynamic = "force-dynamic";

/** The unit's visit in progress, for its live page: status, latest note, timeline, findings. */
export const GET = apiRoute({ roles: CAN.anyone, params: idParams }, async ({ user, params }) => {
  const visit = await currentVisit(user, params.id);
  if (!visit) throw notFound("That unit");
  return visit;
});
