import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { decide, workOrderOfLine } from "@/db/queries/decisions";
import { estimateLines } from "@/db/schema";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { lineAmountCents } from "@/lib/money";
import { afterDecision, decisionNotice } from "@/lib/server/notifications/decisions";
import { decisionBody } from "@/lib/validation/estimate-line";

export const dynamic = "force-dynamic";

/** One approver's decision on one line → `{ line, totals }` (api-v1.md). */
export const POST = apiRoute({ roles: CAN.decide, params: idParams, body: decisionBody }, async ({ user, params, body }) => {
  const workOrderId = await workOrderOfLine(user, params.id);
  const { result, at } = await decide(user, workOrderId, [{ lineId: params.id, ...body }], decisionNotice(user));
  await afterDecision(result);
  const [row] = await getDb().select().from(estimateLines).where(eq(estimateLines.id, params.id)).limit(1);
  const change = result.changes[0]!;
  return {
    line: {
      id: row!.id,
      kind: row!.kind,
      description: row!.description,
      quantity: row!.quantityMilli / 1000,
      unitPriceCents: row!.unitPriceCents,
      amountCents: lineAmountCents(row!.quantityMilli, row!.unitPriceCents),
      taxable: row!.taxable,
      coreChargeCents: row!.coreChargeCents,
      state: row!.state,
      version: row!.version,
      findingId: row!.findingId,
      decision: { by: user.name, at, decision: change.record.decision, amountCents: change.record.amountCents, note: change.record.note ?? "" },
    },
    totals: result.totals,
  };
});
