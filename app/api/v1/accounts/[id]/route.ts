import { updateAccount } from "@/db/queries/account-writes";
import { getAccountForApi } from "@/db/queries/accounts";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { notFound } from "@/lib/http/problem";
import { API_NAMES, accountPatchApiInput } from "@/lib/validation/account";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ roles: CAN.anyone, params: idParams }, async ({ user, params }) => {
  const account = await getAccountForApi(user, params.id);
  if (!account) throw notFound("That account");
  return account;
});

/** Any field of POST, plus `contacts` (the whole list) and `archived`; each change is audited with its old and new value. */
export const PATCH = apiRoute({ roles: CAN.manageAccounts, params: idParams, body: accountPatchApiInput }, async ({ user, params, body }) => {
  const result = await updateAccount(user, params.id, body, API_NAMES);
  return { ...(await getAccountForApi(user, params.id)), changed: result.changed };
});
