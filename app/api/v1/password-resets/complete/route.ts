import { completePasswordReset } from "@/db/queries/passwords";
import { publicRoute } from "@/lib/server/http/api-route";
import { passwordResetCompleteInput } from "@/lib/validation/people";

export const dynamic = "force-dynamic";

/** Uses a reset link once: the new password, and every other session of that person ended. */
export const POST = publicRoute({ body: passwordResetCompleteInput }, async ({ body }) => completePasswordReset(body.token, body.password));
