import { eq } from "drizzle-orm";
import { writeTxThen, type InSameTx } from "@/db/client";
import { estimateLines, statusEvents, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { applyStandingAuthorisation } from "@/lib/estimate";
import { conflict } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { formatCents, lineAmountCents } from "@/lib/money";
import { recordAudit } from "./audit";
import { loadEstimateContext, type EstimateContext } from "./estimate-context";
import { applyLineChanges, type AppliedChanges } from "./line-changes";
import { assertOpen } from "./estimate-lines";

export interface EstimateSent {
  wo: EstimateContext["wo"] & { unitNumber: string; pendingCents: number };
  sentCount: number;
}

/**
 * Sends the draft lines to the fleet: they become "waiting on decision", the
 * work order moves to Waiting on approval, and the timeline says so.
 */
export async function sendEstimate(user: SessionUser, workOrderId: string, notify?: InSameTx<EstimateSent>) {
  return writeTxThen(async (tx) => {
    const ctx = await loadEstimateContext(tx, user, workOrderId);
    assertOpen(ctx);
    const drafts = ctx.lines.filter((l) => l.state === "draft");
    if (!drafts.length) throw conflict("nothing_to_send", "There are no draft lines to send. Add lines first.");
    const at = nowIso();
    for (const l of drafts) {
      await tx.update(estimateLines).set({ state: "proposed", version: l.version + 1, updatedAt: at }).where(eq(estimateLines.id, l.id));
    }
    await tx
      .update(workOrders)
      .set({ status: "waiting_approval", sentForApprovalAt: at, updatedAt: at })
      .where(eq(workOrders.id, ctx.wo.id));
    await tx.insert(statusEvents).values({
      workOrderId: ctx.wo.id,
      status: "waiting_approval",
      note: `Estimate sent: ${drafts.length} line${drafts.length === 1 ? "" : "s"} waiting on your decision.`,
      byUserId: user.id,
      at,
    });
    await recordAudit(tx, user, { action: "estimate.sent", entityType: "work_order", entityId: ctx.wo.id, accountId: ctx.wo.accountId, detail: { lineIds: drafts.map((l) => l.id) } });
    // What the approvers' e-mail says, from the lines as they now stand.
    const pendingCents = ctx.lines.filter((l) => l.state === "draft" || l.state === "proposed").reduce((sum, l) => sum + lineAmountCents(l.quantityMilli, l.unitPriceCents), 0);
    return { wo: { ...ctx.wo, unitNumber: ctx.unitNumber, pendingCents }, sentCount: drafts.length };
  }, notify);
}

/**
 * Starts draft or proposed lines under the account's standing authorisation:
 * recorded as approved by the standing authorisation, all or none, within its
 * amount per work order and the repair budget (the same step and 409 body as an
 * approver's decisions).
 */
export async function startUnderStanding(user: SessionUser, workOrderId: string, lineIds: string[], notify?: InSameTx<AppliedChanges>) {
  const applied = await writeTxThen(async (tx) => {
    const ctx = await loadEstimateContext(tx, user, workOrderId);
    assertOpen(ctx);
    return applyLineChanges(tx, user, ctx, {
      check: (limits) =>
        applyStandingAuthorisation({
          ...limits,
          start: lineIds.map((lineId) => ({ lineId, expectedVersion: limits.lines.find((l) => l.id === lineId)?.version ?? 0 })),
          note: `Started by ${user.name} under the standing authorisation`,
        }),
      timelineNote: ({ changes }) => {
        const total = changes.reduce((s, c) => s + c.record.amountCents, 0);
        return `Started ${changes.length} line${changes.length === 1 ? "" : "s"} (${formatCents(total)}) under your standing authorisation of ${formatCents(ctx.account.standingAuthorisationCents)}.`;
      },
      audit: () => ({ action: "estimate.standing", detail: { lineIds } }),
    });
  }, notify);
  return applied.result.changes.length;
}
