import { updateUnit } from "@/db/queries/unit-writes";
import { getUnitDetail } from "@/db/queries/units";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { notFound } from "@/lib/http/problem";
import { lineFieldsOut } from "@/lib/records/estimate-line";
import { workOrderOut } from "@/lib/records/work-order";
import { unitPatchInput } from "@/lib/validation/unit";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ roles: CAN.anyone, params: idParams }, async ({ user, params }) => {
  const detail = await getUnitDetail(user, params.id);
  if (!detail) throw notFound("That unit");
  const { unit, openWorkOrder, readings, history, deferred } = detail;
  return {
    ...unit,
    status: openWorkOrder?.status ?? (history.length > 0 ? "released" : null),
    workOrderId: openWorkOrder?.id ?? null,
    meterReadings: readings,
    deferredLines: deferred.map((l) => ({ ...lineFieldsOut(l), workOrderId: l.workOrderId, updatedAt: l.updatedAt })),
    workOrders: history.map((w) => ({ ...w, ...workOrderOut({ ...w, unitId: unit.id, accountId: unit.accountId }) })),
  };
});

/** Any field of POST (null clears an optional one), plus `retired: true` to take the unit off every list. */
export const PATCH = apiRoute({ roles: CAN.manageAccounts, params: idParams, body: unitPatchInput }, async ({ user, params, body }) => updateUnit(user, params.id, body));
