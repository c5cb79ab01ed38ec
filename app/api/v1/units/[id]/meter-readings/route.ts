import { addMeterReading } from "@/db/queries/meters";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { meterReadingInput } from "@/lib/validation/meter-reading";

export const dynamic = "force-dynamic";

export const POST = apiRoute(
  { roles: CAN.anyone, params: idParams, body: meterReadingInput },
  async ({ user, params, body }) => Response.json(await addMeterReading(user, params.id, body), { status: 201 }),
);
