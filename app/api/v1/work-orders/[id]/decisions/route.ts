import { decide } from "@/db/queries/decisions";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { afterDecision, decisionNotice } from "@/lib/server/notifications/decisions";
import { batchDecisionBody } from "@/lib/validation/estimate-line";

export const dynamic = "force-dynamic";

/** Several decisions in one transaction: all or none (api-v1.md). */
export const POST = apiRoute({ roles: CAN.decide, params: idParams, body: batchDecisionBody }, async ({ user, params, body }) => {
  const { result } = await decide(user, params.id, body.decisions, decisionNotice(user));
  await afterDecision(result);
  return {
    lines: result.changes.map((c) => ({ id: c.lineId, state: c.state, version: c.version, decision: c.record.decision, amountCents: c.record.amountCents })),
    totals: result.totals,
  };
});
