import { and, eq } from "drizzle-orm";
import { writeTxThen, type InSameTx, type Tx } from "@/db/client";
import { decisions, estimateLines, serviceRequests, statusEvents, workOrders } from "@/db/schema";
import { CAN, hasRole } from "@/lib/auth/policy";
import type { SessionUser } from "@/lib/auth/session-user";
import { STATUS_LABELS, workOrderLabel } from "@/lib/domain";
import { formatDate } from "@/lib/format";
import { conflict, forbidden, invalidInput, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { formatCents, lineAmountCents } from "@/lib/money";
import type { StatusMoveInput } from "@/lib/validation/status";
import { workOrderOut } from "@/lib/records/work-order";
import { recordAudit } from "./audit";
import { settleNothingToBill } from "./billing-state";
import { findWorkOrder } from "./work-order-detail";

/**
 * Moves a visit to a status with an optional note, and writes the dated
 * timeline entry in the same transaction. Any open status may follow any other
 * (work goes back to Repairing after a failed final check); Released is final.
 * The same status again is allowed only with a note: an update for the customer.
 */
export async function moveStatus(user: SessionUser, workOrderId: string, move: StatusMoveInput, notify?: InSameTx<{ workOrder: { id: string }; becameReady: boolean; fixedRequestIds: string[] }>) {
  return writeTxThen(async (tx) => {
    const wo = await findWorkOrder(user, workOrderId, tx);
    if (!wo) throw notFound("That work order");
    const label = workOrderLabel(wo.number);
    if (wo.status === "released") {
      throw conflict(
        "work_order_closed",
        `${label} was released${wo.releasedAt ? ` on ${formatDate(wo.releasedAt)}` : ""}; a closed visit cannot be moved. Open a new work order for a new visit.`,
      );
    }
    if (move.status === wo.status && !move.note) {
      throw invalidInput(
        [{ path: "note", message: `${wo.unitNumber} is already ${STATUS_LABELS[wo.status]}: add a note to post an update.` }],
        "Nothing would change.",
      );
    }
    const at = nowIso();
    const released = move.status === "released";
    if (released) await settleWaitingLines(tx, user, wo, move, at);
    await tx
      .update(workOrders)
      .set({ status: move.status, updatedAt: at, ...(released ? { releasedAt: at } : {}) })
      .where(eq(workOrders.id, wo.id));
    // A visit released with no approved work has nothing to invoice, ever.
    if (released) await settleNothingToBill(tx, wo.id);
    const [event] = await tx
      .insert(statusEvents)
      .values({ workOrderId: wo.id, status: move.status, note: move.note, byUserId: user.id, at })
      .returning({ id: statusEvents.id, status: statusEvents.status, note: statusEvents.note, at: statusEvents.at });
    if (!event) throw new Error("status event insert returned nothing");
    // A driver's defect report on this visit reads "fixed" once the unit is ready (or released).
    const fixed =
      move.status === "ready" || released
        ? await tx
            .update(serviceRequests)
            .set({ status: "closed", closedAt: at, updatedAt: at })
            .where(and(eq(serviceRequests.workOrderId, wo.id), eq(serviceRequests.status, "scheduled")))
            .returning({ id: serviceRequests.id })
        : [];
    await recordAudit(tx, user, {
      action: "work_order.status",
      entityType: "work_order",
      entityId: wo.id,
      accountId: wo.accountId,
      detail: { from: wo.status, to: move.status, note: move.note },
    });
    return {
      workOrder: {
        ...workOrderOut({ ...wo, status: move.status, updatedAt: at }),
        releasedAt: released ? at : wo.releasedAt,
        lastNote: move.note,
        event: { ...event, by: user.name },
      },
      becameReady: move.status === "ready" && wo.status !== "ready",
      fixedRequestIds: fixed.map((r) => r.id),
    };
  }, notify);
}

type Visit = NonNullable<Awaited<ReturnType<typeof findWorkOrder>>>;

/**
 * A visit is not released with lines still waiting for the customer: the
 * writer says what becomes of them (held for the unit's next visit, or
 * declined with a note), and that is recorded in the release's own
 * transaction, each line with its decision row, so nothing is left pending on
 * a closed visit.
 */
async function settleWaitingLines(tx: Tx, user: SessionUser, wo: Visit, move: StatusMoveInput, at: string): Promise<void> {
  const waiting = await tx
    .select({ id: estimateLines.id, description: estimateLines.description, version: estimateLines.version, quantityMilli: estimateLines.quantityMilli, unitPriceCents: estimateLines.unitPriceCents })
    .from(estimateLines)
    .where(and(eq(estimateLines.workOrderId, wo.id), eq(estimateLines.state, "proposed")))
    .orderBy(estimateLines.position);
  if (waiting.length === 0) return;
  const label = workOrderLabel(wo.number);
  const lines = waiting.map((l) => ({ id: l.id, description: l.description, amountCents: lineAmountCents(l.quantityMilli, l.unitPriceCents) }));
  if (!move.pendingLines) {
    const total = lines.reduce((sum, l) => sum + l.amountCents, 0);
    throw conflict(
      "lines_pending",
      `${lines.length} line${lines.length === 1 ? "" : "s"} on ${label} (${formatCents(total)}) still wait for the customer's decision. Hold them for ${wo.unitNumber}'s next visit, or decline them with a note, then release.`,
      { lines },
    );
  }
  if (!hasRole(user, CAN.writeEstimates)) {
    throw forbidden("Lines on this visit still wait for the customer. The owner or a service writer decides what becomes of them and releases it.");
  }
  const state = move.pendingLines === "hold" ? "held" : "declined";
  const note = move.pendingNote || (move.pendingLines === "hold" ? `Held for the next visit when ${label} was released.` : "");
  for (const [i, l] of waiting.entries()) {
    await tx.update(estimateLines).set({ state, version: l.version + 1, reopenReason: null, updatedAt: at }).where(eq(estimateLines.id, l.id));
    await tx.insert(decisions).values({
      lineId: l.id,
      workOrderId: wo.id,
      accountId: wo.accountId,
      decision: move.pendingLines,
      byUserId: user.id,
      byStanding: false,
      amountCents: lines[i]!.amountCents,
      lineVersion: l.version + 1,
      note,
      at,
    });
  }
  await recordAudit(tx, user, {
    action: `work_order.release_${state}`,
    entityType: "work_order",
    entityId: wo.id,
    accountId: wo.accountId,
    detail: { lineIds: lines.map((l) => l.id), note },
  });
}
