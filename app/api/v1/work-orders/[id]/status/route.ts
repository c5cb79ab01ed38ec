import { moveStatus } from "@/db/queries/status-writes";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/http/api-route";
import { deliverLater } from "@/lib/mail/deliver";
import { sendUnitReadyNotice } from "@/lib/mail/unit-ready-notice";
import { afterDefectsFixed } from "@/lib/notifications/visits";
import { statusMoveInput } from "@/lib/validation/status";

export const dynamic = "force-dynamic";

/** POST { status, note? } → the updated work order; the fleet's pages show it within seconds. */
export const POST = apiRoute({ roles: CAN.moveStatus, params: idParams, body: statusMoveInput }, async ({ user, params, body }) => {
  const { workOrder, becameReady, fixedRequestIds } = await moveStatus(user, params.id, body);
  if (becameReady) await deliverLater(() => sendUnitReadyNotice(workOrder.id, body.note));
  await afterDefectsFixed(fixedRequestIds);
  return workOrder;
});
