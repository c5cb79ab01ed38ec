import { and, eq } from "drizzle-orm";
import { writeTx } from "@/db/client";
import { serviceRequests, statusEvents, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { STATUS_LABELS, workOrderLabel, type WorkOrderStatus } from "@/lib/domain";
import { formatDate } from "@/lib/format";
import { conflict, invalidInput, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import { recordAudit } from "./audit";
import { findWorkOrder } from "./work-order-detail";

/**
 * Moves a visit to a status with an optional note, and writes the dated
 * timeline entry in the same transaction. Any open status may follow any other
 * (work goes back to Repairing after a failed final check); Released is final.
 * The same status again is allowed only with a note: an update for the customer.
 */
export async function moveStatus(user: SessionUser, workOrderId: string, move: { status: WorkOrderStatus; note: string }) {
  return writeTx(async (tx) => {
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
    await tx
      .update(workOrders)
      .set({ status: move.status, updatedAt: at, ...(released ? { releasedAt: at } : {}) })
      .where(eq(workOrders.id, wo.id));
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
        id: wo.id,
        number: wo.number,
        unitId: wo.unitId,
        accountId: wo.accountId,
        status: move.status,
        title: wo.title,
        promisedAt: wo.promisedAt,
        releasedAt: released ? at : wo.releasedAt,
        updatedAt: at,
        lastNote: move.note,
        event: { ...event, by: user.name },
      },
      becameReady: move.status === "ready" && wo.status !== "ready",
      fixedRequestIds: fixed.map((r) => r.id),
    };
  });
}
