import { and, eq, max } from "drizzle-orm";
import { writeTx, type Tx } from "@/db/client";
import { concerns, statusEvents, users, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { isShopRole } from "@/lib/domain";
import { formatDateTime } from "@/lib/format";
import { conflict, invalidInput, notFound } from "@/lib/http/problem";
import { nowIso } from "@/lib/ids";
import type { VisitPatchInput } from "@/lib/validation/visit";
import { recordAudit } from "./audit";
import { scopedTo } from "./scope";
import { findWorkOrder } from "./work-order-detail";

async function openWorkOrder(tx: Tx, user: SessionUser, id: string) {
  const wo = await findWorkOrder(user, id, tx);
  if (!wo) throw notFound("That work order");
  if (wo.status === "released") throw conflict("work_order_closed", "This visit was released; open a new work order for more work.");
  return wo;
}

async function personName(tx: Tx, id: string | null): Promise<string | null> {
  if (!id) return null;
  const [row] = await tx.select({ name: users.name }).from(users).where(eq(users.id, id)).limit(1);
  return row?.name ?? null;
}

/**
 * Reassigns the technician, moves the promised-by time or sets the PO number.
 * Each change is a dated timeline entry the fleet sees (the status stays as it
 * is), and an audit row with the old and new value.
 */
export async function updateVisit(user: SessionUser, workOrderId: string, patch: VisitPatchInput) {
  return writeTx(async (tx) => {
    const wo = await openWorkOrder(tx, user, workOrderId);
    const set: Partial<typeof workOrders.$inferInsert> = {};
    const notes: string[] = [];
    const changed: Record<string, { from: unknown; to: unknown }> = {};
    if (patch.assignedTechId !== undefined && patch.assignedTechId !== wo.assignedTechId) {
      let name: string | null = null;
      if (patch.assignedTechId) {
        const [tech] = await tx.select({ name: users.name, role: users.role, active: users.active }).from(users).where(eq(users.id, patch.assignedTechId)).limit(1);
        if (!tech || !tech.active || !isShopRole(tech.role)) throw invalidInput([{ path: "assignedTechId", message: "Choose someone on the shop's staff who still signs in." }]);
        name = tech.name;
      }
      const was = await personName(tx, wo.assignedTechId);
      set.assignedTechId = patch.assignedTechId;
      notes.push(name ? `${name} is now the technician${was ? ` (was ${was})` : ""}.` : `No technician assigned now${was ? ` (was ${was})` : ""}.`);
      changed.technician = { from: was, to: name };
    }
    if (patch.promisedAt !== undefined && patch.promisedAt !== wo.promisedAt) {
      set.promisedAt = patch.promisedAt;
      notes.push(
        patch.promisedAt
          ? `Promised by ${formatDateTime(patch.promisedAt)}${wo.promisedAt ? ` (was ${formatDateTime(wo.promisedAt)})` : ""}.`
          : "No promised-by time now.",
      );
      changed.promisedAt = { from: wo.promisedAt, to: patch.promisedAt };
    }
    if (patch.poNumber !== undefined && (patch.poNumber ?? null) !== wo.poNumber) {
      set.poNumber = patch.poNumber;
      notes.push(patch.poNumber ? `PO number ${patch.poNumber}${wo.poNumber ? ` (was ${wo.poNumber})` : ""}.` : "PO number removed.");
      changed.poNumber = { from: wo.poNumber, to: patch.poNumber };
    }
    if (notes.length === 0) return { changed: 0, workOrderId: wo.id };
    const at = nowIso();
    await tx.update(workOrders).set({ ...set, updatedAt: at }).where(eq(workOrders.id, wo.id));
    for (const note of notes) await tx.insert(statusEvents).values({ workOrderId: wo.id, status: wo.status, note, byUserId: user.id, at });
    await recordAudit(tx, user, { action: "work_order.edited", entityType: "work_order", entityId: wo.id, accountId: wo.accountId, detail: changed });
    return { changed: notes.length, workOrderId: wo.id };
  });
}

/** A concern found later on an open visit, at the end of its list; the fleet sees it on the timeline. */
export async function addConcern(user: SessionUser, workOrderId: string, complaint: string) {
  return writeTx(async (tx) => {
    const wo = await openWorkOrder(tx, user, workOrderId);
    const [last] = await tx.select({ n: max(concerns.position) }).from(concerns).where(eq(concerns.workOrderId, wo.id));
    const at = nowIso();
    const [row] = await tx
      .insert(concerns)
      .values({ unitId: wo.unitId, workOrderId: wo.id, position: (last?.n ?? -1) + 1, complaint, createdBy: user.id })
      .returning({ id: concerns.id, complaint: concerns.complaint, cause: concerns.cause, correction: concerns.correction, position: concerns.position });
    await tx.insert(statusEvents).values({ workOrderId: wo.id, status: wo.status, note: `Another concern: ${complaint}`, byUserId: user.id, at });
    await tx.update(workOrders).set({ updatedAt: at }).where(eq(workOrders.id, wo.id));
    await recordAudit(tx, user, { action: "concern.added", entityType: "work_order", entityId: wo.id, accountId: wo.accountId, detail: { complaint } });
    return row!;
  });
}

/**
 * Writes the cause and the correction of a concern (the trade's three Cs:
 * complaint, cause, correction). Allowed while its visit is open, or while an
 * intermittent concern stays open on the unit after its visit.
 */
export async function updateConcern(user: SessionUser, concernId: string, patch: { cause?: string; correction?: string }) {
  return writeTx(async (tx) => {
    const [c] = await tx
      .select({ id: concerns.id, cause: concerns.cause, correction: concerns.correction, intermittent: concerns.intermittent, closedAt: concerns.closedAt, workOrderId: concerns.workOrderId, status: workOrders.status, accountId: workOrders.accountId })
      .from(concerns)
      .innerJoin(workOrders, eq(workOrders.id, concerns.workOrderId))
      .where(and(eq(concerns.id, concernId), scopedTo(workOrders.accountId, user)))
      .limit(1);
    if (!c) throw notFound("That concern");
    if (c.status === "released" && !(c.intermittent && !c.closedAt)) throw conflict("work_order_closed", "This visit was released; its concerns are as they were invoiced.");
    const next = { cause: patch.cause ?? c.cause, correction: patch.correction ?? c.correction };
    const changed: Record<string, { from: unknown; to: unknown }> = {};
    if (next.cause !== c.cause) changed.cause = { from: c.cause, to: next.cause };
    if (next.correction !== c.correction) changed.correction = { from: c.correction, to: next.correction };
    if (Object.keys(changed).length) {
      const at = nowIso();
      await tx.update(concerns).set({ ...next, updatedAt: at }).where(eq(concerns.id, c.id));
      await tx.update(workOrders).set({ updatedAt: at }).where(eq(workOrders.id, c.workOrderId!));
      await recordAudit(tx, user, { action: "concern.written", entityType: "concern", entityId: c.id, accountId: c.accountId, detail: changed });
    }
    return { id: c.id, workOrderId: c.workOrderId, ...next, changed: Object.keys(changed).length };
  });
}
