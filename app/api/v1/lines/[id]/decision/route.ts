import { decide } from "@/db/queries/decisions";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { afterDecision, decisionNotice } from "@/lib/server/notifications/decisions";
import { decisionOut, lineOut } from "@/lib/records/estimate-line";
import { decisionBody } from "@/lib/validation/estimate-line";

export const dynamic = "force-dynamic";

/** One approver's decision on one line → `{ line, totals }` (api-v1.md), answered from what the decision's transaction loaded and wrote. */
export const POST = apiRoute({ roles: CAN.decide, params: idParams, body: decisionBody }, async ({ user, params, body }) => {
  const decided = await decide(user, { lineId: params.id }, [{ lineId: params.id, ...body }], decisionNotice(user));
  await afterDecision(decided.result);
  const row = decided.lines.find((l) => l.id === params.id)!;
  return { line: lineOut(row, decisionOut(user.name, decided.at, decided.result.changes[0]!.record)), totals: decided.result.totals };
});
