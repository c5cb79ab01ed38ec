import { createUnit } from "@/db/queries/unit-writes";
import { listUnits } from "@/db/queries/units";
import { CAN } from "@/lib/auth/policy";
import { apiRoute } from "@/lib/server/http/api-route";
import { unitListQuery } from "@/lib/validation/api-queries";
import { unitCreateInput } from "@/lib/validation/unit";

export const dynamic = "force-dynamic";

/**
 * The caller's units, by unit number. `q` matches the unit number, any 3+
 * characters of the VIN or serial (anywhere in it), plate, description or
 * account name; `inShop`, `accountId` and `retired` filter.
 */
export const GET = apiRoute(
  {
    roles: CAN.anyone,
    query: unitListQuery,
  },
  ({ user, query }) => listUnits(user, query),
);

/** Adds a unit. A VIN with a wrong check digit is 400 with a field error naming the digit it should carry. */
export const POST = apiRoute({ roles: CAN.manageAccounts, body: unitCreateInput }, async ({ user, body }) => Response.json(await createUnit(user, body), { status: 201 }));
