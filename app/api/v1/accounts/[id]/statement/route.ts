import { accountStatement } from "@/db/queries/statement";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { notFound } from "@/lib/http/problem";
import { periodQuery } from "@/lib/validation/invoices";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ roles: CAN.readStatement, params: idParams, query: periodQuery }, async ({ user, params, query }) => {
  const statement = await accountStatement(user, params.id, query);
  if (!statement) throw notFound("That account");
  return statement;
});
