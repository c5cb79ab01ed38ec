import { and, desc, eq, ne } from "drizzle-orm";
import { getDb } from "@/db/client";
import { findings, units, workOrders } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { workOrderLabel } from "@/lib/domain";
import { scopedTo } from "./scope";
import { loadFindings, loadTimeline } from "./work-order-detail";

/** A work order's findings, Out of service first; null when the work order is not visible to this user. */
export async function findingsForWorkOrder(user: SessionUser, workOrderId: string) {
  const [wo] = await getDb()
    .select({ id: workOrders.id })
    .from(workOrders)
    .where(and(eq(workOrders.id, workOrderId), scopedTo(workOrders.accountId, user)))
    .limit(1);
  return wo ? loadFindings(wo.id) : null;
}

/** One finding with its photos and readings, scoped through its work order's account. */
export async function findFinding(user: SessionUser, findingId: string) {
  const [row] = await getDb()
    .select({ workOrderId: findings.workOrderId })
    .from(findings)
    .innerJoin(workOrders, eq(workOrders.id, findings.workOrderId))
    .where(and(eq(findings.id, findingId), scopedTo(workOrders.accountId, user)))
    .limit(1);
  if (!row) return null;
  const all = await loadFindings(row.workOrderId);
  const finding = all.find((f) => f.id === findingId);
  return finding ? { ...finding, workOrderId: row.workOrderId } : null;
}

/**
 * What a unit's page shows live: the visit in progress (status, the shop's
 * latest note, the dated timeline) and its findings. Null when the unit is
 * not visible to this user; `workOrder` null when the unit is not in the shop.
 */
export async function currentVisit(user: SessionUser, unitId: string) {
  const db = getDb();
  const [unit] = await db
    .select({ id: units.id })
    .from(units)
    .where(and(eq(units.id, unitId), scopedTo(units.accountId, user)))
    .limit(1);
  if (!unit) return null;
  const [wo] = await db
    .select({
      id: workOrders.id,
      number: workOrders.number,
      status: workOrders.status,
      title: workOrders.title,
      promisedAt: workOrders.promisedAt,
      updatedAt: workOrders.updatedAt,
    })
    .from(workOrders)
    .where(and(eq(workOrders.unitId, unit.id), ne(workOrders.status, "released")))
    .orderBy(desc(workOrders.openedAt))
    .limit(1);
  if (!wo) return { unitId: unit.id, workOrder: null, timeline: [], findings: [] };
  const [timeline, found] = await Promise.all([loadTimeline(wo.id), loadFindings(wo.id)]);
  const latestNote = timeline.find((e) => e.note.trim() !== "") ?? null;
  return {
    unitId: unit.id,
    workOrder: {
      ...wo,
      label: workOrderLabel(wo.number),
      lastNote: latestNote?.note ?? "",
      lastNoteAt: latestNote?.at ?? null,
    },
    timeline,
    findings: found,
  };
}

export type CurrentVisit = NonNullable<Awaited<ReturnType<typeof currentVisit>>>;
