import { updateConcern } from "@/db/queries/visit-writes";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { concernPatchInput } from "@/lib/validation/visit";

export const dynamic = "force-dynamic";

/** `{ cause?, correction? }`: the technician on the phone, the writer on the desktop. */
export const PATCH = apiRoute({ roles: CAN.moveStatus, params: idParams, body: concernPatchInput }, async ({ user, params, body }) => updateConcern(user, params.id, body));
