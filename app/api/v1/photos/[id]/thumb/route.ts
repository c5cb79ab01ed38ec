import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { photoResponse } from "@/lib/server/uploads/serve-photo";

export const dynamic = "force-dynamic";

/** A square thumbnail for lists (JPEG, 320 px). */
export const GET = apiRoute({ roles: CAN.anyone, params: idParams }, ({ user, params }) => photoResponse(user, params.id, "thumb"));
