import { and, eq, ne, sql } from "drizzle-orm";
import { writeTx, writeTxThen, type InSameTx, type Reader, type Tx } from "@/db/client";
import { concerns, estimateLines, statusEvents, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { boxRootId, isApprovedState, reviseLine } from "@/lib/estimate";
import { conflict, invalidInput, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { formatCents } from "@/lib/money";
import type { EditLineInput, NewLineInput } from "@/lib/validation/estimate-line";
import { recordAudit } from "./audit";
import { moveBudgetUse } from "./budget-use";
import { loadEstimateContext, toAccountSettings, toEstimateLine, type EstimateContext } from "./estimate-context";
import { planStops, settleTimeBoxes, type TimeBoxNoticeDue } from "./time-box-stops";

export function assertOpen(ctx: EstimateContext): void {
  if (ctx.wo.status === "released") throw conflict("work_order_closed", "This work order was released; open a new one for more work.");
}

async function checkConcern(tx: Tx, workOrderId: string, concernId: string | undefined) {
  if (!concernId) return;
  const [row] = await tx.select({ id: concerns.id }).from(concerns).where(and(eq(concerns.id, concernId), eq(concerns.workOrderId, workOrderId))).limit(1);
  if (!row) throw invalidInput([{ path: "concernId", message: "That concern is not on this work order." }]);
}

/** The columns a writer sets, from the form: only parts carry a core, only labour can be diagnosis. */
function lineFields(input: NewLineInput | EditLineInput) {
  return {
    kind: input.kind,
    description: input.description,
    partNumber: input.partNumber,
    quantityMilli: input.quantity,
    unitPriceCents: input.unitPrice,
    taxable: input.taxable,
    coreChargeCents: input.kind === "part" ? input.coreCharge : 0,
    isDiagnosis: input.kind === "labor" && input.isDiagnosis,
  };
}

/** The line and its work order's context, scoped; another account's line is not found. */
export async function loadLineContext(tx: Tx, user: SessionUser, lineId: string) {
  const ctx = await loadEstimateContext(tx, user, { lineId });
  const line = ctx.lines.find((l) => l.id === lineId)!;
  return { ctx, line };
}

export async function addLine(user: SessionUser, input: NewLineInput) {
  return writeTx(async (tx) => {
    const ctx = await loadEstimateContext(tx, user, input.workOrderId);
    assertOpen(ctx);
    await checkConcern(tx, ctx.wo.id, input.concernId);
    const position = Math.max(-1, ...ctx.lines.map((l) => l.position)) + 1;
    const [row] = await tx
      .insert(estimateLines)
      .values({
        workOrderId: ctx.wo.id,
        concernId: input.concernId ?? null,
        position,
        ...lineFields(input),
        state: "draft",
        createdBy: user.id,
      })
      .returning();
    await recordAudit(tx, user, { action: "line.added", entityType: "line", entityId: row!.id, accountId: ctx.wo.accountId, detail: { description: input.description } });
    return row!;
  });
}

export type EditOutcome = {
  line: typeof estimateLines.$inferSelect;
  outcome: string;
  reason: string | null;
  previousApprovedCents: number | null;
  workOrderId: string;
  accountId: string;
  woNumber: number;
  /** Notices that settling the running clocks made due, for the caller to queue in this transaction. */
  timeBoxNotices: TimeBoxNoticeDue[];
};

/**
 * Edits a line. Drafts and lines waiting on a decision change freely (the
 * version moves, so an approver looking at the old one is refused). An
 * approved line revised upward keeps its approval only inside the account's
 * overrun allowance; past it, the line goes back for a decision.
 */
export async function editLine(user: SessionUser, input: EditLineInput, notify?: InSameTx<EditOutcome>): Promise<EditOutcome> {
  return writeTxThen(async (tx) => {
    const { ctx, line } = await loadLineContext(tx, user, input.lineId);
    assertOpen(ctx);
    if (line.version !== input.expectedVersion) {
      throw conflict("stale_version", `This line changed since you loaded it (version ${input.expectedVersion}, now ${line.version}). Reload and edit again.`);
    }
    if (line.state === "declined" || line.state === "held") {
      throw conflict("line_decided", "Declined and held lines stay as the customer decided; bring them back on a later visit instead.");
    }
    const approved = isApprovedState(line.state);
    if (approved && input.kind !== line.kind) throw conflict("line_decided", "An approved line's kind cannot change; add a new line instead.");
    await checkConcern(tx, ctx.wo.id, input.concernId);

    const revised = reviseLine({
      line: toEstimateLine(line),
      quantityMilli: input.quantity,
      unitPriceCents: input.unitPrice,
      account: toAccountSettings(ctx.account),
    });
    if (!revised.ok) throw conflict(revised.code, revised.detail);
    const back = revised.outcome === "back_to_proposed";
    const at = nowIso();
    const [row] = await tx
      .update(estimateLines)
      .set({
        ...lineFields(input),
        concernId: input.concernId ?? null,
        version: line.version + 1,
        state: revised.line.state,
        approvedByUserId: revised.line.approvedByUserId,
        byStanding: revised.line.byStanding,
        approvedAmountCents: revised.line.approvedAmountCents,
        approvedAt: back ? null : line.approvedAt,
        reopenReason: back ? revised.reason?.detail ?? null : line.reopenReason,
        updatedAt: at,
      })
      .where(eq(estimateLines.id, line.id))
      .returning();
    // A line back for approval no longer counts toward the budget (an approval that holds keeps its amount and instant).
    await moveBudgetUse(tx, ctx.wo.accountId, [{ before: line, after: row! }]);
    if (back) {
      await tx.insert(statusEvents).values({
        workOrderId: ctx.wo.id,
        status: ctx.wo.status,
        note: `“${input.description}” is back for approval: now ${formatCents(revised.amountCents)}, ${revised.reason?.detail ?? ""}.`,
        byUserId: user.id,
        at,
      });
    }
    await tx.update(workOrders).set({ updatedAt: at }).where(eq(workOrders.id, ctx.wo.id));
    let timeBoxNotices: TimeBoxNoticeDue[] = [];
    if (line.isDiagnosis || row!.isDiagnosis) {
      // The box changed size: settle what already stopped, then re-plan the running clocks.
      timeBoxNotices = await settleTimeBoxes(tx, at);
      await planStops(tx, boxRootId(line), at);
    }
    await recordAudit(tx, user, {
      action: back ? "line.reopened" : "line.edited",
      entityType: "line",
      entityId: line.id,
      accountId: ctx.wo.accountId,
      detail: { from: { q: line.quantityMilli, p: line.unitPriceCents, state: line.state }, to: { q: input.quantity, p: input.unitPrice, state: revised.line.state }, outcome: revised.outcome },
    });
    return {
      line: row!,
      outcome: revised.outcome,
      reason: revised.reason?.detail ?? null,
      previousApprovedCents: line.approvedAmountCents,
      workOrderId: ctx.wo.id,
      accountId: ctx.wo.accountId,
      woNumber: ctx.wo.number,
      timeBoxNotices,
    };
  }, notify);
}

export async function deleteLine(user: SessionUser, lineId: string, expectedVersion: number) {
  return writeTx(async (tx) => {
    const { ctx, line } = await loadLineContext(tx, user, lineId);
    assertOpen(ctx);
    if (line.version !== expectedVersion) throw conflict("stale_version", "This line changed since you loaded it. Reload and try again.");
    if (line.state !== "draft" && line.state !== "proposed") {
      throw conflict("line_decided", "Only lines the customer has not decided can be removed.");
    }
    await tx.delete(estimateLines).where(eq(estimateLines.id, line.id));
    if (line.deferredFromLineId) {
      // The deferred line goes back on the unit's list.
      await tx.update(estimateLines).set({ broughtBackAt: null }).where(eq(estimateLines.id, line.deferredFromLineId));
    }
    await recordAudit(tx, user, { action: "line.removed", entityType: "line", entityId: line.id, accountId: ctx.wo.accountId, detail: { description: line.description } });
  });
}

/** Moves a line one place up or down in the estimate. */
export async function moveLine(user: SessionUser, lineId: string, direction: "up" | "down") {
  return writeTx(async (tx) => {
    const { ctx, line } = await loadLineContext(tx, user, lineId);
    assertOpen(ctx);
    const ordered = ctx.lines;
    const index = ordered.findIndex((l) => l.id === line.id);
    const to = direction === "up" ? index - 1 : index + 1;
    const other = ordered[to];
    if (!other) return;
    // Renumber everything so equal positions from older rows cannot stick.
    const next = [...ordered];
    next[index] = other;
    next[direction === "up" ? index - 1 : index + 1] = line;
    for (const [i, l] of next.entries()) {
      if (l.position !== i) await tx.update(estimateLines).set({ position: i }).where(eq(estimateLines.id, l.id));
    }
    await recordAudit(tx, user, { action: "line.moved", entityType: "line", entityId: line.id, accountId: ctx.wo.accountId, detail: { direction, from: index + 1, to: to + 1 } });
  });
}

/**
 * A held or declined line no later visit has brought back. A literal, the partial index's own
 * condition (estimate_lines_deferred_idx): a bound parameter would keep the planner off it, and it
 * would walk every held line the shop ever wrote.
 */
export const isDeferredLine = sql`${estimateLines.state} in ('held', 'declined') and ${estimateLines.broughtBackAt} is null`;

/** Held and declined lines of the unit's earlier visits that no later visit has brought back. */
export async function deferredLinesForUnit(tx: Reader, unitId: string, exceptWorkOrderId: string) {
  return tx
    .select()
    .from(estimateLines)
    .innerJoin(workOrders, eq(workOrders.id, estimateLines.workOrderId))
    .where(
      and(
        eq(workOrders.unitId, unitId),
        ne(workOrders.id, exceptWorkOrderId),
        isDeferredLine,
      ),
    )
    .orderBy(sql`${estimateLines.updatedAt} desc`);
}

/**
 * Copies deferred lines of the unit's earlier visits into this work order as
 * drafts, inside the caller's transaction, and marks them brought back. Used
 * by the estimate editor and by check-in. Throws 404 if any id is not on offer.
 */
export async function copyDeferredLines(tx: Tx, user: SessionUser, wo: { id: string; unitId: string; accountId: string }, lineIds: string[], firstPosition: number) {
  if (lineIds.length === 0) return 0;
  const available = await deferredLinesForUnit(tx, wo.unitId, wo.id);
  const picked = available.filter((r) => lineIds.includes(r.estimate_lines.id));
  if (picked.length !== new Set(lineIds).size) throw notFound("One of those deferred lines");
  let position = firstPosition;
  const at = nowIso();
  for (const { estimate_lines: old } of picked) {
    await tx.insert(estimateLines).values({
      workOrderId: wo.id,
      position: position++,
      kind: old.kind,
      description: old.description,
      partNumber: old.partNumber,
      quantityMilli: old.quantityMilli,
      unitPriceCents: old.unitPriceCents,
      taxable: old.taxable,
      coreChargeCents: old.coreChargeCents,
      isDiagnosis: old.isDiagnosis,
      laborRateId: old.laborRateId,
      state: "draft",
      deferredFromLineId: old.id,
      createdBy: user.id,
    });
    await tx.update(estimateLines).set({ broughtBackAt: at }).where(eq(estimateLines.id, old.id));
  }
  await recordAudit(tx, user, { action: "line.brought_back", entityType: "work_order", entityId: wo.id, accountId: wo.accountId, detail: { lineIds } });
  return picked.length;
}

/** The estimate editor's "bring back": deferred lines onto this open work order, after its own lines. */
export async function bringBackDeferred(user: SessionUser, workOrderId: string, lineIds: string[]) {
  return writeTx(async (tx) => {
    const ctx = await loadEstimateContext(tx, user, workOrderId);
    assertOpen(ctx);
    return copyDeferredLines(tx, user, ctx.wo, lineIds, Math.max(-1, ...ctx.lines.map((l) => l.position)) + 1);
  });
}

/** The technician's progress on approved work: started, then done. */
export async function setLineProgress(user: SessionUser, lineId: string, state: "in_progress" | "done") {
  return writeTx(async (tx) => {
    const { ctx, line } = await loadLineContext(tx, user, lineId);
    assertOpen(ctx);
    if (!isApprovedState(line.state)) throw conflict("not_approved", "Only approved work can be started or finished.");
    if (line.state === state) return line;
    const [row] = await tx
      .update(estimateLines)
      .set({ state, version: line.version + 1, updatedAt: nowIso() })
      .where(eq(estimateLines.id, line.id))
      .returning();
    await recordAudit(tx, user, { action: `line.${state}`, entityType: "line", entityId: line.id, accountId: ctx.wo.accountId });
    return row!;
  });
}
