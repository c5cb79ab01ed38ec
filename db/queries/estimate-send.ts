import { eq } from "drizzle-orm";
import { writeTx, writeTxThen, type InSameTx } from "@/db/client";
import { estimateLines, statusEvents, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { workOrderLabel } from "@/lib/domain";
import { applyStandingAuthorisation } from "@/lib/estimate";
import { conflict, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { formatCents } from "@/lib/money";
import { recordAudit } from "./audit";
import { writeLineChanges } from "./decisions";
import { budgetUsedCents, currentFiscalYear, loadEstimateContext, toAccountSettings, toEstimateLine, toShopSettings } from "./estimate-context";
import { assertOpen } from "./estimate-lines";

/**
 * Sends the draft lines to the fleet: they become "waiting on decision", the
 * work order moves to Waiting on approval, and the timeline says so.
 */
export async function sendEstimate(user: SessionUser, workOrderId: string, notify?: InSameTx<{ sentCount: number }>) {
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
    return { wo: ctx.wo, sentCount: drafts.length };
  }, notify);
}

/**
 * Starts draft or proposed lines under the account's standing authorisation:
 * recorded as approved by the standing authorisation, all or none, within its
 * amount per work order and the repair budget.
 */
export async function startUnderStanding(user: SessionUser, workOrderId: string, lineIds: string[]) {
  return writeTx(async (tx) => {
    const ctx = await loadEstimateContext(tx, user, workOrderId);
    assertOpen(ctx);
    const bounds = currentFiscalYear(ctx.account);
    const lines = ctx.lines.map(toEstimateLine);
    const result = applyStandingAuthorisation({
      workOrderNumber: workOrderLabel(ctx.wo.number),
      lines,
      shop: toShopSettings(ctx.shop),
      account: toAccountSettings(ctx.account),
      budgetUsedCents: await budgetUsedCents(tx, ctx.account.id, bounds),
      fiscalYear: bounds.fy,
      start: lineIds.map((lineId) => ({ lineId, expectedVersion: lines.find((l) => l.id === lineId)?.version ?? 0 })),
      note: `Started by ${user.name} under the standing authorisation`,
    });
    if (!result.ok) {
      if (result.code === "not_found") throw notFound("That line");
      throw conflict(result.code, result.detail.charAt(0).toUpperCase() + result.detail.slice(1), { lineId: result.lineId });
    }
    const at = nowIso();
    await writeLineChanges(tx, ctx.wo.id, ctx.account.id, result.changes, at);
    const total = result.changes.reduce((s, c) => s + c.record.amountCents, 0);
    await tx.insert(statusEvents).values({
      workOrderId: ctx.wo.id,
      status: ctx.wo.status,
      note: `Started ${result.changes.length} line${result.changes.length === 1 ? "" : "s"} (${formatCents(total)}) under your standing authorisation of ${formatCents(ctx.account.standingAuthorisationCents)}.`,
      byUserId: user.id,
      at,
    });
    await tx.update(workOrders).set({ updatedAt: at }).where(eq(workOrders.id, ctx.wo.id));
    await recordAudit(tx, user, { action: "estimate.standing", entityType: "work_order", entityId: ctx.wo.id, accountId: ctx.account.id, detail: { lineIds } });
    return result.changes.length;
  });
}
