import { moveStatus } from "@/db/queries/status-writes";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { queueUnitReadyNotice } from "@/lib/server/notifications/unit-ready";
import { defectsFixedNotice } from "@/lib/server/notifications/visits";
import { statusMoveInput } from "@/lib/validation/status";

export const dynamic = "force-dynamic";

/** POST { status, note? } → the updated work order; the fleet's pages show it within seconds. */
export const POST = apiRoute({ roles: CAN.moveStatus, params: idParams, body: statusMoveInput }, async ({ user, params, body }) => {
  const { workOrder } = await moveStatus(user, params.id, body, async (tx, moved) => {
    if (moved.becameReady) await queueUnitReadyNotice(tx, moved.workOrder.id, body.note);
    await defectsFixedNotice(tx, moved.fixedRequestIds);
  });
  return workOrder;
});
