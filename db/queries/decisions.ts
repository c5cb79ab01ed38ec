import { writeTxThen, type InSameTx } from "@/db/client";
import type { SessionUser } from "@/lib/auth/session-user";
import { workOrderLabel } from "@/lib/domain";
import { decideLines, describeDecisions, type DecisionRequest } from "@/lib/estimate";
import { conflict } from "@/lib/http/problem";
import { loadEstimateContext, type EstimateContext } from "./estimate-context";
import { applyLineChanges, type AppliedChanges } from "./line-changes";

export type Decided = AppliedChanges & {
  wo: EstimateContext["wo"];
  unitNumber: string;
  /** The batch in words ("approve 1 line ($186.40)"), for the timeline and the writer's e-mail. */
  summary: string;
};

/**
 * An approver's decisions, checked against the limits and written in one
 * transaction: every line or none. Refusals are 409 problems naming the
 * amounts; a line of another account is 404. `of` is the work order, or the
 * line when one line is decided.
 */
export async function decide(user: SessionUser, of: string | { lineId: string }, requests: DecisionRequest[], notify?: InSameTx<Decided>): Promise<Decided> {
  return writeTxThen(async (tx) => {
    const ctx = await loadEstimateContext(tx, user, of);
    // A released visit is closed: nothing on it waits for a decision any more, whatever state a line was left in.
    if (ctx.wo.status === "released") {
      throw conflict("not_pending", `${workOrderLabel(ctx.wo.number)} was released; its lines are no longer waiting for a decision.`, { lineId: requests[0]?.lineId ?? null });
    }
    let summary = "";
    const applied = await applyLineChanges(tx, user, ctx, {
      check: (limits) => decideLines({ ...limits, caller: { id: user.id, signingLimitCents: user.signingLimitCents ?? 0 }, decisions: requests }),
      timelineNote: (result) => {
        summary = describeDecisions(result.changes);
        return `${user.name}: ${summary}.`;
      },
      audit: (result) => ({
        action: "estimate.decided",
        detail: result.changes.map((c) => ({ lineId: c.lineId, decision: c.record.decision, amountCents: c.record.amountCents, version: c.record.lineVersion })),
      }),
    });
    return { ...applied, wo: ctx.wo, unitNumber: ctx.unitNumber, summary };
  }, notify);
}
