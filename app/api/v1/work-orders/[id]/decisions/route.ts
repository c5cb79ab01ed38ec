import { decide } from "@/db/queries/decisions";
import { CAN } from "@/lib/auth/policy";
import { apiRoute, idParams } from "@/lib/server/http/api-route";
import { afterDecision, decisionNotice } from "@/lib/server/notifications/decisions";
import { decisionOut, lineOut } from "@/lib/records/estimate-line";
import { batchDecisionBody } from "@/lib/validation/estimate-line";

export const dynamic = "force-dynamic";

/** Several decisions in one transaction: all or none (api-v1.md). */
export const POST = apiRoute({ roles: CAN.decide, params: idParams, body: batchDecisionBody }, async ({ user, params, body }) => {
  const { result, lines, at } = await decide(user, params.id, body.decisions, decisionNotice(user));
  await afterDecision(result);
  const rows = new Map(lines.map((l) => [l.id, l]));
  return {
    // Each decision (the fields this route has always answered with), and its line as it now stands, in the one shape of an estimate line.
    lines: result.changes.map((c) => ({
      id: c.lineId,
      state: c.state,
      version: c.version,
      decision: c.record.decision,
      amountCents: c.record.amountCents,
      line: lineOut(rows.get(c.lineId)!, decisionOut(user.name, at, c.record)),
    })),
    totals: result.totals,
  };
});
