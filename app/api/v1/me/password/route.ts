import { changeOwnPassword } from "@/db/queries/passwords";
import { CAN } from "@/lib/auth/policy";
import { apiRoute } from "@/lib/server/http/api-route";
import { changePasswordInput } from "@/lib/validation/people";

export const dynamic = "force-dynamic";

/** Changes the caller's own password (the current one is required); other sessions end. */
export const POST = apiRoute({ roles: CAN.anyone, body: changePasswordInput }, async ({ user, body }) => changeOwnPassword(user, body.currentPassword, body.newPassword));
