import { createAccount } from "@/db/queries/account-writes";
import { getAccountForApi, listAccountsForApi } from "@/db/queries/accounts";
import { CAN } from "@/lib/auth/policy";
import { apiRoute } from "@/lib/server/http/api-route";
import { accountCreateApiInput } from "@/lib/validation/account";
import { accountListQuery } from "@/lib/validation/api-queries";

export const dynamic = "force-dynamic";

/** The shop sees every account (archived ones with ?archived=true), a fleet person their own. */
export const GET = apiRoute(
  { roles: CAN.anyone, query: accountListQuery },
  ({ user, query }) => listAccountsForApi(user, query),
);

export const POST = apiRoute({ roles: CAN.manageAccounts, body: accountCreateApiInput }, async ({ user, body }) => {
  const row = await createAccount(user, body.fields, body.contacts);
  return Response.json(await getAccountForApi(user, row.id), { status: 201 });
});
