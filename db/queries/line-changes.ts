import { eq } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { decisions, estimateLines, statusEvents, workOrders, type EstimateLine as LineRow } from "@/db/schema";
import type { ProblemCode } from "@/lib/api-schema/problem-codes";
import type { SessionUser } from "@/lib/auth/session-user";
import { workOrderLabel } from "@/lib/domain";
import { boxRootId, type AccountSettings, type BatchOk, type EstimateLine, type FiscalYear, type LineChange, type Refusal, type ShopSettings } from "@/lib/estimate";
import { conflict, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { recordAudit } from "./audit";
import { budgetUsedForWrite, moveBudgetUse } from "./budget-use";
import { currentFiscalYear, toAccountSettings, toEstimateLine, toShopSettings, type EstimateContext } from "./estimate-context";
import { planStops, settleTimeBoxes, type TimeBoxNoticeDue } from "./time-box-stops";

/** What the limits are checked against: the work order's lines as loaded and the account's use of its budget. */
export interface LimitsInput {
  workOrderNumber: string;
  lines: EstimateLine[];
  shop: ShopSettings;
  account: AccountSettings;
  budgetUsedCents: number;
  fiscalYear: FiscalYear;
}

type Refused = Refusal<ProblemCode, unknown> & { lineId: string };

export interface AppliedChanges {
  result: BatchOk;
  at: string;
  /** The work order's rows as they are after the change. */
  lines: LineRow[];
  /** Notices that settling the running clocks made due, for the caller to queue in this transaction. */
  timeBoxNotices: TimeBoxNoticeDue[];
}

/** A refusal of the pure rules as the one 409 body both paths answer with: the code, the amounts in words, `lineId` and `amounts`. */
export function refusalProblem(refused: Refused) {
  if (refused.code === "not_found") return notFound("That line");
  return conflict(refused.code, refused.detail.charAt(0).toUpperCase() + refused.detail.slice(1), { lineId: refused.lineId, amounts: refused.amounts });
}

function afterChange(row: LineRow, c: LineChange, at: string): LineRow {
  const approved = c.state === "approved";
  return {
    ...row,
    state: c.state,
    version: c.version,
    approvedByUserId: c.approvedByUserId,
    byStanding: c.byStanding,
    approvedAmountCents: c.approvedAmountCents,
    approvedAt: approved ? at : null,
    reopenReason: null,
    updatedAt: at,
  };
}

/**
 * The one step for "apply line changes under the limits", used by an
 * approver's decisions and by the shop's standing authorisation: the limits
 * are checked against what the caller's transaction loaded (the context and
 * the account's running budget total), a refusal is a 409 and writes nothing,
 * and otherwise the lines, their decision records, the budget total, the time
 * boxes, the timeline entry and the audit row are written in that transaction.
 */
export async function applyLineChanges(
  tx: Tx,
  user: SessionUser,
  ctx: EstimateContext,
  step: {
    check: (input: LimitsInput) => BatchOk | Refused;
    timelineNote: (result: BatchOk) => string;
    audit: (result: BatchOk) => { action: string; detail: unknown };
  },
): Promise<AppliedChanges> {
  const bounds = currentFiscalYear(ctx.account);
  const result = step.check({
    workOrderNumber: workOrderLabel(ctx.wo.number),
    lines: ctx.lines.map(toEstimateLine),
    shop: toShopSettings(ctx.shop),
    account: toAccountSettings(ctx.account),
    budgetUsedCents: await budgetUsedForWrite(tx, ctx.account.id, { ...bounds, label: bounds.fy.label }),
    fiscalYear: bounds.fy,
  });
  if (!result.ok) throw refusalProblem(result);

  const at = nowIso();
  const byId = new Map(ctx.lines.map((l) => [l.id, l]));
  const changed = new Map<string, LineRow>();
  for (const c of result.changes) {
    // A line named twice in a batch is written as it ends up.
    const before = changed.get(c.lineId) ?? byId.get(c.lineId)!;
    const after = afterChange(before, c, at);
    changed.set(c.lineId, after);
    await tx
      .update(estimateLines)
      .set({
        state: after.state,
        version: after.version,
        approvedByUserId: after.approvedByUserId,
        byStanding: after.byStanding,
        approvedAmountCents: after.approvedAmountCents,
        approvedAt: after.approvedAt,
        reopenReason: null,
        updatedAt: at,
      })
      .where(eq(estimateLines.id, c.lineId));
  }
  await tx.insert(decisions).values(
    result.changes.map((c) => ({
      lineId: c.lineId,
      workOrderId: ctx.wo.id,
      accountId: ctx.account.id,
      decision: c.record.decision,
      byUserId: c.record.byUserId,
      byStanding: c.record.byStanding,
      amountCents: c.record.amountCents,
      lineVersion: c.record.lineVersion,
      note: c.record.note ?? "",
      at,
    })),
  );
  await moveBudgetUse(tx, ctx.account.id, [...changed].map(([id, after]) => ({ before: byId.get(id)!, after })));

  // A decided diagnosis line (or extension) resizes its time box: re-plan when running clocks stop.
  const boxes = new Set([...changed.values()].filter((l) => l.isDiagnosis).map(boxRootId));
  const timeBoxNotices = boxes.size ? await settleTimeBoxes(tx, at) : [];
  for (const rootId of boxes) await planStops(tx, rootId, at);

  await tx.insert(statusEvents).values({ workOrderId: ctx.wo.id, status: ctx.wo.status, note: step.timelineNote(result), byUserId: user.id, at });
  await tx.update(workOrders).set({ updatedAt: at }).where(eq(workOrders.id, ctx.wo.id));
  const audit = step.audit(result);
  await recordAudit(tx, user, { action: audit.action, entityType: "work_order", entityId: ctx.wo.id, accountId: ctx.account.id, detail: audit.detail });
  return { result, at, lines: ctx.lines.map((l) => changed.get(l.id) ?? l), timeBoxNotices };
}
