import { and, eq } from "drizzle-orm";
import { getDb, writeTxThen, type InSameTx, type Tx } from "@/db/client";
import { decisions, estimateLines, statusEvents, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { workOrderLabel } from "@/lib/domain";
import { boxRootId, decideLines, describeDecisions, type BatchOk, type DecisionRequest, type LineChange } from "@/lib/estimate";
import { conflict, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { recordAudit } from "./audit";
import { budgetUsedCents, currentFiscalYear, loadEstimateContext, toAccountSettings, toEstimateLine, toShopSettings } from "./estimate-context";
import { scopedTo } from "./scope";
import { planStops, settleTimeBoxes, type TimeBoxNoticeDue } from "./time-box-stops";

/** The work order a line belongs to, scoped: another account's line is not found. */
export async function workOrderOfLine(user: SessionUser, lineId: string): Promise<string> {
  const [row] = await getDb()
    .select({ workOrderId: estimateLines.workOrderId })
    .from(estimateLines)
    .innerJoin(workOrders, eq(workOrders.id, estimateLines.workOrderId))
    .where(and(eq(estimateLines.id, lineId), scopedTo(workOrders.accountId, user)))
    .limit(1);
  if (!row) throw notFound("That line");
  return row.workOrderId;
}

/** Writes a checked batch of line changes and their decision records. */
export async function writeLineChanges(tx: Tx, workOrderId: string, accountId: string, changes: LineChange[], at: string) {
  for (const c of changes) {
    const approved = c.state === "approved";
    await tx
      .update(estimateLines)
      .set({
        state: c.state,
        version: c.version,
        approvedByUserId: c.approvedByUserId,
        byStanding: c.byStanding,
        approvedAmountCents: c.approvedAmountCents,
        approvedAt: approved ? at : null,
        reopenReason: null,
        updatedAt: at,
      })
      .where(eq(estimateLines.id, c.lineId));
    await tx.insert(decisions).values({
      lineId: c.lineId,
      workOrderId,
      accountId,
      decision: c.record.decision,
      byUserId: c.record.byUserId,
      byStanding: c.record.byStanding,
      amountCents: c.record.amountCents,
      lineVersion: c.record.lineVersion,
      note: c.record.note ?? "",
      at,
    });
  }
}

/**
 * An approver's decisions, checked against the limits and written in one
 * transaction: every line or none. Refusals are 409 problems naming the
 * amounts; a line of another account is 404.
 */
export async function decide(user: SessionUser, workOrderId: string, requests: DecisionRequest[], notify?: InSameTx<{ result: BatchOk; wo: { id: string }; timeBoxNotices: TimeBoxNoticeDue[] }>) {
  return writeTxThen(async (tx) => {
    const ctx = await loadEstimateContext(tx, user, workOrderId);
    // A released visit is closed: nothing on it waits for a decision any more, whatever state a line was left in.
    if (ctx.wo.status === "released") {
      throw conflict("not_pending", `${workOrderLabel(ctx.wo.number)} was released; its lines are no longer waiting for a decision.`, { lineId: requests[0]?.lineId ?? null });
    }
    const bounds = currentFiscalYear(ctx.account);
    const result = decideLines({
      workOrderNumber: workOrderLabel(ctx.wo.number),
      lines: ctx.lines.map(toEstimateLine),
      caller: { id: user.id, signingLimitCents: user.signingLimitCents ?? 0 },
      shop: toShopSettings(ctx.shop),
      account: toAccountSettings(ctx.account),
      budgetUsedCents: await budgetUsedCents(tx, ctx.account.id, bounds),
      fiscalYear: bounds.fy,
      decisions: requests,
    });
    if (!result.ok) {
      if (result.code === "not_found") throw notFound("That line");
      throw conflict(result.code, capitalise(result.detail), { lineId: result.lineId, amounts: result.amounts });
    }
    const at = nowIso();
    await writeLineChanges(tx, ctx.wo.id, ctx.account.id, result.changes, at);
    // A decided diagnosis line (or extension) resizes its time box: re-plan when running clocks stop.
    const boxes = new Set(ctx.lines.filter((l) => l.isDiagnosis && result.changes.some((c) => c.lineId === l.id)).map(boxRootId));
    const timeBoxNotices = boxes.size ? await settleTimeBoxes(tx, at) : [];
    for (const rootId of boxes) await planStops(tx, rootId, at);
    await tx.insert(statusEvents).values({
      workOrderId: ctx.wo.id,
      status: ctx.wo.status,
      note: `${user.name}: ${describeDecisions(result.changes)}.`,
      byUserId: user.id,
      at,
    });
    await tx.update(workOrders).set({ updatedAt: at }).where(eq(workOrders.id, ctx.wo.id));
    await recordAudit(tx, user, {
      action: "estimate.decided",
      entityType: "work_order",
      entityId: ctx.wo.id,
      accountId: ctx.account.id,
      detail: result.changes.map((c) => ({ lineId: c.lineId, decision: c.record.decision, amountCents: c.record.amountCents, version: c.record.lineVersion })),
    });
    return { result: result as BatchOk, wo: ctx.wo, at, timeBoxNotices };
  }, notify);
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

