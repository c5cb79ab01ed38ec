import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { photoResponse } from "@/lib/server/uploads/serve-photo";

export const dynamic = "force-dynamic";

/** The full-size, metadata-free photo (JPEG). */
export const GET = apiRoute({ roles: CAN.anyone, params: idParams }, ({ user, params }) => photoResponse(user, params.id, "full"));
