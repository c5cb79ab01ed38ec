import { addConcern } from "@/db/queries/visit-writes";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { concernAddInput } from "@/lib/validation/visit";

export const dynamic = "force-dynamic";

/** A concern found later, added to an open visit (201). */
export const POST = apiRoute({ roles: CAN.moveStatus, params: idParams, body: concernAddInput }, async ({ user, params, body }) =>
  Response.json(await addConcern(user, params.id, body.complaint), { status: 201 }),
);
