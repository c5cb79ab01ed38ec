import { findFinding } from "@/db/queries/finding-reads";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { notFound } from "@/lib/http/problem";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ roles: CAN.anyone, params: idParams }, async ({ user, params }) => {
  const finding = await findFinding(user, params.id);
  if (!finding) throw notFound("That finding");
  return finding;
});
